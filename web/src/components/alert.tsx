import { CircleAlert, Info, TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';
import { classNames } from '../lib/class-names';

interface AlertProps {
  /** `warning`: something the reader must weigh before going on, not a failure. */
  tone?: 'error' | 'warning' | 'info';
  title?: string;
  children: ReactNode;
  className?: string;
}

/** An inline message; errors are announced to screen readers as they appear. */
export function Alert({ tone = 'error', title, children, className }: AlertProps) {
  const Icon = { error: CircleAlert, warning: TriangleAlert, info: Info }[tone];
  return (
    <div
      role={tone === 'info' ? 'status' : 'alert'}
      className={classNames(
        'flex gap-2 rounded-md border px-3 py-2 text-sm',
        {
          error: 'border-state-bad/40 bg-state-bad/5 text-state-bad',
          warning: 'border-state-warn/50 bg-state-warn/10 text-state-warn',
          info: 'border-state-info/30 bg-state-info/5 text-ink',
        }[tone],
        className,
      )}
    >
      <Icon aria-hidden className="mt-0.5 size-4 shrink-0" />
      <div>
        {title && <p className="font-bold">{title}</p>}
        <div className={title ? 'text-ink' : undefined}>{children}</div>
      </div>
    </div>
  );
}
