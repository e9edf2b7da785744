import type { QueryClient } from '@tanstack/react-query';
import { paths } from '@web/config/paths';
import { createBrowserRouter, type LoaderFunctionArgs, redirect } from 'react-router-dom';
import { AuditRoute, auditLoader } from './routes/audit';
import { BundleSqlConsoleRoute } from './routes/bundle-sql-console';
import { CaseDetailRoute, caseDetailLoader } from './routes/case-detail';
import { CasesRoute } from './routes/cases';
import { CompareRoute } from './routes/compare';
import { EvidenceAdminRoute, evidenceAdminLoader } from './routes/evidence-admin';
import { FindingsRoute } from './routes/findings';
import { FindingsDiffRoute } from './routes/findings-diff';
import { FindingsVersionRoute } from './routes/findings-version';
import { FixesRoute } from './routes/fixes';
import { requireSession } from './routes/guards';
import { HelpRoute } from './routes/help';
import { NewCaseRoute, newCaseLoader } from './routes/new-case';
import { NotFoundRoute } from './routes/not-found';
import { OutboxRoute, outboxLoader } from './routes/outbox';
import { RouteError } from './routes/route-error';
import { SignInRoute, signInLoader } from './routes/sign-in';
import { UploadRoute } from './routes/upload';
import { UsersRoute, usersLoader } from './routes/users';
import { WorkspaceRoute, workspaceLoader } from './routes/workspace';
import { AppShell } from './shell/app-shell';
import type { RouteHandle } from './shell/page-title';

function FullPageError() {
  return (
    <div className="grid min-h-screen place-items-center bg-canvas p-10">
      <RouteError />
    </div>
  );
}

const title = (text: string): RouteHandle => ({ title: text });

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    {
      path: paths.signIn.path,
      loader: signInLoader(queryClient),
      element: <SignInRoute />,
      errorElement: <FullPageError />,
      handle: title('Sign in'),
    },
    {
      path: paths.home.path,
      loader: ({ request }: LoaderFunctionArgs) => requireSession(queryClient, request),
      element: <AppShell />,
      errorElement: <FullPageError />,
      children: [
        {
          // Errors inside a page keep the shell and navigation on screen.
          errorElement: <RouteError />,
          children: [
            { index: true, loader: () => redirect(paths.cases.href()) },
            { path: paths.cases.path, element: <CasesRoute />, handle: title('Cases') },
            {
              path: paths.newCase.path,
              loader: newCaseLoader(queryClient),
              element: <NewCaseRoute />,
              handle: title('Cases / New case'),
            },
            {
              path: paths.caseDetail.path,
              loader: caseDetailLoader(queryClient),
              element: <CaseDetailRoute />,
              handle: title('Cases / Case'),
            },
            { path: paths.caseFindings.path, element: <FindingsRoute />, handle: title('Cases / Findings') },
            {
              path: paths.caseFindingsVersion.path,
              element: <FindingsVersionRoute />,
              handle: title('Cases / Findings / Version'),
            },
            {
              path: paths.caseFindingsDiff.path,
              element: <FindingsDiffRoute />,
              handle: title('Cases / Findings / Changes'),
            },
            { path: paths.caseFixes.path, element: <FixesRoute />, handle: title('Cases / Fixes') },
            {
              path: paths.caseAudit.path,
              loader: auditLoader(queryClient),
              element: <AuditRoute />,
              handle: title('Cases / Audit trail'),
            },
            {
              path: paths.outbox.path,
              loader: outboxLoader(queryClient),
              element: <OutboxRoute />,
              handle: title('Administration / Outbox'),
            },
            {
              path: paths.evidenceAdmin.path,
              loader: evidenceAdminLoader(queryClient),
              element: <EvidenceAdminRoute />,
              handle: title('Administration / Keys and evidence'),
            },
            {
              path: paths.users.path,
              loader: usersLoader(queryClient),
              element: <UsersRoute />,
              handle: title('Administration / Users'),
            },
            {
              path: paths.bundleSqlConsole.path,
              element: <BundleSqlConsoleRoute />,
              handle: title('Cases / Bundle / SQL console'),
            },
            {
              path: paths.uploadBundle.path,
              element: <UploadRoute />,
              handle: title('Cases / Upload bundle'),
            },
            {
              path: paths.workspace.path,
              loader: workspaceLoader(queryClient),
              element: <WorkspaceRoute />,
              handle: title('Cases / Workspace'),
            },
            {
              path: paths.compareReplays.path,
              element: <CompareRoute />,
              handle: title('Cases / Compare replays'),
            },
            { path: paths.help.path, element: <HelpRoute />, handle: title('Help') },
            { path: '*', element: <NotFoundRoute />, handle: title('Not found') },
          ],
        },
      ],
    },
  ]);
}
