import { CAUSE_CATEGORY_LABELS, INCIDENT_CLASS_LABELS } from '@shared/contracts/findings';

const LABELS: Record<string, string> = { ...INCIDENT_CLASS_LABELS, ...CAUSE_CATEGORY_LABELS };

/** A changed value as a person reads it: absent, a category's label, text as is, or compact JSON. */
export function formatDiffValue(value: unknown): string {
  if (value === undefined) return '(absent)';
  if (value === null) return '(empty)';
  if (typeof value === 'string') return LABELS[value] ?? value;
  return JSON.stringify(value, null, 1);
}

/** `rootCause.text` or `/rootCause/text` or `correctiveActions[0].owner` in words: "Root cause › text". */
export function formatDiffPath(path: string): string {
  const NAMES: Record<string, string> = {
    summary: 'Summary',
    incidentClass: 'Incident class',
    rootCause: 'Root cause',
    contributingFactors: 'Contributing factor',
    evidence: 'Evidence',
    correctiveActions: 'Corrective action',
  };
  const parts = path
    .replace(/^\//, '')
    .split(/[./]|\[(\d+)\]/)
    .filter((part) => part !== undefined && part !== '');
  return parts
    .map((part) => (/^\d+$/.test(part) ? `#${Number(part) + 1}` : (NAMES[part] ?? part)))
    .join(' › ');
}
