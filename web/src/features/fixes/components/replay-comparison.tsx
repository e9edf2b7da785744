import type { TReplay } from '@shared/contracts/replays';
import { useReplayCauses } from '@web/components/replay-causes-query';
import { describeCauses, flagCountRows, formatDivergence, formatMetres } from '../lib/compare-replays';

function Metric({
  label,
  original,
  verification,
}: {
  label: string;
  original: string;
  verification: string;
}) {
  return (
    <tr className="border-t border-canvas-line">
      <th scope="row" className="py-1 pr-3 text-left font-normal text-ink-muted">
        {label}
      </th>
      <td className="py-1 pr-3 tabular-nums">{original}</td>
      <td className="py-1 tabular-nums">{verification}</td>
    </tr>
  );
}

/** The incident replay beside the verification replay: flags by kind, RMSE, divergence and causes. */
export function ReplayComparison({ original, verification }: { original?: TReplay; verification: TReplay }) {
  const rows = flagCountRows(original?.flags ?? [], verification.flags);
  const originalCauses = useReplayCauses(original?.id ?? '');
  const verificationCauses = useReplayCauses(verification.id);
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Original replay compared with the verification replay</caption>
      <thead className="text-left text-xs text-ink-muted uppercase">
        <tr>
          <th className="py-1">Measure</th>
          <th>
            <span className="inline-block size-2 rounded-full bg-series-replay align-middle" aria-hidden />{' '}
            Original
            {original ? ` (${original.label || 'replay'})` : ' (none finished)'}
          </th>
          <th>Verification ({verification.label || 'replay'})</th>
        </tr>
      </thead>
      <tbody>
        <Metric
          label="RMSE against reference"
          original={formatMetres(original?.metrics?.rmse_reference)}
          verification={formatMetres(verification.metrics?.rmse_reference)}
        />
        <Metric
          label="RMSE against onboard estimate"
          original={formatMetres(original?.metrics?.rmse_onboard)}
          verification={formatMetres(verification.metrics?.rmse_onboard)}
        />
        <Metric
          label="Diverged from reference at"
          original={original ? formatDivergence(original.metrics?.diverged_at) : '—'}
          verification={formatDivergence(verification.metrics?.diverged_at)}
        />
        <Metric
          label="Flags, all kinds"
          original={original ? String(original.flags.length) : '—'}
          verification={String(verification.flags.length)}
        />
        {rows.map((row) => (
          <Metric
            key={row.kind}
            label={`Flags: ${row.kind.replaceAll('_', ' ')}`}
            original={original ? String(row.original) : '—'}
            verification={String(row.verification)}
          />
        ))}
        <Metric
          label="Probable causes"
          original={original ? describeCauses(originalCauses.data) : '—'}
          verification={describeCauses(verificationCauses.data)}
        />
      </tbody>
    </table>
  );
}
