import type { CsvColumns } from './csv-table-reader';
import type {
  CommandTable,
  DetectionTable,
  EventTable,
  OdometryTable,
  OnboardPoseTable,
  PoseColumns,
  ReferencePoseTable,
} from './types';

/** Converters from generic parsed columns to the typed tables of `Bundle`. */

function poseColumns(columns: CsvColumns): PoseColumns {
  const { t, x, y, theta } = columns.numbers;
  return { t, x, y, theta };
}

export function toOdometryTable(columns: CsvColumns): OdometryTable {
  return poseColumns(columns);
}

export function toOnboardPoseTable(columns: CsvColumns): OnboardPoseTable {
  const table: OnboardPoseTable = poseColumns(columns);
  if (columns.hasOptionalColumns) {
    const { cov_xx, cov_xy, cov_yy, cov_tt } = columns.numbers;
    table.cov = { xx: cov_xx, xy: cov_xy, yy: cov_yy, tt: cov_tt };
  }
  return table;
}

export function toReferencePoseTable(columns: CsvColumns): ReferencePoseTable {
  return { ...poseColumns(columns), source: columns.texts.source };
}

export function toCommandTable(columns: CsvColumns): CommandTable {
  const { t, v, omega } = columns.numbers;
  return { t, v, omega };
}

export function toEventTable(columns: CsvColumns): EventTable {
  return { t: columns.numbers.t, kind: columns.texts.kind, detail: columns.texts.detail };
}

export function toDetectionTable(columns: CsvColumns): DetectionTable {
  const { t, range, bearing } = columns.numbers;
  return { t, classIndex: columns.categories.class, range, bearing };
}
