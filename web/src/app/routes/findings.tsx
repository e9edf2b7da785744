import { ErrorState, SkeletonBar } from '@web/components/states';
import { useMe } from '@web/features/auth/api/get-me';
import { useFindings } from '@web/features/findings/api/get-findings';
import { FindingsEditor } from '@web/features/findings/components/findings-editor';
import { FindingsVersionsList } from '@web/features/findings/components/findings-versions-list';
import { useParams } from 'react-router-dom';
import { CaseWorkHeader } from './case-work-header';

const PANEL = 'rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm';

/** Findings: the investigator's editor, and the versions every role can read and review. */
export function FindingsRoute() {
  const { caseId = '' } = useParams();
  const role = useMe().data?.user.role;
  const findings = useFindings(caseId);
  return (
    <>
      <CaseWorkHeader caseId={caseId} title="Findings" />
      <div className="space-y-5">
        <section aria-labelledby="findings-versions" className={PANEL}>
          <h2 id="findings-versions" className="mb-2 text-base font-bold">
            Versions
          </h2>
          <FindingsVersionsList caseId={caseId} />
        </section>
        {role === 'investigator' && (
          <section aria-labelledby="findings-draft" className={`${PANEL} pb-0`}>
            <h2 id="findings-draft" className="mb-3 text-base font-bold">
              Draft
            </h2>
            {findings.isError ? (
              <ErrorState
                error={findings.error}
                title="Could not load the findings"
                onRetry={() => findings.refetch()}
              />
            ) : findings.data ? (
              // Not keyed by the draft's save time: saving would remount the form in the middle of a submit.
              <FindingsEditor caseId={caseId} findings={findings.data} />
            ) : (
              <SkeletonBar className="w-64" />
            )}
          </section>
        )}
      </div>
    </>
  );
}
