import { useMe } from '@web/features/auth/api/get-me';
import { Outlet } from 'react-router-dom';
import { usePageTitle } from './page-title';
import { SideNav } from './side-nav';
import { UserMenu } from './user-menu';

/** The signed-in frame: role-based navigation on the left, page title and account on top. */
export function AppShell() {
  const { data } = useMe();
  const title = usePageTitle();
  if (!data) return null;
  return (
    <div className="flex h-screen">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-accent px-4 py-2 font-bold text-white focus:not-sr-only focus:absolute focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <SideNav role={data.user.role} />
      <div className="flex min-w-0 flex-1 flex-col">
        <header className="flex h-14 shrink-0 items-center justify-between border-b border-canvas-line bg-canvas-raised px-4 xl:px-6">
          <p className="text-sm text-ink-muted" data-testid="page-title">
            {title}
          </p>
          <UserMenu user={data.user} />
        </header>
        <main id="main" tabIndex={-1} className="flex-1 overflow-y-auto px-4 py-6 xl:px-6 focus:outline-none">
          <div className="mx-auto max-w-7xl">
            <Outlet />
          </div>
        </main>
      </div>
    </div>
  );
}
