import { CircleAlert, type LucideIcon, SearchX } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { paths } from '../config/paths';
import { isApiError } from '../lib/api-client';

interface EmptyStateProps {
  icon?: LucideIcon;
  title: string;
  children?: ReactNode;
  action?: ReactNode;
}

export function EmptyState({ icon: Icon = SearchX, title, children, action }: EmptyStateProps) {
  return (
    <div className="flex flex-col items-center px-6 py-12 text-center">
      <Icon aria-hidden className="size-8 text-ink-faint" />
      <p className="mt-3 text-base font-bold text-ink">{title}</p>
      {children && <div className="mt-1 max-w-md text-sm text-ink-muted">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}

interface ErrorStateProps {
  error: unknown;
  title?: string;
  onRetry?: () => void;
}

/** Says what failed in the server's own words; a lapsed session gets a way back in. */
export function ErrorState({ error, title = 'Could not load this', onRetry }: ErrorStateProps) {
  const location = useLocation();
  const isSignedOut = isApiError(error) && error.status === 401;
  const message = error instanceof Error ? error.message : 'Unexpected error.';
  return (
    <div role="alert" className="flex flex-col items-center px-6 py-12 text-center">
      <CircleAlert aria-hidden className="size-8 text-state-bad" />
      <p className="mt-3 text-base font-bold text-ink">{isSignedOut ? 'Your session has ended' : title}</p>
      <p className="mt-1 max-w-md text-sm text-ink-muted">
        {isSignedOut ? 'Sign in again to continue.' : message}
      </p>
      <div className="mt-4 flex gap-2">
        {isSignedOut ? (
          <Link
            className="rounded-md bg-accent px-4 py-2 text-sm font-bold text-white"
            to={paths.signIn.href(location.pathname + location.search)}
          >
            Sign in
          </Link>
        ) : (
          onRetry && (
            <button
              type="button"
              onClick={onRetry}
              className="rounded-md border border-canvas-line bg-canvas-raised px-4 py-2 text-sm font-bold hover:bg-canvas-sunk"
            >
              Try again
            </button>
          )
        )}
      </div>
    </div>
  );
}

/** A grey bar standing in for text while it loads. */
export function SkeletonBar({ className = 'w-24' }: { className?: string }) {
  return (
    <span aria-hidden className={`inline-block h-3 animate-pulse rounded bg-canvas-sunk ${className}`} />
  );
}
