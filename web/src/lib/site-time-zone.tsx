import { createContext, type ReactNode, useContext } from 'react';

const SiteTimeZoneContext = createContext<string | undefined>(undefined);

/** Gives every time on the page the site's zone (from `GET /api/site`). */
export function SiteTimeZoneProvider({ zone, children }: { zone: string; children: ReactNode }) {
  return <SiteTimeZoneContext.Provider value={zone}>{children}</SiteTimeZoneContext.Provider>;
}

/** The IANA zone times are shown in; outside a provider (tests of lone components) it is UTC. */
export function useSiteTimeZone(): string {
  return useContext(SiteTimeZoneContext) ?? 'UTC';
}
