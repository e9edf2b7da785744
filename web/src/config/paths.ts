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
  help: { path: '/help', href: () => '/help' },
  reviewQueue: { href: () => '/cases?status=in_review' },
  caseFindings: {
    path: '/cases/:caseId/findings',
    href: (caseId: string) => `/cases/${encodeURIComponent(caseId)}/findings`,
  },
  caseFindingsVersion: {
    path: '/cases/:caseId/findings/versions/:version',
    href: (caseId: string, version: number) =>
      `/cases/${encodeURIComponent(caseId)}/findings/versions/${version}`,
  },
  caseFindingsDiff: {
    path: '/cases/:caseId/findings/diff',
    href: (caseId: string, from?: number, to?: number) =>
      `/cases/${encodeURIComponent(caseId)}/findings/diff${from && to ? `?from=${from}&to=${to}` : ''}`,
  },
  caseFixes: {
    path: '/cases/:caseId/fixes',
    href: (caseId: string) => `/cases/${encodeURIComponent(caseId)}/fixes`,
  },
  caseAudit: {
    path: '/cases/:caseId/audit',
    href: (caseId: string) => `/cases/${encodeURIComponent(caseId)}/audit`,
  },
  outbox: { path: '/admin/outbox', href: () => '/admin/outbox' },
  evidenceAdmin: { path: '/admin/evidence', href: () => '/admin/evidence' },
  // Investigator workspace: upload, per-bundle workspace and replay comparison.
  uploadBundle: {
    path: '/cases/:caseId/upload',
    href: (caseId: string) => `/cases/${encodeURIComponent(caseId)}/upload`,
  },
  workspace: {
    path: '/bundles/:bundleId/workspace',
    /** `replay` preselects a replay; `t` (s since the recording's start) opens it at that moment. */
    href: (bundleId: string, replayId?: string, t?: number) => {
      const query = new URLSearchParams();
      if (replayId) query.set('replay', replayId);
      if (replayId && t !== undefined && Number.isFinite(t)) query.set('t', t.toFixed(3));
      const search = query.toString();
      return `/bundles/${encodeURIComponent(bundleId)}/workspace${search ? `?${search}` : ''}`;
    },
  },
  bundleSqlConsole: {
    path: '/cases/:caseId/bundles/:bundleId/sql',
    href: (caseId: string, bundleId: string) =>
      `/cases/${encodeURIComponent(caseId)}/bundles/${encodeURIComponent(bundleId)}/sql`,
  },
  compareReplays: {
    path: '/bundles/:bundleId/compare',
    href: (bundleId: string, left?: string, right?: string) => {
      const query = new URLSearchParams();
      if (left) query.set('left', left);
      if (right) query.set('right', right);
      const search = query.toString();
      return `/bundles/${encodeURIComponent(bundleId)}/compare${search ? `?${search}` : ''}`;
    },
  },
} as const;

export const apiPaths = {
  health: '/api/health',
  site: '/api/site',
  login: '/api/auth/login',
  logout: '/api/auth/logout',
  me: '/api/auth/me',
  users: '/api/users',
  user: (userId: string) => `/api/users/${encodeURIComponent(userId)}`,
  cases: '/api/cases',
  case: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}`,
  caseLifecycle: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/lifecycle`,
  caseTransitions: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/transitions`,
  caseFindings: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/findings`,
  caseFindingsSubmit: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/findings/submit`,
  caseFindingsVersions: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/findings/versions`,
  caseFindingsVersion: (caseId: string, version: number) =>
    `/api/cases/${encodeURIComponent(caseId)}/findings/versions/${version}`,
  caseFindingsDiff: (caseId: string, version: number) =>
    `/api/cases/${encodeURIComponent(caseId)}/findings/versions/${version}/diff`,
  caseFindingsSignoff: (caseId: string, version: number) =>
    `/api/cases/${encodeURIComponent(caseId)}/findings/versions/${version}/signoff`,
  caseFindingsReturn: (caseId: string, version: number) =>
    `/api/cases/${encodeURIComponent(caseId)}/findings/versions/${version}/return`,
  caseFixes: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/fixes`,
  caseFixVerify: (caseId: string, fixId: string) =>
    `/api/cases/${encodeURIComponent(caseId)}/fixes/${encodeURIComponent(fixId)}/verify`,
  caseHold: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/hold`,
  caseArchive: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/archive`,
  caseArchives: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/archives`,
  verifyArchive: '/api/archives/verify',
  caseAudit: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/audit`,
  caseAuditVerify: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/audit/verify`,
  caseBundles: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/bundles`,
  caseRecordings: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/recordings`,
  caseRecordingProgress: (caseId: string, progressId: string) =>
    `/api/cases/${encodeURIComponent(caseId)}/recordings/progress/${encodeURIComponent(progressId)}`,
  caseBookmarks: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/bookmarks`,
  caseQueries: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/queries`,
  caseMembers: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/members`,
  caseMember: (caseId: string, userId: string) =>
    `/api/cases/${encodeURIComponent(caseId)}/members/${encodeURIComponent(userId)}`,
  caseMemberCandidates: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/member-candidates`,
  caseFigures: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/figures`,
  figureFile: (figureId: string) => `/api/figures/${encodeURIComponent(figureId)}/file`,
  caseEvidenceNames: (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/evidence-names`,
  bookmark: (bookmarkId: string) => `/api/bookmarks/${encodeURIComponent(bookmarkId)}`,
  savedQuery: (queryId: string) => `/api/queries/${encodeURIComponent(queryId)}`,
  bundleTable: (bundleId: string, table: string) =>
    `/api/bundles/${encodeURIComponent(bundleId)}/tables/${encodeURIComponent(table)}`,
  bundleReplays: (bundleId: string) => `/api/bundles/${encodeURIComponent(bundleId)}/replays`,
  outbox: '/api/outbox',
  keyThumbprints: '/api/keys/thumbprints',
  rotateSigningKey: '/api/keys/rotate',
  evidenceOrphans: '/api/evidence/orphans',
  // Investigator workspace.
  bundle: (bundleId: string) => `/api/bundles/${encodeURIComponent(bundleId)}`,
  bundleMap: (bundleId: string) => `/api/bundles/${encodeURIComponent(bundleId)}/map`,
  bundleTracks: (bundleId: string) => `/api/bundles/${encodeURIComponent(bundleId)}/tracks`,
  replayClearance: (bundleId: string, replayId: string) =>
    `/api/bundles/${encodeURIComponent(bundleId)}/replays/${encodeURIComponent(replayId)}/clearance`,
  replay: (replayId: string) => `/api/replays/${encodeURIComponent(replayId)}`,
  replayProgress: (replayId: string) => `/api/replays/${encodeURIComponent(replayId)}/progress`,
  replaySeries: (replayId: string) => `/api/replays/${encodeURIComponent(replayId)}/series`,
  replayStep: (replayId: string, step: number) =>
    `/api/replays/${encodeURIComponent(replayId)}/steps/${step}`,
  replayDisagreement: (replayId: string) => `/api/replays/${encodeURIComponent(replayId)}/disagreement`,
} as const;

/** Accepts a `next` parameter only when it is a path inside this app, so sign-in cannot redirect elsewhere. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next?.startsWith('/') || next.startsWith('//') || next.startsWith(paths.signIn.path)) {
    return paths.cases.href();
  }
  return next;
}
