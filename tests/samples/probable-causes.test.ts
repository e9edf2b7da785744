/**
 * Probable causes on the committed sample incidents. The expected cause of each sample is the
 * fault the simulator injected (sample-logs/catalog.json, written by tools/simulator from the
 * scenario, not by the cause finder): the top cause must be that kind, overlap the injected
 * interval, and cite a counterfactual replay that supports it and re-runs to the same digest.
 * The fault-free sample must get no fault cause at confidence 0.5 or more.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { replayFromFiles } from '../../shared/engine';
import { NON_FAULT_KINDS, type ProbableCause } from '../../shared/engine/causes/cause-types';
import { replayCounterfactual } from '../../shared/engine/causes/counterfactual-bundle';
import { findProbableCauses } from '../../shared/engine/causes/find-probable-causes';
import { detectFlags } from '../../shared/engine/flags/detect-flags';
import { readSampleFiles, SAMPLES_DIR } from './golden-cases';

/** Injected fault kind (catalog.json) → the cause kind that names it (docs/causes.md). */
const EXPECTED_CAUSE: Record<string, string> = {
  wheel_slip: 'odometry_fault',
  kidnap: 'external_displacement',
  moved_rack: 'map_changed',
  degraded_sensor: 'sensor_degraded',
};
/** The top cause's interval must come within this many seconds of the injected one. */
const OVERLAP_SLACK = 3;

interface CatalogSample {
  folder: string;
  faults: { kind: string; start: number; end: number }[];
}
const catalog: { samples: CatalogSample[] } = JSON.parse(
  readFileSync(join(SAMPLES_DIR, 'catalog.json'), 'utf8'),
);

function causesOf(folder: string): { causes: ProbableCause[]; replay: ReturnType<typeof replayFromFiles> } {
  const replay = replayFromFiles(readSampleFiles(folder), {}, { keyframeInterval: 0 });
  const flags = detectFlags({ ...replay, context: replay.context });
  const causes = findProbableCauses({ ...replay, flags });
  return { causes, replay };
}

const describeCauses = (causes: ProbableCause[]) =>
  causes.map((c) => `${c.kind} ${c.start.toFixed(1)}-${c.end.toFixed(1)} s ${c.confidence}`).join('; ');

describe.each(catalog.samples.map((sample) => [sample.folder, sample] as const))('%s', (_folder, sample) => {
  let found: ReturnType<typeof causesOf>;
  beforeAll(() => {
    found = causesOf(sample.folder);
  }, 120_000);

  it('lists causes highest confidence first, each confidence in [0, 1], none above 0.5 without a supporting counterfactual', () => {
    const { causes } = found;
    expect(causes.length).toBeGreaterThan(0);
    for (let i = 1; i < causes.length; i++)
      expect(causes[i - 1].confidence).toBeGreaterThanOrEqual(causes[i].confidence);
    for (const cause of causes) {
      expect(cause.confidence).toBeGreaterThanOrEqual(0);
      expect(cause.confidence).toBeLessThanOrEqual(1);
      if (cause.kind !== 'none' && !cause.counterfactuals.some((run) => run.supports))
        expect(cause.confidence, `${cause.kind}: ${cause.evidence}`).toBeLessThan(0.5);
    }
  });

  if (sample.faults.length === 0) {
    it('gets no fault cause at confidence 0.5 or more', () => {
      const faults = found.causes.filter((c) => !NON_FAULT_KINDS.includes(c.kind) && c.confidence >= 0.5);
      expect(faults, describeCauses(found.causes)).toEqual([]);
    });
  }

  for (const fault of sample.faults) {
    it(`puts the injected ${fault.kind} first, as ${EXPECTED_CAUSE[fault.kind]}, backed by a counterfactual that re-runs`, () => {
      const [top] = found.causes;
      expect(top.kind, describeCauses(found.causes)).toBe(EXPECTED_CAUSE[fault.kind]);
      expect(top.confidence).toBeGreaterThanOrEqual(0.5);
      expect(top.start).toBeLessThanOrEqual(fault.end + OVERLAP_SLACK);
      expect(top.end).toBeGreaterThanOrEqual(fault.start - OVERLAP_SLACK);
      const support = top.counterfactuals.find((run) => run.supports);
      expect(support, top.against).toBeDefined();
      expect(top.evidence).toMatch(/\d/);
      // The archive's promise: the counterfactual is an ordinary replay its settings reproduce.
      expect(replayCounterfactual(found.replay.bundle, support!.settings).digest).toBe(support!.digest);
    });
  }
});
