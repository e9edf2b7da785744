import { CASE_STATUS_LABELS, type TCaseStatus } from '@shared/contracts/cases';
import { AUDIT_ACTION_LABELS, labelFor } from '@shared/human-labels';

/** The fields of an audit entry the history needs; the full entry type satisfies it. */
export interface HistoryEntry {
  action: string;
  details: Record<string, unknown>;
}

const statusLabel = (value: unknown): string =>
  typeof value === 'string' && value in CASE_STATUS_LABELS
    ? CASE_STATUS_LABELS[value as TCaseStatus]
    : String(value ?? '?');

const versionOf = (details: Record<string, unknown>): string =>
  typeof details.version === 'number' ? ` version ${details.version}` : '';

const PLAIN: Record<string, (details: Record<string, unknown>) => string> = {
  'case.create': () => 'Case opened',
  'case.update': () => 'Case details edited',
  'case.transition': (d) => `Status changed from ${statusLabel(d.from)} to ${statusLabel(d.to)}`,
  'bundle.upload': () => 'Log bundle uploaded',
  'replay.start': () => 'Replay started',
  'replay.delete': () => 'Replay deleted',
  'findings.save': () => 'Findings draft saved',
  'findings.submit': (d) => `Findings${versionOf(d)} submitted for review`,
  'findings.return': (d) => `Findings${versionOf(d)} sent back with changes requested`,
  'findings.signoff': (d) => `Findings${versionOf(d)} signed off`,
  'fix.link': () => 'Fix linked',
  'fix.verify': () => 'Fix marked verified',
  'hold.place': () => 'Legal hold placed',
  'hold.release': () => 'Legal hold lifted',
};

/**
 * One line of plain English for an audit entry: the detailed line above where there is one, else
 * the action's shared label; an action unknown to this build still reads as words, never as a code.
 */
export function describeAuditEntry(entry: HistoryEntry): string {
  const describe = PLAIN[entry.action];
  return describe ? describe(entry.details) : labelFor(AUDIT_ACTION_LABELS, entry.action);
}

/**
 * Saving a draft is audited on every keystroke-sized save; the history folds consecutive saves
 * into one line with a count so the steps that matter stay visible.
 */
export function foldRepeatedSaves<T extends HistoryEntry>(entries: T[]): { entry: T; repeats: number }[] {
  const folded: { entry: T; repeats: number }[] = [];
  for (const entry of entries) {
    const last = folded.at(-1);
    if (last && entry.action === 'findings.save' && last.entry.action === 'findings.save') {
      last.repeats += 1;
      last.entry = entry;
    } else {
      folded.push({ entry, repeats: 1 });
    }
  }
  return folded;
}
