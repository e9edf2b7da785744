import type { QueryClient } from '@tanstack/react-query';
import { LogoMark } from '@web/components/logo';
import { safeNextPath } from '@web/config/paths';
import { meQueryOptions } from '@web/features/auth/api/get-me';
import { SignInForm } from '@web/features/auth/components/sign-in-form';
import { type LoaderFunctionArgs, redirect, useNavigate, useSearchParams } from 'react-router-dom';

/** Someone already signed in skips the form. */
export const signInLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    try {
      await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 });
    } catch {
      return null;
    }
    throw redirect(safeNextPath(new URL(request.url).searchParams.get('next')));
  };

export function SignInRoute() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const next = safeNextPath(searchParams.get('next'));
  return (
    <div className="grid min-h-screen grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <section className="relative flex flex-col justify-between overflow-hidden bg-chrome-900 p-10 text-chrome-100">
        <div className="flex items-center gap-3">
          <LogoMark className="size-10" />
          <span className="text-xl font-bold text-white">
            Drift<span className="text-chrome-300">case</span>
          </span>
        </div>
        <div className="max-w-md">
          <p className="text-xl leading-snug text-white">
            Replay what the robot believed, see where its belief drifted, and record what it means.
          </p>
          <p className="mt-3 text-sm text-chrome-300">
            Incident investigation for mobile robots: cases, log bundles, replays, findings and sign-off.
          </p>
        </div>
        <p className="text-xs text-chrome-300/80">
          Engineering estimates from recorded data; final safety determinations rest with qualified
          professionals.
        </p>
      </section>
      <main className="flex items-center justify-center bg-canvas p-10">
        <div className="w-full max-w-sm">
          <h1 className="text-xl font-bold">Sign in</h1>
          <p className="mt-1 mb-6 text-sm text-ink-muted">Use the account your administrator gave you.</p>
          <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
        </div>
      </main>
    </div>
  );
}
