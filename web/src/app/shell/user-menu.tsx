import type { TSessionUser } from '@shared/contracts/auth';
import { ROLE_LABELS } from '@shared/roles';
import { paths } from '@web/config/paths';
import { useLogout } from '@web/features/auth/api/logout';
import { ChevronDown, LogOut } from 'lucide-react';
import { useEffect, useId, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';

function initialsOf(name: string): string {
  return name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((part) => part[0]?.toUpperCase())
    .join('');
}

/** A disclosure button: name and role always visible, sign-out one click away. */
export function UserMenu({ user }: { user: TSessionUser }) {
  const [isOpen, setIsOpen] = useState(false);
  const menuId = useId();
  const containerRef = useRef<HTMLDivElement>(null);
  const logout = useLogout();
  const navigate = useNavigate();

  useEffect(() => {
    if (!isOpen) return;
    const closeOnOutside = (event: MouseEvent | KeyboardEvent) => {
      if (
        event instanceof KeyboardEvent
          ? event.key === 'Escape'
          : !containerRef.current?.contains(event.target as Node)
      ) {
        setIsOpen(false);
      }
    };
    document.addEventListener('mousedown', closeOnOutside);
    document.addEventListener('keydown', closeOnOutside);
    return () => {
      document.removeEventListener('mousedown', closeOnOutside);
      document.removeEventListener('keydown', closeOnOutside);
    };
  }, [isOpen]);

  const signOut = () =>
    logout.mutate(undefined, { onSettled: () => navigate(paths.signIn.href(), { replace: true }) });

  return (
    <div ref={containerRef} className="relative">
      <button
        type="button"
        aria-expanded={isOpen}
        aria-controls={menuId}
        onClick={() => setIsOpen((open) => !open)}
        className="flex items-center gap-2.5 rounded-md px-2 py-1 hover:bg-canvas-sunk"
      >
        <span
          aria-hidden
          className="grid size-8 place-items-center rounded-full bg-chrome-700 text-xs font-bold text-white"
        >
          {initialsOf(user.name)}
        </span>
        <span className="text-left leading-tight">
          <span className="block text-sm font-bold" data-testid="user-name">
            {user.name}
          </span>
          <span className="block text-xs text-ink-muted" data-testid="user-role">
            {ROLE_LABELS[user.role]}
          </span>
        </span>
        <ChevronDown aria-hidden className="size-4 text-ink-muted" />
        <span className="sr-only">Account menu</span>
      </button>
      {isOpen && (
        <div
          id={menuId}
          className="absolute right-0 z-20 mt-1 w-60 rounded-md border border-canvas-line bg-canvas-raised p-1 shadow-lg"
        >
          <p className="truncate px-3 py-2 text-xs text-ink-muted">Signed in as {user.email}</p>
          <button
            type="button"
            onClick={signOut}
            disabled={logout.isPending}
            className="flex w-full items-center gap-2 rounded px-3 py-2 text-left text-sm hover:bg-canvas-sunk"
          >
            <LogOut aria-hidden className="size-4" />
            Sign out
          </button>
        </div>
      )}
    </div>
  );
}
