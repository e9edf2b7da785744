import { SAFETY_CAUTION } from '@shared/safety-caution';
import { ShieldAlert } from 'lucide-react';
import { classNames } from '../lib/class-names';

/** The safety caution, worded by the server when it sends one, else the shared wording. */
export function SafetyCautionNote({
  text = SAFETY_CAUTION,
  className,
}: {
  text?: string;
  className?: string;
}) {
  return (
    <aside
      aria-label="Safety caution"
      className={classNames(
        'flex gap-2 rounded-md border border-state-warn/40 bg-state-warn/5 px-3 py-2 text-sm text-ink',
        className,
      )}
    >
      <ShieldAlert aria-hidden className="mt-0.5 size-4 shrink-0 text-state-warn" />
      <p>
        <span className="font-bold">Safety caution. </span>
        {text}
      </p>
    </aside>
  );
}
