import type { Role } from '@shared/roles';
import { Logo } from '@web/components/logo';
import { paths } from '@web/config/paths';
import { classNames } from '@web/lib/class-names';
import { Link, useLocation } from 'react-router-dom';
import { navigationFor } from './navigation';

export function SideNav({ role }: { role: Role }) {
  const { pathname } = useLocation();
  return (
    <nav aria-label="Main" className="flex w-44 shrink-0 flex-col bg-chrome-900 text-chrome-100 xl:w-56">
      <Link to={paths.home.href()} className="flex h-14 items-center px-4" aria-label="Driftcase home">
        <Logo />
      </Link>
      <div className="flex-1 space-y-5 overflow-y-auto px-2 py-4">
        {navigationFor(role).map((section) => (
          <div key={section.label}>
            <p className="px-2 pb-1 text-xs font-bold uppercase tracking-wider text-chrome-300/80">
              {section.label}
            </p>
            <ul className="space-y-0.5">
              {section.items.map((item) => {
                const isCurrent = item.isCurrent ? item.isCurrent(pathname) : pathname === item.href;
                return (
                  <li key={item.href}>
                    <Link
                      to={item.href}
                      aria-current={isCurrent ? 'page' : undefined}
                      className={classNames(
                        'flex items-center gap-2.5 rounded-md border-l-2 px-2 py-2 text-sm',
                        isCurrent
                          ? 'border-series-onboard bg-chrome-700 font-bold text-white'
                          : 'border-transparent text-chrome-100 hover:bg-chrome-800 hover:text-white',
                      )}
                    >
                      <item.icon aria-hidden className="size-4" />
                      {item.label}
                    </Link>
                  </li>
                );
              })}
            </ul>
          </div>
        ))}
      </div>
      <p className="px-4 py-3 text-xs text-chrome-300/70">Incident investigation</p>
    </nav>
  );
}
