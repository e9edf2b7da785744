import { type TSiteSettings, ZSiteSettings } from '@shared/contracts/site';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getSiteSettings(): Promise<TSiteSettings> {
  return apiRequest(apiPaths.site, { schema: ZSiteSettings });
}

/** Installation settings change only with a restart, so one answer serves the page's lifetime. */
export function siteSettingsQueryOptions() {
  return queryOptions({
    queryKey: ['site', 'settings'] as const,
    queryFn: getSiteSettings,
    staleTime: Infinity,
  });
}

export function useSiteSettings() {
  return useQuery(siteSettingsQueryOptions());
}
