import type { TAuditEntry } from '@shared/contracts/audit';
import { AUDIT_ACTION_LABELS, labelFor } from '@shared/human-labels';
import { ROLE_LABELS, type Role } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { LocalTime } from '@web/components/local-time';
import { Pagination } from '@web/components/pagination';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { Link2, ScrollText, ShieldCheck } from 'lucide-react';
import { useState } from 'react';
import { useCaseAudit } from '../api/get-case-audit';
import { useVerifyCaseAudit } from '../api/verify-case-audit';

function ChainCheck({ caseId }: { caseId: string }) {
  const verify = useVerifyCaseAudit(caseId);
  const result = verify.data;
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button icon={Link2} onClick={() => verify.mutate()} isBusy={verify.isPending}>
        Verify chain
      </Button>
      <div aria-live="polite" className="text-sm">
        {result?.ok && (
          <span className="inline-flex items-center gap-1 font-bold text-state-ok">
            <ShieldCheck aria-hidden className="size-4" /> Chain intact: {result.entries} entries verified
          </span>
        )}
        {result && !result.ok && (
          <Alert title="Chain broken">
            First broken link at entry {result.firstBroken?.chainSeq}
            {result.firstBroken?.id !== undefined && ` (id ${result.firstBroken.id})`}:{' '}
            {result.firstBroken?.reason}
          </Alert>
        )}
        {verify.isError && <Alert>{verify.error.message}</Alert>}
      </div>
    </div>
  );
}

function EntryRow({ entry }: { entry: TAuditEntry }) {
  const role =
    entry.actorRole && entry.actorRole in ROLE_LABELS
      ? ROLE_LABELS[entry.actorRole as Role]
      : entry.actorRole;
  return (
    <tr className="border-t border-canvas-line align-top">
      <td className="py-2 pr-3 tabular-nums">{entry.chainSeq}</td>
      <td className="py-2 pr-3">
        <LocalTime iso={entry.at} withSeconds className="text-xs" />
      </td>
      <td className="py-2 pr-3 break-all">{entry.actorEmail ?? 'system'}</td>
      <td className="py-2 pr-3">{role ?? '—'}</td>
      <td className="py-2 pr-3">
        <span title={`Recorded as ${entry.action}`} data-action={entry.action}>
          {labelFor(AUDIT_ACTION_LABELS, entry.action)}
        </span>
      </td>
      <td className="py-2 pr-3 text-xs">
        {entry.targetType.replaceAll('_', ' ')}{' '}
        {entry.targetId && (
          <code title={entry.targetId}>
            {entry.targetId.length > 12 ? `${entry.targetId.slice(0, 8)}…` : entry.targetId}
          </code>
        )}
      </td>
      <td className="py-2">
        <code className="text-xs" title={`SHA-256 of the payload: ${entry.payloadSha256}`}>
          {entry.payloadSha256.slice(0, 12)}…
        </code>
      </td>
    </tr>
  );
}

/** Every recorded write on the case in chain order, and an on-demand check of the hash chain. */
export function AuditTrailView({ caseId }: { caseId: string }) {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(50);
  const audit = useCaseAudit(caseId, page, pageSize);
  return (
    <div className="space-y-4 rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm">
      <ChainCheck caseId={caseId} />
      {audit.isError ? (
        <ErrorState
          error={audit.error}
          title="Could not load the audit trail"
          onRetry={() => audit.refetch()}
        />
      ) : !audit.data ? (
        <SkeletonBar className="w-96" />
      ) : audit.data.total === 0 ? (
        <EmptyState icon={ScrollText} title="No entries yet" />
      ) : (
        <>
          <table className="w-full table-fixed text-sm">
            <caption className="sr-only">Audit trail entries, oldest first</caption>
            <thead className="text-left text-xs text-ink-muted uppercase">
              <tr>
                <th className="w-12 py-1">#</th>
                <th className="w-52">Time</th>
                <th className="w-52">Actor</th>
                <th className="w-28">Role</th>
                <th className="w-48">Action</th>
                <th>Target</th>
                <th className="w-28">Payload hash</th>
              </tr>
            </thead>
            <tbody>
              {audit.data.items.map((entry) => (
                <EntryRow key={entry.id} entry={entry} />
              ))}
            </tbody>
          </table>
          <Pagination
            page={page}
            pageSize={pageSize}
            total={audit.data.total}
            itemLabel="entries"
            onPageChange={setPage}
            onPageSizeChange={(size) => {
              setPageSize(size);
              setPage(1);
            }}
          />
        </>
      )}
    </div>
  );
}
