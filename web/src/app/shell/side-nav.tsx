import type { Role } from '@shared/roles';
import { describeTimeZone } from '@shared/site-time';
import { Logo } from '@web/components/logo';
import { paths } from '@web/config/paths';
import { classNames } from '@web/lib/class-names';
import { useSiteTimeZone } from '@web/lib/site-time-zone';
import { Link, useLocation } from 'react-router-dom';
import { navigationFor } from './navigation';

export function SideNav({ role }: { role: Role }) {
  const { pathname } = useLocation();
  const zone = useSiteTimeZone();
  return (
    <nav
      aria-label="Main"
      className="flex w-44 shrink-0 flex-col bg-chrome-900 bg-[linear-gradient(rgb(169_184_204/0.05)_1px,transparent_1px),linear-gradient(90deg,rgb(169_184_204/0.05)_1px,transparent_1px)] bg-[size:16px_16px] text-chrome-100 xl:w-56"
    >
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
                        'flex items-center gap-2.5 rounded-md px-2 py-2 text-sm',
                        isCurrent
                          ? 'bg-chrome-800 font-bold text-white ring-1 ring-chrome-600'
                          : 'text-chrome-100 hover:bg-chrome-800/70 hover:text-white',
                      )}
                    >
                      <item.icon aria-hidden className="size-4" />
                      {item.label}
                      {isCurrent && (
                        // The "you are here" pose of the map views: an onboard-orange heading mark.
                        <svg aria-hidden viewBox="0 0 10 10" className="ml-auto size-2.5">
                          <path d="M10 5L0 0l2.5 5L0 10z" fill="#E69F00" />
                        </svg>
                      )}
                    </Link>
                  </li>
                );
              })}
            </ul>
          </div>
        ))}
      </div>
      <div className="border-t border-chrome-700 px-4 py-3 text-xs text-chrome-300">
        <p className="font-bold tracking-wider uppercase">Site time</p>
        <p className="mt-0.5 tabular-nums" data-testid="site-time-zone">
          {describeTimeZone(zone)}
        </p>
      </div>
    </nav>
  );
}
