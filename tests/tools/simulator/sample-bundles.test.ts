import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Bundle } from '../../../shared/bundle/types';
import { BUNDLE_FILES } from '../../../shared/bundle/types';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import { castScan } from '../../../tools/simulator/laser-scanner';
import { SAMPLE_LOGS_DIR } from '../../../tools/simulator/make-samples';
import { buildSite } from '../../../tools/simulator/site-layout';

interface CatalogEntry {
  folder: string;
  duration: number;
  faults: { kind: string; start: number; end: number }[];
}
const catalog: { samples: CatalogEntry[] } = JSON.parse(
  readFileSync(join(SAMPLE_LOGS_DIR, 'catalog.json'), 'utf8'),
);

function readSample(folder: string): Bundle {
  const files: Record<string, string> = {};
  for (const name of readdirSync(join(SAMPLE_LOGS_DIR, folder))) {
    files[name] = readFileSync(join(SAMPLE_LOGS_DIR, folder, name), 'utf8');
  }
  const result = validateBundleFiles(files);
  if (!result.ok) throw new Error(`${folder}: ${JSON.stringify(result.issues.slice(0, 3))}`);
  return result.bundle;
}

/** Index of the row of `t` (sorted) nearest to `time`. */
function nearestRow(t: Float64Array, time: number): number {
  let best = 0;
  for (let i = 1; i < t.length; i++) if (Math.abs(t[i] - time) < Math.abs(t[best] - time)) best = i;
  return best;
}

describe.each(catalog.samples.map((s) => [s.folder, s] as const))('sample %s', (folder, entry) => {
  it('holds exactly bundle files and passes the bundle validator', () => {
    const names = readdirSync(join(SAMPLE_LOGS_DIR, folder)).sort();
    expect(names).toEqual([...BUNDLE_FILES].sort());
    const bundle = readSample(folder);
    expect(bundle.odometry.t.length).toBe(Math.round(entry.duration * 10));
    for (const fault of entry.faults) {
      expect(fault.start).toBeLessThan(fault.end);
      expect(fault.end).toBeLessThanOrEqual(entry.duration);
    }
  });

  // Geometry, common practice: on a correct map, a scan taken at the true pose matches a ray cast
  // of the map from that pose up to the range noise, except where the world changed.
  it('has scans that match the map from the reference pose before any fault', () => {
    const bundle = readSample(folder);
    const { grid } = buildSite();
    const scans = bundle.scans!;
    const reference = bundle.reference!;
    const firstFault = Math.min(...entry.faults.map((f) => f.start), entry.duration);
    const residuals: number[] = [];
    for (let s = 5; s < scans.count && scans.t[s] < firstFault - 1; s += 25) {
      const row = nearestRow(reference.t, scans.t[s]);
      const pose = { x: reference.x[row], y: reference.y[row], theta: reference.theta[row] };
      const expected = castScan(grid, pose, bundle.manifest.scan!);
      for (let k = 0; k < scans.beams; k += 5) {
        const measured = scans.ranges[s * scans.beams + k];
        if (Number.isFinite(measured) && Number.isFinite(expected[k]))
          residuals.push(Math.abs(measured - expected[k]));
      }
    }
    residuals.sort((a, b) => a - b);
    expect(residuals.length).toBeGreaterThan(200);
    // Reference noise (1.5 cm, 0.01 rad) and range noise (2 cm) leave a median residual of a few cm.
    expect(residuals[Math.floor(residuals.length / 2)]).toBeLessThan(0.08);
  });

  it('lets the onboard estimate go wrong and an event follow each fault', () => {
    const bundle = readSample(folder);
    const onboard = bundle.onboard!;
    const reference = bundle.reference!;
    const events = bundle.events!;
    for (const fault of entry.faults) {
      let worstError = 0;
      for (let i = 0; i < reference.t.length; i++) {
        if (reference.t[i] < fault.start || reference.t[i] > fault.end + 15) continue;
        const row = nearestRow(onboard.t, reference.t[i]);
        worstError = Math.max(
          worstError,
          Math.hypot(onboard.x[row] - reference.x[i], onboard.y[row] - reference.y[i]),
        );
      }
      expect(worstError, `${fault.kind}: onboard error after the fault`).toBeGreaterThan(0.3);
      const consequence = events.kind.findIndex(
        (kind, i) => ['protective_stop', 'contact'].includes(kind) && events.t[i] >= fault.start,
      );
      expect(consequence, `${fault.kind}: a stop or contact after the fault`).toBeGreaterThanOrEqual(0);
    }
  });
});
