import type { TBundleRecord } from '@shared/contracts/bundles';
import { LocalTime } from '@web/components/local-time';
import { formatBytes } from '@web/lib/format-bytes';
import type { ReactNode } from 'react';
import { BundleStatusBadge } from './bundle-status-badge';
import { CopyButton } from './copy-button';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-bold tracking-wide text-ink-muted uppercase">{label}</dt>
      <dd className="mt-0.5 text-sm tabular-nums">{children}</dd>
    </div>
  );
}

/** What a stored bundle holds: duration, sensors, rows, time span and the SHA-256 of every file. */
export function BundleOverview({ bundle, actions }: { bundle: TBundleRecord; actions?: ReactNode }) {
  const summary = bundle.summary;
  return (
    <div className="space-y-4" data-testid="bundle-overview">
      <div className="flex flex-wrap items-center gap-3">
        <BundleStatusBadge status={bundle.status} />
        <span className="font-bold">{bundle.originalName}</span>
        <span className="text-sm text-ink-muted">
          {formatBytes(bundle.sizeBytes)} · uploaded by {bundle.uploadedBy.name},{' '}
          <LocalTime iso={bundle.uploadedAt} />
        </span>
        {actions && <span className="ml-auto">{actions}</span>}
      </div>
      <p className="flex items-center gap-1 font-mono text-xs break-all">
        SHA-256 {bundle.sha256}
        <CopyButton value={bundle.sha256} label="SHA-256 of the bundle" />
      </p>
      {summary && (
        <dl className="grid grid-cols-4 gap-4">
          <Fact label="Duration">
            {summary.durationSeconds.toFixed(1)} <span className="text-ink-muted">s</span>
          </Fact>
          <Fact label="Time span">
            {summary.timeSpan ? (
              <>
                {summary.timeSpan.start.toFixed(2)}–{summary.timeSpan.end.toFixed(2)}{' '}
                <span className="text-ink-muted">s</span>
              </>
            ) : (
              '–'
            )}
          </Fact>
          <Fact label="Sensors">
            {summary.sensors.map((s) => s.replaceAll('_', ' ')).join(', ') || 'none'}
          </Fact>
          <Fact label="Robot / site">
            {summary.robotId} · {summary.site}
          </Fact>
        </dl>
      )}
      <table className="w-full text-left text-sm">
        <caption className="text-left text-xs font-bold tracking-wide text-ink-muted uppercase">
          Files
        </caption>
        <thead className="text-xs text-ink-muted">
          <tr>
            <th className="py-1 pr-2">File</th>
            <th className="py-1 pr-2 text-right">Rows</th>
            <th className="py-1 pr-2 text-right">Size</th>
            <th className="py-1">SHA-256</th>
          </tr>
        </thead>
        <tbody>
          {bundle.files.map((file) => {
            const stem = file.name.replace(/\.(csv|ndjson|json)$/, '');
            return (
              <tr key={file.name} className="border-t border-canvas-line">
                <td className="py-1 pr-2 font-mono text-xs">{file.name}</td>
                <td className="py-1 pr-2 text-right tabular-nums">
                  {summary?.rows[stem] ?? summary?.rows[file.name] ?? '–'}
                </td>
                <td className="py-1 pr-2 text-right tabular-nums">{formatBytes(file.size)}</td>
                <td className="py-1 font-mono text-xs">
                  <span title={file.sha256}>{file.sha256.slice(0, 16)}…</span>
                  <CopyButton value={file.sha256} label={`SHA-256 of ${file.name}`} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {summary && Object.keys(summary.eventCounts).length > 0 && (
        <p className="text-sm">
          <span className="font-bold">Events: </span>
          {Object.entries(summary.eventCounts)
            .map(([kind, count]) => `${kind.replaceAll('_', ' ')} ${count}`)
            .join(' · ')}
        </p>
      )}
    </div>
  );
}
