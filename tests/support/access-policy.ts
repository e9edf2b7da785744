import type { Role } from '../../shared/roles';

/**
 * Who may call each route, written by hand from the product's rules (README, "Roles"), apart
 * from the routes' own `access` lists so the role matrix can catch a route that lets in too many.
 *
 * For every route: the roles that succeed as a member of the case the call is about, and the
 * roles that succeed without being a member. Admins oversee every case, so they appear in both
 * columns wherever they appear at all. For routes not about one case the two columns are equal.
 * On member-management routes "member" means the case's creator (the demo investigator) or an admin.
 */
export interface RoutePolicy {
  member: 'public' | readonly Role[];
  nonMember: 'public' | readonly Role[];
}

const EVERYONE: readonly Role[] = ['investigator', 'reviewer', 'legal', 'engineer', 'admin'];
const PUBLIC: RoutePolicy = { member: 'public', nonMember: 'public' };
/** Not about one case: the same roles whether or not they work on any case. */
const site = (roles: readonly Role[]): RoutePolicy => ({ member: roles, nonMember: roles });
/** Reading a case's evidence, findings or workspace: its members in these roles, and admins. */
const caseRead = (roles: readonly Role[] = EVERYONE): RoutePolicy => ({
  member: roles,
  nonMember: roles.includes('admin') ? ['admin'] : [],
});
/** Changing a case: its members in these roles, and admins where the role may do it at all. */
const caseWrite = caseRead;

export const ACCESS_POLICY: Record<string, RoutePolicy> = {
  'get /health': PUBLIC,
  'get /site': PUBLIC,
  'get /keys': PUBLIC,
  'get /keys/thumbprints': PUBLIC,
  'post /auth/login': PUBLIC,
  'post /auth/logout': site(EVERYONE),
  'get /auth/me': site(EVERYONE),
  'get /users': site(['admin']),
  'post /users': site(['admin']),
  'patch /users/:id': site(['admin']),
  'post /keys/rotate': site(['admin']),
  'get /outbox': site(['admin']),
  'get /evidence/orphans': site(['admin']),
  'get /audit': site(['admin', 'legal']),
  'get /audit/verify': site(['admin', 'legal']),
  'post /archives/verify': site(['legal', 'reviewer', 'admin']),

  // That a case exists, its title and status, and who works on it: everyone signed in.
  'get /cases': site(EVERYONE),
  'post /cases': site(['investigator', 'admin']),
  'get /cases/:id': site(EVERYONE),
  'get /cases/:id/members': site(EVERYONE),
  // Changing who works on a case: its creator (an investigator here) or an admin.
  'get /cases/:id/member-candidates': caseWrite(['investigator', 'admin']),
  'post /cases/:id/members': caseWrite(['investigator', 'admin']),
  'delete /cases/:id/members/:userId': caseWrite(['investigator', 'admin']),

  'patch /cases/:id': caseWrite(['investigator', 'admin']),
  'get /cases/:id/lifecycle': caseRead(),
  'post /cases/:id/transitions': caseWrite(['investigator', 'reviewer', 'admin']),

  // Evidence: bundles, recordings, replays and their views.
  'post /cases/:id/bundles': caseWrite(['investigator']),
  'post /cases/:id/recordings': caseWrite(['investigator']),
  // Only the uploader's own progress; admins do not upload.
  'get /cases/:id/recordings/progress/:progressId': { member: ['investigator'], nonMember: [] },
  'get /cases/:id/bundles': caseRead(),
  'get /bundles/:id': caseRead(),
  'get /bundles/:id/tables/:name': caseRead(),
  'get /bundles/:id/original': caseRead(),
  'get /bundles/:id/map': caseRead(),
  'get /bundles/:id/tracks': caseRead(),
  'get /bundles/:id/replays/:replayId/clearance': caseRead(),
  'post /bundles/:id/replays': caseWrite(['investigator', 'engineer']),
  'get /bundles/:id/replays': caseRead(),
  'get /replays/:id': caseRead(),
  'delete /replays/:id': caseWrite(['investigator', 'engineer']),
  'get /replays/:id/progress': caseRead(),
  'get /replays/:id/series': caseRead(),
  'get /replays/:id/steps/:k': caseRead(),
  'get /replays/:id/disagreement': caseRead(),

  // Findings and their review.
  'get /cases/:id/findings': caseRead(),
  'get /cases/:id/evidence-names': caseRead(),
  'put /cases/:id/findings': caseWrite(['investigator']),
  'post /cases/:id/findings/submit': caseWrite(['investigator']),
  'get /cases/:id/findings/versions': caseRead(),
  'get /cases/:id/findings/versions/:v': caseRead(),
  'get /cases/:id/findings/versions/:v/diff': caseRead(),
  'post /cases/:id/findings/versions/:v/signoff': caseWrite(['reviewer']),
  'post /cases/:id/findings/versions/:v/return': caseWrite(['reviewer']),

  // Fixes, holds, history and archives.
  'get /cases/:id/fixes': caseRead(),
  'post /cases/:id/fixes': caseWrite(['engineer']),
  'post /cases/:id/fixes/:fixId/verify': caseWrite(['investigator', 'reviewer']),
  'get /cases/:id/hold': caseRead(),
  'post /cases/:id/hold': caseWrite(['legal']),
  'delete /cases/:id/hold': caseWrite(['legal']),
  'get /cases/:id/audit': caseRead(['reviewer', 'legal', 'admin']),
  'get /cases/:id/audit/verify': caseRead(['reviewer', 'legal', 'admin']),
  'get /cases/:id/archive': caseRead(['legal']),
  'get /cases/:id/archives': caseRead(['legal', 'reviewer', 'admin']),

  // Pictures saved to the case as figures: made by investigators, read by every member.
  'post /cases/:id/figures': caseWrite(['investigator']),
  'get /cases/:id/figures': caseRead(),
  'get /figures/:id/file': caseRead(),

  // The investigation workspace: bookmarks (notes) and saved queries.
  'get /cases/:id/bookmarks': caseRead(),
  'post /cases/:id/bookmarks': caseWrite(['investigator']),
  'get /bookmarks/:id': caseRead(),
  'patch /bookmarks/:id': caseWrite(['investigator', 'admin']),
  'delete /bookmarks/:id': caseWrite(['investigator']),
  'get /cases/:id/queries': caseRead(),
  'post /cases/:id/queries': caseWrite(['investigator']),
  'get /queries/:id': caseRead(),
};

/** Whether `role` (null: no session) should succeed, as a member of the case or not. */
export function isAllowedByPolicy(route: string, role: Role | null, isMember: boolean): boolean {
  const policy = ACCESS_POLICY[route];
  if (!policy) throw new Error(`No access policy written for ${route}`);
  const allowed = isMember ? policy.member : policy.nonMember;
  return allowed === 'public' || (role !== null && allowed.includes(role));
}
