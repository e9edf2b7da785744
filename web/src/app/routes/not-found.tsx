import { EmptyState } from '@web/components/states';
import { paths } from '@web/config/paths';
import { MapPinOff } from 'lucide-react';
import { Link } from 'react-router-dom';

export function NotFoundRoute() {
  return (
    <EmptyState
      icon={MapPinOff}
      title="Page not found"
      action={
        <Link to={paths.cases.href()} className="font-bold text-accent hover:underline">
          Go to the case list
        </Link>
      }
    >
      <h1 className="sr-only">Page not found</h1>
      Nothing lives at this address. The link may be old or mistyped.
    </EmptyState>
  );
}
