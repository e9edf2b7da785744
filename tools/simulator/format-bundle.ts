import { BUNDLE_FORMAT, type Manifest } from '../../shared/bundle/types';
import type { DetectorSettings } from './landmark-detector';
import type { ScanGeometry } from './laser-scanner';
import type { SimulationRecord } from './run-scenario';
import { TRUE_ODOMETRY_ALPHA } from './run-scenario';
import { toMapRows } from './sim-grid';
import { SITE_NAME } from './site-layout';

/** Scan and detector settings shared by every sample robot. */
export const SCAN_GEOMETRY: ScanGeometry = {
  mount: [0.2, 0.0, 0.0],
  angle_min: -2.35,
  angle_increment: 0.0174,
  beams: 271,
  range_min: 0.05,
  range_max: 12.0,
};

export const DETECTOR: DetectorSettings = {
  classes: ['reflector', 'dock', 'column'],
  confusion: [
    [0.9, 0.05, 0.05],
    [0.05, 0.9, 0.05],
    [0.04, 0.04, 0.92],
  ],
  range_sigma: 0.05,
  bearing_sigma: 0.02,
  max_range: 8.0,
  clutter: 0.05,
};

export const REFERENCE_SOURCE = 'ceiling-camera-survey';

/** Fixed-decimal text without a negative zero, so output is byte-stable. */
export function formatFixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

const time = (t: number) => formatFixed(t, 2);

function csv(header: string, rows: string[]): string {
  return `${header}\n${rows.join('\n')}\n`;
}

/** s between the detections of one frame. */
const DETECTION_SPACING = 0.001;
/** s between events logged in the same control step (a contact and the stop it causes). */
const EVENT_SPACING = 0.01;

/** Event times as text, nudging events of the same step apart in their logged order. */
function strictlyIncreasingTimes(times: number[]): string[] {
  let previous = Number.NEGATIVE_INFINITY;
  return times.map((t) => {
    const nudged = Math.max(t, previous + EVENT_SPACING);
    previous = nudged;
    return time(nudged);
  });
}

/** Free text goes into CSV unquoted, so it must not hold the separator or quotes. */
function assertPlainText(text: string, where: string): string {
  if (/[",\n\r]/.test(text))
    throw new Error(`${where}: "${text}" must not contain commas, quotes or newlines`);
  return text;
}

/**
 * The manifest: filter settings a correct particle filter should localize well with on the
 * healthy parts of the run. Motion alpha equal the simulated odometry noise; the initial belief
 * is a Gaussian a few centimetres off the true start, in the map frame.
 */
export function buildManifest(record: SimulationRecord): Manifest {
  const { spec } = record;
  return {
    format: BUNDLE_FORMAT,
    robot: spec.robot,
    site: SITE_NAME,
    start_time: spec.startTime,
    scan: SCAN_GEOMETRY,
    detector: DETECTOR,
    filter: {
      particles: 1000,
      seed: spec.seed % 1000,
      motion: { model: 'odometry', alpha: [...TRUE_ODOMETRY_ALPHA] },
      scan_model: { model: 'likelihood_field', z_hit: 0.9, z_rand: 0.1, sigma_hit: 0.12, beams_used: 60 },
      resampling: { method: 'systematic', threshold: 0.5 },
      initial: {
        mode: 'pose',
        x: Number((spec.start.x + 0.08).toFixed(3)),
        y: Number((spec.start.y - 0.05).toFixed(3)),
        theta: Number((spec.start.theta + 0.03).toFixed(4)),
        sigma_xy: 0.2,
        sigma_theta: 0.1,
      },
      ...(spec.recovery ? { recovery: spec.recovery } : {}),
    },
  };
}

/** File name → content of every bundle file for one run. */
export function formatBundle(record: SimulationRecord): Map<string, string> {
  const files = new Map<string, string>();
  const { grid, landmarks } = record.mapWorld;
  files.set('manifest.json', `${JSON.stringify(buildManifest(record), null, 2)}\n`);
  const map = {
    resolution: grid.resolution,
    origin: [grid.originX, grid.originY],
    width: grid.width,
    height: grid.height,
    rows: toMapRows(grid),
    landmarks: landmarks.map(({ id, class: kind, x, y }) => ({ id, class: kind, x, y })),
  };
  files.set('map.json', `${JSON.stringify(map, null, 1)}\n`);
  const pose = (p: { t: number; x: number; y: number; theta: number }) =>
    `${time(p.t)},${formatFixed(p.x, 4)},${formatFixed(p.y, 4)},${formatFixed(p.theta, 5)}`;
  files.set('odometry.csv', csv('t,x,y,theta', record.odometry.map(pose)));
  files.set(
    'scans.ndjson',
    record.scans
      .map(
        (s) =>
          `{"t":${time(s.t)},"ranges":[${s.ranges.map((r) => (r === null ? 'null' : formatFixed(r, 3))).join(',')}]}\n`,
      )
      .join(''),
  );
  const detectionRows: string[] = [];
  for (const frame of record.detections) {
    // The detector reports the landmarks of one frame one after another, a millisecond apart
    // (in bearing order), which keeps t strictly increasing as readers require.
    frame.detections.forEach((d, i) => {
      const t = formatFixed(frame.t + i * DETECTION_SPACING, 3);
      detectionRows.push(
        `${t},${DETECTOR.classes[d.classIndex]},${formatFixed(d.range, 3)},${formatFixed(d.bearing, 4)}`,
      );
    });
  }
  files.set('detections.csv', csv('t,class,range,bearing', detectionRows));
  files.set(
    'onboard_pose.csv',
    csv(
      't,x,y,theta,cov_xx,cov_xy,cov_yy,cov_tt',
      record.onboard.map(
        (p) =>
          `${pose(p)},${formatFixed(p.cov.xx, 7)},${formatFixed(p.cov.xy, 7)},${formatFixed(p.cov.yy, 7)},${formatFixed(p.cov.tt, 7)}`,
      ),
    ),
  );
  files.set(
    'events.csv',
    csv(
      't,kind,detail',
      strictlyIncreasingTimes(record.events.map((e) => e.t)).map(
        (t, i) =>
          `${t},${record.events[i].kind},${assertPlainText(record.events[i].detail, `${record.spec.name} event`)}`,
      ),
    ),
  );
  files.set(
    'commands.csv',
    csv(
      't,v,omega',
      record.commands.map((c) => `${time(c.t)},${formatFixed(c.v, 3)},${formatFixed(c.omega, 4)}`),
    ),
  );
  files.set(
    'reference_pose.csv',
    csv(
      't,x,y,theta,source',
      record.reference.map((p) => `${pose(p)},${REFERENCE_SOURCE}`),
    ),
  );
  return files;
}
