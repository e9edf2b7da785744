import type { AuditAction } from './audit-actions';
import type { KNOWN_EVENT_KINDS } from './bundle/table-specs';
import type { CaseEvent } from './case-lifecycle';
import type { ARCHIVE_CHECK_KINDS } from './contracts/archives';
import type { TBundleStatus } from './contracts/bundles';
import { CASE_STATUS_LABELS, type TSeverity } from './contracts/cases';
import type { VERSION_STATES } from './contracts/findings';
import type { TReplayFlag, TReplayStatus } from './contracts/replays';
import type { CauseKind } from './engine/causes/cause-types';
import type { FlagKind } from './engine/flags/flag-types';
import { ROLE_LABELS } from './roles';

/**
 * The words a person reads for every code Driftcase stores. The web app, the mails and
 * report.html all take them from here, so a code (`signed_off`, `saved_query.create`) never
 * reaches a screen and one state is called the same everywhere. Codes stay in the data, the API
 * and the archive's JSON files, where machines read them.
 */

export { CASE_STATUS_LABELS, ROLE_LABELS };

export const SEVERITY_LABELS: Record<TSeverity, string> = {
  low: 'Low',
  medium: 'Medium',
  high: 'High',
  critical: 'Critical',
};

/** What each audit entry records, as a short past-tense line. */
export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'auth.login': 'Signed in',
  'auth.logout': 'Signed out',
  'user.create': 'Account created',
  'user.update': 'Account changed',
  'case.create': 'Case opened',
  'case.update': 'Case details edited',
  'case.transition': 'Case moved on',
  'case.member_add': 'Member added to the case',
  'case.member_remove': 'Member removed from the case',
  'bundle.upload': 'Log bundle uploaded',
  'bundle.receive': 'Log bundle received and kept as evidence',
  'recording.import_failed': 'Robot recording could not be read',
  'replay.start': 'Replay started',
  'replay.delete': 'Replay deleted',
  'findings.save': 'Findings draft saved',
  'findings.submit': 'Findings submitted for sign-off',
  'findings.signoff': 'Findings signed',
  'findings.return': 'Findings returned with comments',
  'fix.link': 'Fix linked',
  'fix.verify': 'Fix verified',
  'hold.place': 'Legal hold placed',
  'hold.release': 'Legal hold lifted',
  'bookmark.create': 'Moment pinned',
  'bookmark.edit_note': 'Pin note edited',
  'bookmark.delete': 'Pin removed',
  'saved_query.create': 'Query saved',
  'figure.store': 'Picture saved as a figure',
  'archive.export': 'Evidence archive exported',
  'archive.verify': 'Evidence archive checked',
  'key.rotate': 'Signing key replaced',
  'audit.checkpoint': 'Audit trail checkpoint recorded',
};

/** The buttons and history lines of the lifecycle's moves, in the review words of design.md. */
export const CASE_EVENT_LABELS: Record<CaseEvent, string> = {
  start_analysis: 'Start analysis',
  submit: 'Submit findings for sign-off',
  return: 'Return with comments',
  sign: 'Sign the findings',
  close: 'Close the case',
  reopen: 'Reopen the case',
};

export const BUNDLE_STATUS_LABELS: Record<TBundleStatus, string> = {
  valid: 'Valid',
  invalid: 'Invalid',
  validating: 'Being checked',
};

/** The files uploaded with a robot recording (multipart field names of `POST /cases/:id/recordings`). */
export const RECORDING_FILE_LABELS: Record<string, string> = {
  recording: 'Recording',
  map: 'Map description (YAML)',
  map_image: 'Map image',
  params: 'Localization parameters',
  robot: 'Robot description',
};

export const REPLAY_STATUS_LABELS: Record<TReplayStatus, string> = {
  queued: 'Waiting to start',
  running: 'Running',
  done: 'Finished',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

export const FINDINGS_VERSION_STATE_LABELS: Record<(typeof VERSION_STATES)[number], string> = {
  submitted: 'Awaiting sign-off',
  returned: 'Returned with comments',
  signed: 'Signed',
  superseded: 'Superseded',
};

export const FLAG_SEVERITY_LABELS: Record<TReplayFlag['severity'], string> = {
  info: 'Note',
  warning: 'Warning',
  critical: 'Critical',
};

/** The replay analysis's flag kinds (shared/engine/flags/); an unknown kind falls back to plain words. */
export const FLAG_KIND_LABELS: Record<FlagKind, string> = {
  belief_collapsed: 'Belief collapsed',
  belief_split: 'Belief split in two',
  input_gap: 'Gap in the inputs',
  map_out_of_date: 'Map out of date',
  moving_obstacle: 'Something moving past',
  odometry_disagrees_with_scans: 'Odometry disagrees with scans',
  odometry_jump: 'Odometry jump',
  onboard_departed_from_reference: "Robot's estimate left the reference",
  onboard_departed_from_replay: "Robot's estimate left the replay",
  replay_lost_reference: 'Replay lost the reference',
  sensor_evidence_dropped: 'Sensor evidence dropped',
};

export const CAUSE_KIND_LABELS: Record<CauseKind, string> = {
  odometry_fault: 'Odometry fault',
  external_displacement: 'Moved from outside',
  map_changed: 'Site differs from the map',
  moving_obstacles: 'People or vehicles moving',
  sensor_degraded: 'Sensor degraded',
  filter_settings: "Robot's localizer settings",
  none: 'No fault found',
};

export const EVENT_KIND_LABELS: Record<(typeof KNOWN_EVENT_KINDS)[number], string> = {
  contact: 'Contact',
  protective_stop: 'Protective stop',
  emergency_stop: 'Emergency stop',
  warning_field: 'Warning field entered',
  operator_note: 'Operator note',
};

export const ARCHIVE_CHECK_KIND_LABELS: Record<(typeof ARCHIVE_CHECK_KINDS)[number], string> = {
  manifest: 'Manifest',
  file: 'File',
  trust: 'Trusted key',
  signature: 'Signature',
  'audit-chain': 'Audit chain',
  checkpoint: 'Audit checkpoint',
  replay: 'Replay',
};

/**
 * A code without a label of its own, in plain words: `map_out_of_date` → `Map out of date`.
 * Only for codes that come from outside (a bundle's own event kinds); ours all have a label.
 */
export function humaniseCode(code: string): string {
  const words = code.replace(/[._-]+/g, ' ').trim();
  return words ? words.charAt(0).toUpperCase() + words.slice(1) : code;
}

/** The label in `labels` for `code`, or the code in plain words. */
export function labelFor(labels: Readonly<Record<string, string>>, code: string | null | undefined): string {
  if (!code) return '—';
  return Object.hasOwn(labels, code) ? (labels[code] as string) : humaniseCode(code);
}

/**
 * A count with its noun in the right number: `1 problem`, `6 items`, `0 flags`. English plural
 * rules via `Intl.PluralRules` (CLDR); `plural` is given when it is not `singular + s`.
 */
export function countOf(count: number, singular: string, plural = `${singular}s`): string {
  const form = new Intl.PluralRules('en').select(count) === 'one' ? singular : plural;
  return `${count.toLocaleString('en-GB')} ${form}`;
}
