import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@web/components/button';
import { LocalTime } from '@web/components/local-time';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { apiPaths } from '@web/config/paths';
import { Download } from 'lucide-react';
import { caseArchivesQueryOptions, useCaseArchives } from '../api/get-case-archives';
import { VerifyArchiveForm } from './verify-archive-form';

/**
 * Evidence archive for legal: export (a plain download of the streamed zip, so the browser keeps
 * memory flat) and the custody list of past exports with each archive's SHA-256.
 */
export function CaseArchivesPanel({ caseId }: { caseId: string }) {
  const exports = useCaseArchives(caseId);
  const queryClient = useQueryClient();
  // The custody entry is written when the last byte leaves; refresh the list a little later.
  const refreshSoon = () =>
    setTimeout(
      () => queryClient.invalidateQueries({ queryKey: caseArchivesQueryOptions(caseId).queryKey }),
      3000,
    );
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <a
          href={apiPaths.caseArchive(caseId)}
          download
          onClick={refreshSoon}
          className="inline-flex items-center gap-2 rounded-md bg-accent px-4 py-2 text-sm font-bold text-white hover:opacity-90 focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
        >
          <Download aria-hidden className="size-4" />
          Export evidence archive
        </a>
        <p className="text-sm text-ink-muted">
          A .zip with every original, replay, signed finding, the audit trail and a printable report.
        </p>
      </div>
      <h3 className="text-xs font-bold uppercase tracking-wide text-ink-muted">Past exports</h3>
      {exports.isError ? (
        <ErrorState
          error={exports.error}
          title="Could not load past exports"
          onRetry={() => exports.refetch()}
        />
      ) : !exports.data ? (
        <SkeletonBar className="w-64" />
      ) : exports.data.items.length === 0 ? (
        <p className="text-sm text-ink-muted">Not exported yet.</p>
      ) : (
        <table className="w-full text-sm">
          <thead>
            <tr className="text-left text-xs text-ink-muted">
              <th className="py-1 pr-3 font-bold">When</th>
              <th className="py-1 pr-3 font-bold">Who</th>
              <th className="py-1 font-bold">Archive SHA-256</th>
            </tr>
          </thead>
          <tbody>
            {exports.data.items.map((item) => (
              <tr key={item.auditEntry} className="border-t border-canvas-line">
                <td className="py-1 pr-3">
                  <LocalTime iso={item.exportedAt} />
                </td>
                <td className="py-1 pr-3">{item.exportedBy}</td>
                <td className="py-1 font-mono text-xs break-all">{item.sha256}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <VerifyArchiveForm />
      <Button variant="secondary" size="sm" onClick={() => exports.refetch()}>
        Refresh exports
      </Button>
    </div>
  );
}
