/**
 * Effective replay settings: the manifest's `filter` block with optional what-if overrides applied,
 * and defaults filled in for the optional recovery and KLD blocks.
 */
import { z } from 'zod';
import { MAX_PARTICLES, MAX_SEED, MIN_SEED } from '../bundle/filter-limits';
import type { FilterConfig, KldConfig, Manifest, RecoveryConfig, ScanModelConfig } from '../bundle/types';
import { RESAMPLING_METHODS } from '../bundle/types';

export { MAX_PARTICLES };

/** What-if overrides accepted by the CLI and the API. Every field is optional. */
export const ZReplayOverrides = z
  .object({
    particles: z.number().int().min(1).max(MAX_PARTICLES).optional(),
    seed: z.number().int().min(MIN_SEED).max(MAX_SEED).optional(),
    resampling_method: z.enum(RESAMPLING_METHODS as [string, ...string[]]).optional(),
    resampling_threshold: z.number().min(0).max(1).optional(),
    beams_used: z.number().int().min(1).optional(),
    motion_alpha: z
      .tuple([z.number().min(0), z.number().min(0), z.number().min(0), z.number().min(0)])
      .optional(),
    recovery: z.boolean().optional(),
    kld: z.boolean().optional(),
  })
  .strict();
export type TReplayOverrides = z.infer<typeof ZReplayOverrides>;

export interface ReplaySettings {
  particles: number;
  seed: number;
  motion: FilterConfig['motion'];
  /** Absent when the bundle has no scans or no grid: scans are then not used. */
  scan_model?: ScanModelConfig;
  resampling: FilterConfig['resampling'];
  initial: FilterConfig['initial'];
  recovery: RecoveryConfig;
  kld: KldConfig;
}

export interface SettingsIssue {
  /** Override or manifest field the problem is about, e.g. `beams_used`. */
  field: string;
  message: string;
}

export type SettingsResult = { ok: true; settings: ReplaySettings } | { ok: false; issues: SettingsIssue[] };

export const DEFAULT_RECOVERY: RecoveryConfig = { enabled: false, alpha_slow: 0.001, alpha_fast: 0.1 };

/** KLD defaults: common practice values (eps 0.05, delta 0.01, 0.5 m x 0.5 m x 10 degree bins). */
export function defaultKld(particles: number): KldConfig {
  return {
    enabled: false,
    epsilon: 0.05,
    delta: 0.01,
    bin_size: [0.5, 0.5, (10 * Math.PI) / 180],
    min_particles: Math.min(100, particles),
    max_particles: particles,
  };
}

/** Validates raw overrides (e.g. parsed JSON); each issue names the offending field. */
export function parseReplayOverrides(
  input: unknown,
): { ok: true; overrides: TReplayOverrides } | { ok: false; issues: SettingsIssue[] } {
  const parsed = ZReplayOverrides.safeParse(input ?? {});
  if (parsed.success) return { ok: true, overrides: parsed.data };
  return {
    ok: false,
    issues: parsed.error.issues.map((issue) => ({
      field:
        issue.path.length > 0
          ? issue.path.join('.')
          : String((issue as { keys?: string[] }).keys ?? '(overrides)'),
      message: issue.message,
    })),
  };
}

/** Manifest filter block + overrides → effective settings, or issues naming the field. */
export function resolveReplaySettings(manifest: Manifest, overrides: TReplayOverrides = {}): SettingsResult {
  const filter = manifest.filter;
  const issues: SettingsIssue[] = [];
  const particles = overrides.particles ?? filter.particles;
  let scanModel = filter.scan_model ? { ...filter.scan_model } : undefined;
  if (overrides.beams_used !== undefined) {
    if (!scanModel || !manifest.scan) {
      issues.push({
        field: 'beams_used',
        message: 'This bundle has no laser scan settings, so beams used cannot be set',
      });
    } else if (overrides.beams_used > manifest.scan.beams) {
      issues.push({
        field: 'beams_used',
        message: `This must be ${manifest.scan.beams} or less: the scanner records ${manifest.scan.beams} beams per scan (got ${overrides.beams_used})`,
      });
    } else {
      scanModel = { ...scanModel, beams_used: overrides.beams_used };
    }
  }
  const kldBase = { ...defaultKld(particles), ...filter.kld };
  const kld: KldConfig = {
    ...kldBase,
    enabled: overrides.kld ?? kldBase.enabled,
    max_particles: Math.max(kldBase.max_particles, kldBase.min_particles),
  };
  if (issues.length > 0) return { ok: false, issues };
  return {
    ok: true,
    settings: {
      particles,
      seed: overrides.seed ?? filter.seed,
      motion: { model: 'odometry', alpha: overrides.motion_alpha ?? filter.motion.alpha },
      scan_model: scanModel,
      resampling: {
        method:
          (overrides.resampling_method as FilterConfig['resampling']['method']) ?? filter.resampling.method,
        threshold: overrides.resampling_threshold ?? filter.resampling.threshold,
      },
      initial: filter.initial,
      recovery: {
        ...DEFAULT_RECOVERY,
        ...filter.recovery,
        enabled: overrides.recovery ?? filter.recovery?.enabled ?? false,
      },
      kld,
    },
  };
}

/** Largest particle count the filter may hold under these settings (array capacity). */
export function particleCapacity(settings: ReplaySettings): number {
  return settings.kld.enabled ? Math.max(settings.particles, settings.kld.max_particles) : settings.particles;
}
