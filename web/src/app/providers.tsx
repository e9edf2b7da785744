import { type QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useSiteSettings } from '@web/features/site/api/get-site-settings';
import { SiteTimeZoneProvider } from '@web/lib/site-time-zone';
import type { ReactNode } from 'react';

/**
 * Waits for the site settings before the app shows anything: every time on every page is shown in
 * the site's zone, and a time shown in the wrong zone first would be worse than a moment's wait.
 */
function SiteSettingsGate({ children }: { children: ReactNode }) {
  const site = useSiteSettings();
  if (site.data) return <SiteTimeZoneProvider zone={site.data.timeZone}>{children}</SiteTimeZoneProvider>;
  if (site.isError)
    return (
      <div role="alert" className="mx-auto mt-24 max-w-md text-center">
        <p className="font-bold">Driftcase could not reach its server</p>
        <p className="mt-1 text-sm text-ink-muted">{site.error.message}</p>
        <button
          type="button"
          className="mt-4 rounded-md bg-accent px-4 py-2 text-sm font-bold text-white"
          onClick={() => site.refetch()}
        >
          Try again
        </button>
      </div>
    );
  return (
    <p aria-busy className="mt-24 text-center text-sm text-ink-muted">
      Loading Driftcase…
    </p>
  );
}

export function AppProviders({ queryClient, children }: { queryClient: QueryClient; children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      <SiteSettingsGate>{children}</SiteSettingsGate>
    </QueryClientProvider>
  );
}
