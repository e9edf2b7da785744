/**
 * Every action the audit trail records. The web app's case history and the evidence archive read
 * these names, so an existing one is never renamed; a new write adds its own here.
 */
export const AUDIT_ACTIONS = [
  'auth.login',
  'auth.logout',
  'user.create',
  'user.update',
  'case.create',
  'case.update',
  'case.transition',
  'case.member_add',
  'case.member_remove',
  'bundle.upload',
  'bundle.receive',
  'recording.import_failed',
  'replay.start',
  'replay.delete',
  'findings.save',
  'findings.submit',
  'findings.signoff',
  'findings.return',
  'fix.link',
  'fix.verify',
  'hold.place',
  'hold.release',
  'bookmark.create',
  'bookmark.edit_note',
  'bookmark.delete',
  'saved_query.create',
  'figure.store',
  'archive.export',
  'archive.verify',
  'key.rotate',
  'audit.checkpoint',
] as const;

export type AuditAction = (typeof AUDIT_ACTIONS)[number];
