import { stat, writeFile } from 'node:fs/promises';
import { formatIssue } from '@shared/bundle/format-issue';
import { ReplayInputError, readBundleFiles, replayBundle } from '@shared/engine';
import type { ProbableCause } from '@shared/engine/causes/cause-types';
import { findProbableCauses } from '@shared/engine/causes/find-probable-causes';
import { parseReplayOverrides, type TReplayOverrides } from '@shared/engine/settings';
import { createSafetyObserver } from '@shared/safety/safety-observer';
import { CAUSES_CAUTION } from '../../../../shared/causes-caution';
import { readBundleSourceFiles } from '../../bundles/read-bundle-files';
import { analyseReplay } from '../../replays/analyse-replay';
import { nodeEngineStamp } from '../../replays/runtime';
import { createThreadSplit, defaultReplayThreads } from '../../replays/split-threads';

const USAGE =
  'Usage: npm run cli -- replay PATH [--particles N] [--seed S] [--resampling METHOD] [--threshold F]\n' +
  '                                  [--beams K] [--recovery] [--kld] [--threads N] [--json FILE]\n' +
  '  --threads N: split the particles over N threads (default: all cores); the digest is the same\n' +
  '  METHOD: multinomial | stratified | systematic | residual\n';

/** Command-line option → override field, and how its value is read. */
const VALUE_OPTIONS: Record<string, { field: keyof TReplayOverrides; kind: 'integer' | 'number' | 'text' }> =
  {
    '--particles': { field: 'particles', kind: 'integer' },
    '--seed': { field: 'seed', kind: 'integer' },
    '--resampling': { field: 'resampling_method', kind: 'text' },
    '--threshold': { field: 'resampling_threshold', kind: 'number' },
    '--beams': { field: 'beams_used', kind: 'integer' },
  };
const FLAG_OPTIONS: Record<string, keyof TReplayOverrides> = { '--recovery': 'recovery', '--kld': 'kld' };
const OPTION_FOR_FIELD = Object.fromEntries([
  ...Object.entries(VALUE_OPTIONS).map(([option, { field }]) => [field, option]),
  ...Object.entries(FLAG_OPTIONS).map(([option, field]) => [field, option]),
]);

interface ParsedArguments {
  path: string;
  jsonFile?: string;
  /** Threads to split the particles over; undefined = all cores. */
  threads?: number;
  overrides: TReplayOverrides;
}

/** Upper bound on --threads: more than this only adds contention. */
const MAX_THREADS = 64;

/** Parses argv into a path, an optional JSON output file and validated overrides; errors name the option. */
export function parseReplayArguments(
  args: string[],
): { ok: true; value: ParsedArguments } | { ok: false; errors: string[] } {
  const raw: Record<string, unknown> = {};
  const errors: string[] = [];
  const paths: string[] = [];
  let jsonFile: string | undefined;
  let threads: number | undefined;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg in FLAG_OPTIONS) raw[FLAG_OPTIONS[arg]] = true;
    else if (arg === '--json' || arg === '--threads' || arg in VALUE_OPTIONS) {
      const value = args[i + 1];
      i++;
      if (value === undefined || value.startsWith('--')) {
        errors.push(`${arg}: needs a value`);
        continue;
      }
      if (arg === '--json') {
        jsonFile = value;
        continue;
      }
      if (arg === '--threads') {
        const count = Number(value);
        if (!Number.isInteger(count) || count < 1 || count > MAX_THREADS)
          errors.push(`--threads: expected a whole number from 1 to ${MAX_THREADS}, got "${value}"`);
        else threads = count;
        continue;
      }
      const { field, kind } = VALUE_OPTIONS[arg];
      const number = Number(value);
      if (
        kind !== 'text' &&
        (value.trim() === '' || !Number.isFinite(number) || (kind === 'integer' && !Number.isInteger(number)))
      ) {
        errors.push(`${arg}: expected ${kind === 'integer' ? 'an integer' : 'a number'}, got "${value}"`);
        continue;
      }
      raw[field] = kind === 'text' ? value : number;
    } else if (arg.startsWith('-')) errors.push(`${arg}: unknown option`);
    else paths.push(arg);
  }
  if (paths.length !== 1)
    errors.push(
      paths.length === 0
        ? 'PATH: give the bundle .zip or folder'
        : `PATH: give exactly one, got ${paths.length}`,
    );
  const parsed = parseReplayOverrides(raw);
  if (!parsed.ok)
    for (const issue of parsed.issues)
      errors.push(`${OPTION_FOR_FIELD[issue.field] ?? issue.field}: ${issue.message}`);
  if (errors.length > 0 || !parsed.ok) return { ok: false, errors };
  return { ok: true, value: { path: paths[0], jsonFile, threads, overrides: parsed.overrides } };
}

/** How many probable causes the summary prints. */
const PRINTED_CAUSES = 3;

/** Summary lines for the top causes, with the caution that they support but do not replace judgement. */
function describeTopCauses(causes: ProbableCause[]): string[] {
  const top = causes.slice(0, PRINTED_CAUSES);
  return [
    `Probable causes: ${causes.length}${causes.length > top.length ? ` (top ${top.length})` : ''}`,
    ...top.map((cause, i) => {
      const support = cause.counterfactuals.find((run) => run.supports);
      return (
        `  ${i + 1}. ${cause.kind} ${cause.start.toFixed(1)}-${cause.end.toFixed(1)} s, confidence ${cause.confidence.toFixed(2)}: ${cause.evidence}` +
        (cause.against ? ` Against: ${cause.against}` : '') +
        (support ? ` Counterfactual: ${support.label} (digest ${support.digest.slice(0, 12)}).` : '')
      );
    }),
    `  ${CAUSES_CAUTION}`,
  ];
}

