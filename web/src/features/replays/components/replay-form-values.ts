import type { FilterConfig } from '@shared/bundle/types';
import { type TStartReplayRequest, ZStartReplayRequest } from '@shared/contracts/replays';
import { MAX_PARTICLES } from '@shared/engine/settings';

/** What the bundle allows, shown beside the fields and checked before anything is sent. */
export interface ReplayLimits {
  /** Beams per scan of the bundle's scanner; null when it has no scans. */
  scanBeams: number | null;
  maxParticles: number;
}

export const DEFAULT_LIMITS: ReplayLimits = { scanBeams: null, maxParticles: MAX_PARTICLES };

/** The allowed range of each numeric field, in words (e.g. "1–271"). */
export function limitHints(limits: ReplayLimits): Record<'particles' | 'beams_used', string> {
  return {
    particles: `count, 1–${limits.maxParticles.toLocaleString('en-GB')}`,
    beams_used:
      limits.scanBeams === null
        ? 'laser beams per scan (this bundle has no scans)'
        : `laser beams per scan, 1–${limits.scanBeams} (the scanner's beams)`,
  };
}

/** The launcher's fields as typed (strings for numbers, so a half-typed value is not lost). */
export interface ReplayFormValues {
  label: string;
  particles: string;
  seed: string;
  resampling_method: string;
  resampling_threshold: string;
  beams_used: string;
  motion_alpha: [string, string, string, string];
  recovery: boolean;
  kld: boolean;
}

/** Field values that reproduce the manifest's own settings. */
export function defaultsFrom(filter: FilterConfig | undefined): ReplayFormValues {
  const alpha = filter?.motion.alpha ?? [0, 0, 0, 0];
  return {
    label: '',
    particles: String(filter?.particles ?? ''),
    seed: String(filter?.seed ?? ''),
    resampling_method: filter?.resampling.method ?? 'systematic',
    resampling_threshold: String(filter?.resampling.threshold ?? ''),
    beams_used: String(filter?.scan_model?.beams_used ?? ''),
    motion_alpha: alpha.map(String) as ReplayFormValues['motion_alpha'],
    recovery: filter?.recovery?.enabled ?? false,
    kld: filter?.kld?.enabled ?? false,
  };
}

const asNumber = (text: string) => (text.trim() === '' ? undefined : Number(text));

/**
 * The request body: only fields that differ from the manifest become overrides, so a replay with
 * nothing changed is recorded as "manifest settings". Validated by the shared zod schema; issues
 * come back keyed by field path (e.g. `overrides.motion_alpha.2`).
 */
export function toStartRequest(
  values: ReplayFormValues,
  defaults: ReplayFormValues,
  limits: ReplayLimits = DEFAULT_LIMITS,
): { ok: true; body: TStartReplayRequest } | { ok: false; issues: Record<string, string> } {
  const overrides: Record<string, unknown> = {};
  for (const key of ['particles', 'seed', 'resampling_threshold', 'beams_used'] as const) {
    if (values[key] !== defaults[key]) overrides[key] = asNumber(values[key]);
  }
  if (values.resampling_method !== defaults.resampling_method)
    overrides.resampling_method = values.resampling_method;
  if (values.motion_alpha.some((a, i) => a !== defaults.motion_alpha[i])) {
    overrides.motion_alpha = values.motion_alpha.map(asNumber);
  }
  if (values.recovery !== defaults.recovery) overrides.recovery = values.recovery;
  if (values.kld !== defaults.kld) overrides.kld = values.kld;
  const body = { label: values.label.trim() || undefined, overrides };
  const parsed = ZStartReplayRequest.safeParse(body);
  const issues: Record<string, string> = {};
  for (const issue of parsed.error?.issues ?? []) {
    const path = issue.path.join('.');
    issues[path] ??= issue.message;
  }
  // Checked against this bundle, as the server will (shared/engine/settings.ts).
  const beams = overrides.beams_used;
  if (typeof beams === 'number' && limits.scanBeams !== null && beams > limits.scanBeams) {
    issues['overrides.beams_used'] ??=
      `This must be ${limits.scanBeams} or less: the scanner records ${limits.scanBeams} beams per scan`;
  }
  if (typeof beams === 'number' && limits.scanBeams === null) {
    issues['overrides.beams_used'] ??= 'This bundle has no laser scans, so beams used cannot be set';
  }
  if (Object.keys(issues).length === 0) return { ok: true, body };
  return { ok: false, issues };
}

/** A one-line summary of a replay's overrides, e.g. "particles 2000 · recovery on". */
export function summarizeOverrides(overrides: Record<string, unknown>): string {
  const parts = Object.entries(overrides).map(([key, value]) => {
    const name = key.replaceAll('_', ' ');
    if (typeof value === 'boolean') return `${name} ${value ? 'on' : 'off'}`;
    if (Array.isArray(value)) return `${name} ${value.join('/')}`;
    return `${name} ${String(value)}`;
  });
  return parts.length ? parts.join(' · ') : 'manifest settings';
}
