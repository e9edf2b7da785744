import type { TAuditEntry } from '@shared/contracts/audit';
import { ROLE_LABELS, type Role } from '@shared/roles';
import { LocalTime } from '@web/components/local-time';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { History } from 'lucide-react';
import { useCaseHistory } from '../api/get-case-history';
import { describeAuditEntry, foldRepeatedSaves } from '../lib/describe-audit-entry';

const roleLabel = (role: string | null) => (role && role in ROLE_LABELS ? ROLE_LABELS[role as Role] : role);

function HistoryItem({ entry, repeats }: { entry: TAuditEntry; repeats: number }) {
  const comment = typeof entry.details.comment === 'string' ? entry.details.comment : null;
  return (
    <li className="relative pb-3 pl-5 before:absolute before:top-1.5 before:left-0 before:size-2 before:rounded-full before:bg-accent after:absolute after:top-4 after:bottom-0 after:left-[3px] after:w-px after:bg-canvas-line last:after:hidden">
      <p className="text-sm text-ink">
        {describeAuditEntry(entry)}
        {repeats > 1 && <span className="text-ink-muted"> ({repeats} times)</span>}
      </p>
      {comment && <p className="mt-0.5 text-sm whitespace-pre-line text-ink-muted italic">“{comment}”</p>}
      <p className="text-xs text-ink-muted">
        <LocalTime iso={entry.at} /> · {entry.actorEmail ?? 'system'}
        {entry.actorRole && ` (${roleLabel(entry.actorRole)})`}
      </p>
    </li>
  );
}

/** The case's story from its audit trail, newest last as it happened. */
export function CaseHistory({ caseId }: { caseId: string }) {
  const history = useCaseHistory(caseId, true);
  if (history.isError)
    return (
      <ErrorState
        error={history.error}
        title="Could not load the history"
        onRetry={() => history.refetch()}
      />
    );
  if (!history.data)
    return (
      <div aria-busy className="space-y-2">
        <SkeletonBar className="w-64" />
        <SkeletonBar className="w-48" />
      </div>
    );
  const items = foldRepeatedSaves(history.data.items);
  if (items.length === 0) return <EmptyState icon={History} title="No recorded steps yet" />;
  return (
    <ol aria-label="Case history" className="max-h-96 overflow-y-auto pr-2">
      {items.map(({ entry, repeats }) => (
        <HistoryItem key={entry.id} entry={entry} repeats={repeats} />
      ))}
    </ol>
  );
}
