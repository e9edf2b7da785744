import { formatSiteDateTime, formatUtcInstant, type SiteTimeOptions } from '@shared/site-time';
import { useSiteTimeZone } from '../lib/site-time-zone';

/**
 * An instant as people read it: in the site's time zone with the zone named
 * (`14 Mar 2026, 09:12 CET`); the RFC 3339 value stays in `dateTime` for machines, and UTC with
 * the zone's full name is one hover away.
 */
export function LocalTime({
  iso,
  className,
  ...options
}: { iso: string; className?: string } & SiteTimeOptions) {
  const zone = useSiteTimeZone();
  return (
    <time
      dateTime={iso}
      title={`${formatUtcInstant(iso)} · times shown in ${zone}`}
      className={`tabular-nums ${className ?? ''}`}
    >
      {formatSiteDateTime(iso, zone, options)}
    </time>
  );
}
