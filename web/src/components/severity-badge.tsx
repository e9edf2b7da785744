import type { TSeverity } from '@shared/contracts/cases';
import { classNames } from '../lib/class-names';

export const SEVERITY_LABELS: Record<TSeverity, string> = {
  low: 'Low',
  medium: 'Medium',
  high: 'High',
  critical: 'Critical',
};

const LEVEL: Record<TSeverity, number> = { low: 1, medium: 2, high: 3, critical: 4 };

// Severity is shown as a word plus a four-step bar gauge, so it never relies on colour alone.
export function SeverityBadge({ severity }: { severity: TSeverity }) {
  const level = LEVEL[severity];
  return (
    <span className="inline-flex items-center gap-1.5 whitespace-nowrap text-sm">
      <span aria-hidden className="inline-flex h-3.5 items-end gap-px">
        {[1, 2, 3, 4].map((step) => (
          <span
            key={step}
            style={{ height: `${step * 25}%` }}
            className={classNames(
              'w-1 rounded-sm',
              step > level ? 'bg-canvas-line' : level >= 3 ? 'bg-state-bad' : 'bg-ink-muted',
            )}
          />
        ))}
      </span>
      <span className={classNames(level >= 3 && 'font-bold', level === 4 && 'text-state-bad')}>
        {SEVERITY_LABELS[severity]}
      </span>
    </span>
  );
}
