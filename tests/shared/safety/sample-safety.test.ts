/**
 * The separation and stopping analysis on the committed samples, checked against the simulator's
 * own ground truth: it re-runs each scenario (deterministic, byte-identical to the committed files)
 * and measures the true clearance from the TRUE pose to the TRUE site (moved rack included) with
 * the simulator's own clearance function, independent of shared/safety.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readBundleFiles, replayBundle } from '../../../shared/engine';
import { createSafetyObserver } from '../../../shared/safety/safety-observer';
import type { SafetyReport } from '../../../shared/safety/safety-report';
import { SAMPLE_LOGS_DIR, simulateSample } from '../../../tools/simulator/make-samples';
import { SAMPLE_SCENARIOS } from '../../../tools/simulator/sample-scenarios';
import { clearanceAt } from '../../../tools/simulator/sim-grid';
import { buildSite } from '../../../tools/simulator/site-layout';

function analyseSample(name: string): { safety: SafetyReport; truth: { t: number; clearance: number }[] } {
  const files: Record<string, string> = {};
  for (const file of readdirSync(join(SAMPLE_LOGS_DIR, name)))
    files[file] = readFileSync(join(SAMPLE_LOGS_DIR, name, file), 'utf8');
  const bundle = readBundleFiles(files);
  const observer = createSafetyObserver(bundle);
  const result = replayBundle(bundle, {}, { onStepState: observer.onStepState });
  const spec = SAMPLE_SCENARIOS.find((s) => s.name === name)!;
  const world = buildSite(spec.world);
  const footprint = spec.robot.footprint;
  if (footprint.shape !== 'circle') throw new Error('the samples use circular footprints');
  const record = simulateSample(spec);
  const truth = record.truth.map((pose) => ({
    t: pose.t,
    clearance: clearanceAt(world.grid, pose.x, pose.y, 3) - footprint.radius,
  }));
  return { safety: observer.finish(result.series), truth };
}

const cache = new Map<string, ReturnType<typeof analyseSample>>();
const sample = (name: string) => {
  if (!cache.has(name)) cache.set(name, analyseSample(name));
  return cache.get(name)!;
};

describe.each(SAMPLE_SCENARIOS.map((s) => s.name))('sample %s', (name) => {
  it('finds the minimum clearance the simulator measured, within 0.05 m and 1 s', {
    timeout: 240_000,
  }, () => {
    const { safety, truth } = sample(name);
    const trueMinimum = Math.min(...truth.map((p) => p.clearance));
    expect(safety.min_clearance).not.toBeNull();
    const found = safety.min_clearance!;
    expect(found.basis).toBe('reference');
    expect(Math.abs(found.value - Math.max(0, trueMinimum))).toBeLessThanOrEqual(0.05);
    // "When": within 1 s of a moment the true clearance was at its minimum (within 0.05 m). A
    // robot held at a stop sits at its minimum for seconds, so any moment of that hold counts.
    const nearMinimum = truth.filter(
      (p) => p.clearance <= trueMinimum + 0.05 && Math.abs(p.t - found.t) <= 1,
    );
    expect(nearMinimum.length).toBeGreaterThan(0);
  });

  it('labels every class a suggestion and carries the caution', () => {
    const { safety } = sample(name);
    expect(safety.caution).toMatch(/does not replace a formal safety determination/);
    for (const event of safety.events) expect(event.reason).toMatch(/^Suggestion: /);
  });
});

describe('what the samples must show', () => {
  it('healthy-shift: the stopping margin never goes negative', () => {
    const { safety } = sample('healthy-shift');
    const margins = safety.series.stopping_margin.filter((m): m is number => m !== null);
    expect(margins.length).toBeGreaterThan(100);
    expect(Math.min(...margins)).toBeGreaterThanOrEqual(0);
  });

  it('moved-rack: the contact is classed contact, and before it the robot believed more room than it had', () => {
    const { safety } = sample('moved-rack');
    const contact = safety.events.find((e) => e.kind === 'contact')!;
    expect(contact.suggested_class).toBe('contact');
    const stop = safety.events.find((e) => e.kind === 'protective_stop')!;
    expect(stop.t).toBeLessThan(contact.t);
    // The belief-vs-reality gap before the event: believed (onboard vs map) well above had (reference vs scans).
    expect(stop.clearance_believed! - stop.clearance!).toBeGreaterThan(0.2);
    // Most of it is the rack the map does not show, seen by the scans.
    expect(stop.map_gap!).toBeGreaterThan(stop.localization_gap!);
    expect(stop.margin_negative_since).not.toBeNull();
    expect(stop.margin_negative_since!).toBeLessThanOrEqual(stop.t);
  });

  it('wheel-slip: the stop that ended short of contact is a near miss, and localization error made the gap', () => {
    const { safety } = sample('wheel-slip');
    const stop = safety.events.find((e) => e.kind === 'protective_stop')!;
    expect(safety.events.some((e) => e.kind === 'contact')).toBe(false);
    expect(stop.suggested_class).toBe('near_miss');
    expect(stop.clearance_believed! - stop.clearance!).toBeGreaterThan(0.2);
    expect(stop.localization_gap!).toBeGreaterThan(0.2);
    expect(stop.margin_negative_since).not.toBeNull();
  });
});
