import { formatLocalDateTime, formatUtcDateTime } from '../lib/date-time';

/** Local wall-clock time, with the UTC instant on hover and in the machine-readable `dateTime`. */
export function LocalTime({ iso, className }: { iso: string; className?: string }) {
  return (
    <time dateTime={iso} title={formatUtcDateTime(iso)} className={`tabular-nums ${className ?? ''}`}>
      {formatLocalDateTime(iso)}
    </time>
  );
}
