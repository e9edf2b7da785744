import type { Bundle, PoseColumns } from '@shared/bundle/types';
import {
  Field,
  Float32,
  List,
  makeData,
  makeVector,
  Table,
  Utf8,
  type Vector,
  vectorFromArray,
} from 'apache-arrow';

/**
 * Columnar copies of a bundle's tables for the browser (DuckDB-wasm). Names are the file stems.
 * Scans keep one row per scan with `ranges` as List<Float32>, null where the sensor had no return,
 * so a scan stays one row as in the file.
 */
export function bundleToArrowTables(bundle: Bundle): Map<string, Table> {
  const tables = new Map<string, Table>();
  tables.set('odometry', poseTable(bundle.odometry));
  if (bundle.scans) tables.set('scans', scanTable(bundle.scans));
  if (bundle.detections) {
    const classes = bundle.manifest.detector?.classes ?? [];
    const { t, classIndex, range, bearing } = bundle.detections;
    const names = Array.from(classIndex, (index) => classes[index] ?? '');
    tables.set(
      'detections',
      new Table({
        t: makeVector(t),
        class: text(names),
        range: makeVector(range),
        bearing: makeVector(bearing),
      }),
    );
  }
  if (bundle.onboard) {
    const { cov } = bundle.onboard;
    const columns: Record<string, Vector> = poseVectors(bundle.onboard);
    if (cov)
      Object.assign(columns, {
        cov_xx: makeVector(cov.xx),
        cov_xy: makeVector(cov.xy),
        cov_yy: makeVector(cov.yy),
        cov_tt: makeVector(cov.tt),
      });
    tables.set('onboard_pose', new Table(columns));
  }
  if (bundle.events) {
    const { t, kind, detail } = bundle.events;
    tables.set('events', new Table({ t: makeVector(t), kind: text(kind), detail: text(detail) }));
  }
  if (bundle.commands) {
    const { t, v, omega } = bundle.commands;
    tables.set('commands', new Table({ t: makeVector(t), v: makeVector(v), omega: makeVector(omega) }));
  }
  if (bundle.reference) {
    tables.set(
      'reference_pose',
      new Table({ ...poseVectors(bundle.reference), source: text(bundle.reference.source) }),
    );
  }
  return tables;
}

function text(values: string[]) {
  return vectorFromArray(values, new Utf8());
}

function poseVectors(pose: PoseColumns) {
  return {
    t: makeVector(pose.t),
    x: makeVector(pose.x),
    y: makeVector(pose.y),
    theta: makeVector(pose.theta),
  };
}

function poseTable(pose: PoseColumns): Table {
  return new Table(poseVectors(pose));
}

function scanTable(scans: NonNullable<Bundle['scans']>): Table {
  const { count, beams, ranges } = scans;
  const valueOffsets = new Int32Array(count + 1);
  for (let k = 0; k <= count; k++) valueOffsets[k] = k * beams;
  // Arrow validity bitmap: bit set = value present; NaN in the parsed table means "no return".
  const validity = new Uint8Array(Math.ceil(ranges.length / 8));
  let nullCount = 0;
  for (let k = 0; k < ranges.length; k++) {
    if (Number.isNaN(ranges[k])) nullCount++;
    else validity[k >> 3] |= 1 << (k & 7);
  }
  const item = new Field('item', new Float32(), true);
  const rangeData = makeData({
    type: new Float32(),
    length: ranges.length,
    nullCount,
    nullBitmap: validity,
    data: ranges,
  });
  const listData = makeData({
    type: new List(item),
    length: count,
    nullCount: 0,
    valueOffsets,
    child: rangeData,
  });
  const index = Int32Array.from({ length: count }, (_, k) => k);
  return new Table({ t: makeVector(scans.t), scan_index: makeVector(index), ranges: makeVector(listData) });
}
