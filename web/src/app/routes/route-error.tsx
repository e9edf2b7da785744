import { EmptyState } from '@web/components/states';
import { paths } from '@web/config/paths';
import { ShieldAlert, TriangleAlert } from 'lucide-react';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { NotFoundRoute } from './not-found';

/** What a route shows when its loader or render throws: a plain sentence, never a stack trace. */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundRoute />;
  const isForbidden = isRouteErrorResponse(error) && error.status === 403;
  const message = isForbidden
    ? ((error.data as { message?: string } | undefined)?.message ??
      'Your role does not give access to this page.')
    : error instanceof Error
      ? error.message
      : 'Something unexpected happened while showing this page.';
  return (
    <div role="alert">
      <EmptyState
        icon={isForbidden ? ShieldAlert : TriangleAlert}
        title={isForbidden ? 'Not available for your role' : 'This page could not be shown'}
        action={
          <Link to={paths.cases.href()} className="font-bold text-accent hover:underline">
            Go to the case list
          </Link>
        }
      >
        {message}
      </EmptyState>
    </div>
  );
}
