import type { CsvColumnSpec, CsvTableSpec } from './csv-table-reader';

const time: CsvColumnSpec = { name: 't', kind: 'time' };
const poseColumns: CsvColumnSpec[] = [
  time,
  { name: 'x', kind: 'number' },
  { name: 'y', kind: 'number' },
  { name: 'theta', kind: 'angle' },
];

/** CSV tables of format incident-bundle/1, by file name (see docs/bundle-format.md). */
export const ODOMETRY_SPEC: CsvTableSpec = { columns: poseColumns, timeOrder: 'strict', requireRows: true };

export const ONBOARD_POSE_SPEC: CsvTableSpec = {
  columns: poseColumns,
  optionalColumns: [
    { name: 'cov_xx', kind: 'non_negative' },
    { name: 'cov_xy', kind: 'number' },
    { name: 'cov_yy', kind: 'non_negative' },
    { name: 'cov_tt', kind: 'non_negative' },
  ],
  timeOrder: 'strict',
};

export const REFERENCE_POSE_SPEC: CsvTableSpec = {
  columns: [...poseColumns, { name: 'source', kind: 'text' }],
  timeOrder: 'strict',
};

export const COMMANDS_SPEC: CsvTableSpec = {
  columns: [time, { name: 'v', kind: 'number' }, { name: 'omega', kind: 'number' }],
  timeOrder: 'strict',
};

/** Several events can share one instant (a contact and the protective stop it triggers). */
export const EVENTS_SPEC: CsvTableSpec = {
  columns: [time, { name: 'kind', kind: 'text' }, { name: 'detail', kind: 'text' }],
  timeOrder: 'non_decreasing',
};

/**
 * `classes` are the detector's classes from the manifest; undefined when it could not be read.
 * One camera frame can see several landmarks, so detections may share a `t`.
 */
export function detectionsSpec(classes: readonly string[] | undefined): CsvTableSpec {
  return {
    columns: [
      time,
      { name: 'class', kind: 'category' },
      { name: 'range', kind: 'non_negative' },
      { name: 'bearing', kind: 'angle' },
    ],
    timeOrder: 'non_decreasing',
    categories: classes,
  };
}

/** Event kinds with a fixed meaning; other kinds are kept and shown as they are. */
export const KNOWN_EVENT_KINDS = [
  'contact',
  'protective_stop',
  'emergency_stop',
  'warning_field',
  'operator_note',
] as const;
