import type { IssueCollector } from './issue-collector';
import { parseJsonText, parseWithSchema } from './json-file';
import { ZMapFile } from './map-schema';
import { CELL_FREE, CELL_OCCUPIED, CELL_UNKNOWN, type SiteMap } from './types';

const FILE = 'map.json';
const CELL_CODES: Record<string, number> = { '.': CELL_FREE, '#': CELL_OCCUPIED, '?': CELL_UNKNOWN };

/** Parses and checks map.json into a `SiteMap` with a packed cell grid; undefined when unusable. */
export function parseSiteMap(text: string, issues: IssueCollector): SiteMap | undefined {
  const input = parseJsonText(FILE, text, issues);
  if (input === undefined) return undefined;
  const file = parseWithSchema(FILE, ZMapFile, input, issues);
  if (!file) return undefined;
  const before = issues.errorCount;
  const report = (field: string, message: string, expected?: string, found?: string) =>
    issues.add({ file: FILE, field, message, expected, found });

  const { resolution, origin, width, height } = file;
  const landmarks = file.landmarks ?? [];
  const ids = new Set<string>();
  landmarks.forEach((landmark, index) => {
    if (ids.has(landmark.id))
      report(`landmarks[${index}].id`, 'duplicate landmark id', 'a unique id', landmark.id);
    ids.add(landmark.id);
  });
  if (!file.rows && landmarks.length === 0)
    report('(root)', 'map has neither rows nor landmarks', 'rows and/or landmarks');

  let cells: Uint8Array | undefined;
  if (file.rows) {
    if (file.rows.length !== height)
      report('rows', 'number of rows differs from height', String(height), String(file.rows.length));
    cells = new Uint8Array(width * height);
    file.rows.forEach((row, i) => {
      if (row.length !== width) {
        report(
          `rows[${i}]`,
          'row length differs from width',
          `${width} characters`,
          `${row.length} characters`,
        );
        return;
      }
      if (i >= height) return;
      for (let j = 0; j < width; j++) cells![i * width + j] = CELL_CODES[row[j]];
    });
  }
  if (issues.errorCount !== before) return undefined;
  const map: SiteMap = { resolution, origin, width, height, landmarks };
  if (cells) map.grid = { resolution, width, height, origin, cells };
  return map;
}