/** Plain array with null for NaN and infinities (JSON has neither). */
const toJsonArray = (values: ArrayLike<number>) => Array.from(values, (v) => (Number.isFinite(v) ? v : null));
const formatMetres = (value: number | null) => (value === null ? 'n/a (no file)' : `${value.toFixed(3)} m`);

/**
 * `replay PATH [options]`: replays a bundle's localization, prints a summary and optionally writes
 * the full result as JSON. Exit 0 done, 2 bad options or invalid bundle, 1 internal failure.
 */
export async function run(args: string[]): Promise<number> {
  const parsed = parseReplayArguments(args);
  if (!parsed.ok) {
    for (const error of parsed.errors) process.stderr.write(`${error}\n`);
    process.stderr.write(USAGE);
    return 2;
  }
  const { path, jsonFile, overrides } = parsed.value;
  const threads = parsed.value.threads ?? defaultReplayThreads();
  try {
    const info = await stat(path).catch(() => undefined);
    if (!info) {
      process.stderr.write(`${path}: no such file or folder\n`);
      return 2;
    }
    const source = { kind: info.isDirectory() ? 'folder' : 'zip', path } as const;
    const read = await readBundleSourceFiles(source);
    if (!read.ok) {
      for (const issue of read.issues) process.stderr.write(`${formatIssue(issue)}\n`);
      process.stderr.write(
        `${path}: invalid bundle, not replayed (run "npm run cli -- check ${path}" for the report)\n`,
      );
      return 2;
    }
    const split = threads > 1 ? createThreadSplit(threads, source) : undefined;
    const started = performance.now();
    let result: ReturnType<typeof replayBundle>;
    let safetyObserver: ReturnType<typeof createSafetyObserver> | undefined;
    try {
      const bundle = readBundleFiles(read.files);
      safetyObserver = createSafetyObserver(bundle);
      result = replayBundle(bundle, overrides, {
        adopt: split?.adopt,
        onStepState: safetyObserver.onStepState,
      });
    } catch (error) {
      if (!(error instanceof ReplayInputError)) throw error;
      for (const problem of error.problems) {
        const [field, ...rest] = problem.split(': ');
        process.stderr.write(
          `${OPTION_FOR_FIELD[field] ? [OPTION_FOR_FIELD[field], ...rest].join(': ') : problem}\n`,
        );
      }
      process.stderr.write(`${path}: not replayed\n`);
      return 2;
    } finally {
      await split?.close();
    }
    const elapsedMs = performance.now() - started;
    const { bundle, context, settings } = result;
    const engine = nodeEngineStamp();
    // The same analysis as API replays, so both report the same flags.
    const { flags, divergedAt } = analyseReplay(bundle, result, context);
    const causes = findProbableCauses({ ...result, flags });
    const { series, metrics } = result;
    const safety = safetyObserver ? safetyObserver.finish(series) : null;
    const minimum = safety?.min_clearance;
    process.stdout.write(
      [
        `Replay of ${path}`,
        `Steps: ${result.steps} (${series.t[0]?.toFixed(1) ?? 0} s to ${series.t[result.steps - 1]?.toFixed(1) ?? 0} s), particles: ${settings.particles}, seed: ${settings.seed}, resampling: ${settings.resampling.method} below ESS ${settings.resampling.threshold} N`,
        `Digest: ${result.digest} (engine ${engine.engine}, digest layout ${engine.digestLayout}, ${engine.runtime})`,
        `Elapsed: ${elapsedMs.toFixed(0)} ms on ${threads} thread${threads === 1 ? '' : 's'}`,
        `RMSE vs reference: ${formatMetres(metrics.rmse_reference)}; vs onboard: ${formatMetres(metrics.rmse_onboard)}`,
        `Minimum clearance: ${minimum ? `${minimum.value.toFixed(3)} m at ${minimum.t.toFixed(1)} s to the ${minimum.to} (${minimum.basis} pose)` : 'n/a'}; safety events: ${safety?.events.map((e) => `${e.kind} ${e.t.toFixed(1)} s suggested ${e.suggested_class}`).join('; ') || 'none'}`,
        'Caution: engineering estimates from recorded data; formal safety determinations defer to local regulations and licensed safety professionals.',
        `Flags: ${flags.length}${flags.length ? ` (${flags.map((flag) => `${flag.kind} ${flag.start.toFixed(1)}-${flag.end.toFixed(1)} s ${flag.severity}`).join('; ')})` : ''}`,
        ...describeTopCauses(causes),
        '',
      ].join('\n'),
    );
    if (jsonFile) {
      const output = {
        files: read.inspected.map(({ name, size, sha256 }) => ({ name, size, sha256 })),
        settings,
        steps: result.steps,
        digest: result.digest,
        engine,
        threads,
        elapsed_ms: Math.round(elapsedMs),
        metrics: { ...metrics, diverged_at: divergedAt },
        series: {
          t: toJsonArray(series.t),
          x: toJsonArray(series.x),
          y: toJsonArray(series.y),
          theta: toJsonArray(series.theta),
          ess: toJsonArray(series.ess),
          resampled: Array.from(series.resampled, (code) => code > 0),
          log_likelihood: toJsonArray(series.log_likelihood),
          error_reference: toJsonArray(series.error_reference),
          error_onboard: toJsonArray(series.error_onboard),
        },
        flags,
        safety,
        causes,
      };
      await writeFile(jsonFile, `${JSON.stringify(output)}\n`);
      process.stdout.write(`Wrote ${jsonFile}\n`);
    }
    return 0;
  } catch (error) {
    process.stderr.write(`Internal failure while replaying ${path}: ${(error as Error).message}\n`);
    return 1;
  }
}
