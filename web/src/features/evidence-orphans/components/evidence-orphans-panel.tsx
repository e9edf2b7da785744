import type { TOrphanFile } from '@shared/contracts/evidence-orphans';
import { Button } from '@web/components/button';
import { LocalTime } from '@web/components/local-time';
import { Panel } from '@web/components/panel';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { formatBytes } from '@web/lib/format-bytes';
import { FileCheck2, RefreshCw } from 'lucide-react';
import type { ReactNode } from 'react';
import { useEvidenceOrphans } from '../api/get-evidence-orphans';

function OrphanTable({ caption, files, hash }: { caption: ReactNode; files: TOrphanFile[]; hash?: boolean }) {
  return (
    <table className="mt-2 w-full text-left text-sm">
      <caption className="text-left font-bold">{caption}</caption>
      <thead className="text-ink-muted">
        <tr>
          <th className="py-1 pr-3 font-normal">File under the data folder</th>
          <th className="py-1 pr-3 text-right font-normal">Size</th>
          <th className="py-1 font-normal">Last changed</th>
        </tr>
      </thead>
      <tbody>
        {files.map((file) => (
          <tr key={file.path} className="border-t border-canvas-line">
            <td className="break-all py-1 pr-3 font-mono" title={hash ? 'Named by its SHA-256' : undefined}>
              {file.path}
            </td>
            <td className="py-1 pr-3 text-right tabular-nums">{formatBytes(file.sizeBytes)}</td>
            <td className="py-1">
              <LocalTime iso={file.modifiedAt} />
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/**
 * Files under DATA_DIR that no bundle accounts for. Listed only: whether such a file is still
 * needed is a person's decision, so nothing here deletes anything.
 */
export function EvidenceOrphansPanel() {
  const orphans = useEvidenceOrphans();
  const data = orphans.data;
  return (
    <Panel id="evidence-orphans-title" title="Originals without a record">
      <p className="text-sm text-ink-muted">
        Files the server keeps that no bundle or custody entry accounts for, e.g. left by an upload the server
        stopped in the middle of. Nothing is deleted here or by the server: decide with the case owner what to
        keep, and note it.
      </p>
      {orphans.isError ? (
        <ErrorState
          error={orphans.error}
          title="Could not check the evidence store"
          onRetry={() => orphans.refetch()}
        />
      ) : !data ? (
        <div aria-busy className="mt-3 space-y-2">
          <SkeletonBar className="w-full" />
          <SkeletonBar className="w-1/2" />
        </div>
      ) : (
        <div className="mt-3 space-y-4">
          {data.incoming.length === 0 && data.unrecorded.length === 0 ? (
            <EmptyState icon={FileCheck2} title="Every stored file is accounted for">
              No partial uploads and no originals without a record.
            </EmptyState>
          ) : (
            <>
              {data.unrecorded.length > 0 && (
                <OrphanTable
                  caption={`Stored originals no bundle names (${data.unrecorded.length})`}
                  files={data.unrecorded}
                  hash
                />
              )}
              {data.incoming.length > 0 && (
                <OrphanTable caption={`Unfinished uploads (${data.incoming.length})`} files={data.incoming} />
              )}
            </>
          )}
          <p className="flex items-center gap-3 text-sm text-ink-muted">
            <span>
              Checked <LocalTime iso={data.checkedAt} />
            </span>
            <Button size="sm" icon={RefreshCw} isBusy={orphans.isFetching} onClick={() => orphans.refetch()}>
              Check again
            </Button>
          </p>
        </div>
      )}
    </Panel>
  );
}
