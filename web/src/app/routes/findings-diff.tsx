import { FindingsDiffView } from '@web/features/findings/components/findings-diff-view';
import { useParams, useSearchParams } from 'react-router-dom';
import { CaseWorkHeader } from './case-work-header';

/** Compare two versions; the pair lives in the address so a comparison can be linked. */
export function FindingsDiffRoute() {
  const { caseId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const from = Number(search.get('from') ?? 0);
  const to = Number(search.get('to') ?? 0);
  return (
    <>
      <CaseWorkHeader caseId={caseId} title="Changes between findings versions" />
      <div className="rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm">
        <FindingsDiffView
          caseId={caseId}
          from={from}
          to={to}
          onChange={(f, t) => setSearch({ from: String(f), to: String(t) }, { replace: true })}
        />
      </div>
    </>
  );
}
