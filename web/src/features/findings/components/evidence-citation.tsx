import type { TEvidenceItem } from '@shared/contracts/findings';
import {
  EMPTY_EVIDENCE_NAMES,
  EVIDENCE_TYPE_LABELS,
  type EvidenceTarget,
  nameEvidence,
} from '@shared/evidence-names';
import { apiPaths, paths } from '@web/config/paths';
import { Link } from 'react-router-dom';
import { useEvidenceNames } from '../api/get-evidence-names';

function targetHref(caseId: string, target: EvidenceTarget): string {
  if (target.isQuery) return paths.bundleSqlConsole.href(caseId, target.bundleId);
  return paths.workspace.href(target.bundleId, target.replayId, target.t);
}

/**
 * A cited item by name (bookmark note and time, replay label, query title, file name), opening
 * what it cites, with the hash the citation stores so a reader can check it against the evidence.
 */
export function EvidenceCitation({ caseId, item }: { caseId: string; item: TEvidenceItem }) {
  const names = useEvidenceNames(caseId);
  const typeLabel = EVIDENCE_TYPE_LABELS[item.type];
  if (names.isPending)
    return (
      <p className="text-sm text-ink-muted" aria-busy="true">
        <span className="font-bold text-ink">{typeLabel}</span> (looking up its name…)
      </p>
    );
  // Without the names (the lookup failed) the citation still shows its id and hash.
  const named = nameEvidence(item, names.data ?? EMPTY_EVIDENCE_NAMES);
  return (
    <div className="min-w-0 text-sm" data-testid="evidence-citation">
      <p>
        <span className="font-bold">{typeLabel}</span>{' '}
        {named.target ? (
          <Link className="text-accent hover:underline" to={targetHref(caseId, named.target)}>
            {named.name}
          </Link>
        ) : named.picture ? (
          <a
            className="text-accent hover:underline"
            href={apiPaths.figureFile(named.picture.figureId)}
            target="_blank"
            rel="noreferrer"
          >
            {named.name}
          </a>
        ) : (
          <span>{named.name}</span>
        )}
      </p>
      {names.isError ? (
        <p className="text-xs text-state-bad">
          The case's evidence names could not be loaded; try again later.
        </p>
      ) : (
        <p className={`text-xs ${named.isFound ? 'text-ink-muted' : 'text-state-bad'}`}>{named.detail}</p>
      )}
      {named.picture && (
        // Shown through <img>, so even an SVG figure cannot run anything here.
        <img
          src={apiPaths.figureFile(named.picture.figureId)}
          alt={`Figure: ${named.name}`}
          data-testid="figure-thumbnail"
          className="mt-1 max-h-40 max-w-full rounded border border-canvas-line bg-white"
        />
      )}
      {named.hash && (
        <p className="text-xs text-ink-muted">
          {named.hash.label} <code className="break-all">{named.hash.value}</code>
        </p>
      )}
    </div>
  );
}
