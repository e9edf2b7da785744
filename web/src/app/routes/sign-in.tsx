import { describeTimeZone } from '@shared/site-time';
import type { QueryClient } from '@tanstack/react-query';
import { DriftScene } from '@web/components/drift-scene';
import { LogoMark } from '@web/components/logo';
import { safeNextPath } from '@web/config/paths';
import { meQueryOptions } from '@web/features/auth/api/get-me';
import { SignInForm } from '@web/features/auth/components/sign-in-form';
import { useSiteTimeZone } from '@web/lib/site-time-zone';
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
  const zone = useSiteTimeZone();
  return (
    <div className="flex min-h-screen flex-col bg-[#F7F4EC]">
      <main className="grid flex-1 grid-cols-[minmax(0,7fr)_minmax(0,5fr)] items-center gap-10 px-12 py-10">
        <figure className="mx-auto w-full max-w-[520px]">
          <DriftScene className="w-full rounded-lg shadow-sm ring-1 ring-[#2E3A4B]/15" />
          <figcaption className="mt-3 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
            <Key colour="#009E73" label="reference path" />
            <Key colour="#E69F00" label="what the robot believed" isDashed />
            <Key colour="#0072B2" label="replayed belief" />
            <Key colour="#D55E00" label="flagged interval" />
          </figcaption>
        </figure>
        <section
          aria-labelledby="sign-in-title"
          className="w-full max-w-sm overflow-hidden rounded-lg bg-canvas-raised shadow-md ring-1 ring-canvas-line"
        >
          <div className="flex items-center gap-3 border-b-4 border-series-onboard bg-chrome-900 px-6 py-4">
            <LogoMark className="size-9" />
            <span className="text-lg font-bold text-white">
              Drift<span className="text-chrome-300">case</span>
            </span>
            <span className="ml-auto text-xs tracking-widest text-chrome-300 uppercase">Investigation</span>
          </div>
          <div className="px-6 pt-5 pb-6">
            <h1 id="sign-in-title" className="text-xl font-bold">
              Sign in
            </h1>
            <p className="mt-1 mb-5 text-sm text-ink-muted">
              Replay what the robot believed, see where it drifted, record what it means.
            </p>
            <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
          </div>
        </section>
      </main>
      <footer className="flex justify-between gap-6 border-t border-[#E4E1D8] px-12 py-3 text-xs text-ink-muted">
        <p>
          Engineering estimates from recorded data; final safety determinations rest with qualified
          professionals.
        </p>
        <p className="shrink-0">Times shown in {describeTimeZone(zone)}</p>
      </footer>
    </div>
  );
}

function Key({ colour, label, isDashed = false }: { colour: string; label: string; isDashed?: boolean }) {
  return (
    <span className="inline-flex items-center gap-1.5">
      <svg aria-hidden viewBox="0 0 18 4" className="h-1 w-4.5">
        <line
          x1="0"
          y1="2"
          x2="18"
          y2="2"
          stroke={colour}
          strokeWidth="4"
          strokeDasharray={isDashed ? '5 3' : undefined}
        />
      </svg>
      {label}
    </span>
  );
}
