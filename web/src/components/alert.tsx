import { CircleAlert, Info } from 'lucide-react';
import type { ReactNode } from 'react';
import { classNames } from '../lib/class-names';

interface AlertProps {
  tone?: 'error' | 'info';
  title?: string;
  children: ReactNode;
  className?: string;
}

/** An inline message; errors are announced to screen readers as they appear. */
export function Alert({ tone = 'error', title, children, className }: AlertProps) {
  const Icon = tone === 'error' ? CircleAlert : Info;
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={classNames(
        'flex gap-2 rounded-md border px-3 py-2 text-sm',
        tone === 'error'
          ? 'border-state-bad/40 bg-state-bad/5 text-state-bad'
          : 'border-state-info/30 bg-state-info/5 text-ink',
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
