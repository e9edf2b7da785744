import type { TReplay } from '@shared/contracts/replays';
import { flagCountsByKind, settingsDifferences } from '../lib/compare-replays';

const metres = (value: number | null | undefined) =>
  value === null || value === undefined ? '–' : `${value.toFixed(3)} m`;
const seconds = (value: number | null | undefined) =>
  value === null || value === undefined ? 'never' : `${value.toFixed(1)} s`;

/** What differs between two replays: their settings and their outcome. */
export function ComparisonTable({ left, right }: { left: TReplay; right: TReplay }) {
  const differences = settingsDifferences(left, right);
  const leftFlags = flagCountsByKind(left);
  const rightFlags = flagCountsByKind(right);
  const kinds = [...new Set([...Object.keys(leftFlags), ...Object.keys(rightFlags)])].sort();
  const outcome = [
    {
      name: 'RMSE against reference',
      left: metres(left.metrics?.rmse_reference),
      right: metres(right.metrics?.rmse_reference),
    },
    {
      name: 'RMSE against onboard',
      left: metres(left.metrics?.rmse_onboard),
      right: metres(right.metrics?.rmse_onboard),
    },
    {
      name: 'Belief diverged at',
      left: seconds(left.metrics?.diverged_at),
      right: seconds(right.metrics?.diverged_at),
    },
    { name: 'Flags (all kinds)', left: String(left.flags.length), right: String(right.flags.length) },
    ...kinds.map((kind) => ({
      name: `Flags: ${kind.replaceAll('_', ' ')}`,
      left: String(leftFlags[kind] ?? 0),
      right: String(rightFlags[kind] ?? 0),
    })),
  ];
  const row = (item: { name: string; left: string; right: string }) => (
    <tr key={item.name} className="border-t border-canvas-line">
      <th scope="row" className="py-1 pr-3 font-normal">
        {item.name}
      </th>
      <td className={`py-1 pr-3 tabular-nums ${item.left !== item.right ? 'font-bold' : ''}`}>{item.left}</td>
      <td className={`py-1 tabular-nums ${item.left !== item.right ? 'font-bold' : ''}`}>{item.right}</td>
    </tr>
  );
  return (
    <table className="w-full text-left text-sm" data-testid="comparison-table">
      <thead className="text-xs text-ink-muted uppercase">
        <tr>
          <th className="py-1 pr-3">&nbsp;</th>
          <th className="py-1 pr-3">{left.label || 'Left replay'}</th>
          <th className="py-1">{right.label || 'Right replay'}</th>
        </tr>
      </thead>
      <tbody>
        <tr>
          <th colSpan={3} className="pt-2 text-xs font-bold text-ink-muted uppercase">
            Outcome
          </th>
        </tr>
        {outcome.map(row)}
        <tr>
          <th colSpan={3} className="pt-3 text-xs font-bold text-ink-muted uppercase">
            Settings that differ
          </th>
        </tr>
        {differences.length === 0 ? (
          <tr>
            <td colSpan={3} className="py-1 text-ink-muted italic">
              The two replays used the same settings.
            </td>
          </tr>
        ) : (
          differences.map(row)
        )}
      </tbody>
    </table>
  );
}
