/**
 * Every URL the web app uses, written once: page routes (`path` for the router, `href` for links)
 * and API endpoints. Later pages add their entries here.
 */
export const paths = {
  home: { path: '/', href: () => '/' },
  signIn: {
    path: '/sign-in',
    /** `next` is where to return after signing in; only same-app paths are honoured. */
    href: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  cases: { path: '/cases', href: () => '/cases' },
  newCase: { path: '/cases/new', href: () => '/cases/new' },
  caseDetail: { path: '/cases/:caseId', href: (caseId: string) => `/cases/${encodeURIComponent(caseId)}` },
  users: { path: '/admin/users', href: () => '/admin/users' },
} as const;

export const apiPaths = {
  health: '/api/health',
  login: '/api/auth/login',
  logout: '/api/auth/logout',
  me: '/api/auth/me',
  users: '/api/users',
  user: (userId: string) => `/api/users/${encodeURIComponent(userId)}`,
  cases: '/api/cases',
  case: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}`,
} as const;

/** Accepts a `next` parameter only when it is a path inside this app, so sign-in cannot redirect elsewhere. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next?.startsWith('/') || next.startsWith('//') || next.startsWith(paths.signIn.path)) {
    return paths.cases.href();
  }
  return next;
}
