import type { TSeverity } from '@shared/contracts/cases';
import { SEVERITY_LABELS } from '@shared/human-labels';
import { SEVERITY_MARK_FAINT, SEVERITY_MARK_TILT, severityMarkShape } from '@shared/severity-mark';
import { classNames } from '../lib/class-names';

/** Driftcase's severity mark (shared/severity-mark.ts), drawn from the same geometry as report.html. */
export function SeverityMark({
  severity,
  className = 'size-4',
}: {
  severity: TSeverity;
  className?: string;
}) {
  const shape = severityMarkShape(severity);
  return (
    <svg viewBox="0 0 16 16" className={classNames('shrink-0', className)} aria-hidden focusable="false">
      <g transform={`rotate(${SEVERITY_MARK_TILT} 8 8)`}>
        {shape.contours.map((contour, index) => {
          const isFilled = shape.isFilled && index === 0;
          const isDrawn = contour.isSolid || isFilled;
          return (
            <ellipse
              key={contour.rx}
              cx={8}
              cy={8}
              rx={contour.rx}
              ry={contour.ry}
              fill={isFilled ? shape.colour : 'none'}
              fillOpacity={isFilled ? 0.35 : undefined}
              stroke={isDrawn ? shape.colour : SEVERITY_MARK_FAINT}
              strokeOpacity={isDrawn ? shape.opacity : undefined}
              strokeWidth={isDrawn ? 1.4 : 0.9}
              strokeDasharray={isDrawn ? undefined : '0.6 1.4'}
              strokeLinecap={isDrawn ? undefined : 'round'}
            />
          );
        })}
        <circle cx={8} cy={8} r={1.5} fill={shape.dotColour} />
      </g>
    </svg>
  );
}

/** Severity as mark and word, never colour alone; the word is what screen readers and greyscale prints get. */
export function SeverityBadge({ severity, size = 'sm' }: { severity: TSeverity; size?: 'sm' | 'lg' }) {
  const isSerious = severity === 'high' || severity === 'critical';
  return (
    <span
      className={classNames(
        'inline-flex items-center gap-1.5 whitespace-nowrap',
        size === 'lg' ? 'text-base' : 'text-sm',
      )}
      data-severity={severity}
    >
      <SeverityMark severity={severity} className={size === 'lg' ? 'size-6' : 'size-[18px]'} />
      <span className={classNames(isSerious && 'font-bold', severity === 'critical' && 'text-state-bad')}>
        {SEVERITY_LABELS[severity]}
      </span>
    </span>
  );
}
