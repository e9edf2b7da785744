import type { IssueCollector } from './issue-collector';
import { parseJsonText, parseWithSchema } from './json-file';
import { ZManifest } from './manifest-schema';
import type { Manifest } from './types';

const FILE = 'manifest.json';
/** Rows of a probability matrix are accepted as summing to 1 within this tolerance. */
export const CONFUSION_ROW_TOLERANCE = 1e-6;

/** Parses and checks manifest.json; returns undefined (with issues) when it cannot be used. */
export function parseManifest(text: string, issues: IssueCollector): Manifest | undefined {
  const input = parseJsonText(FILE, text, issues);
  if (input === undefined) return undefined;
  const manifest = parseWithSchema(FILE, ZManifest, input, issues);
  if (!manifest) return undefined;
  return checkManifestFields(manifest, issues) ? manifest : undefined;
}

/** Checks that relate one field to another, which JSON Schema cannot express. Returns true when all pass. */
export function checkManifestFields(manifest: Manifest, issues: IssueCollector): boolean {
  const before = issues.errorCount;
  const report = (field: string, message: string, expected?: string, found?: string) =>
    issues.add({ file: FILE, field, message, expected, found });

  const { scan, detector, filter } = manifest;
  if (scan && scan.range_min >= scan.range_max) {
    report(
      'scan.range_min',
      'range_min must be below range_max',
      `< ${scan.range_max}`,
      String(scan.range_min),
    );
  }
  if (detector) {
    const size = detector.classes.length;
    if (new Set(detector.classes).size !== size) report('detector.classes', 'class names must be unique');
    if (detector.confusion.length !== size) {
      report(
        'detector.confusion',
        'confusion must have one row per class',
        `${size} rows`,
        `${detector.confusion.length} rows`,
      );
    }
    detector.confusion.forEach((row, index) => {
      const field = `detector.confusion[${index}]`;
      if (row.length !== size)
        report(
          field,
          'confusion row must have one entry per class',
          `${size} entries`,
          `${row.length} entries`,
        );
      const sum = row.reduce((total, value) => total + value, 0);
      if (Math.abs(sum - 1) > CONFUSION_ROW_TOLERANCE) {
        report(
          field,
          'confusion row does not sum to 1',
          `1 (within ${CONFUSION_ROW_TOLERANCE})`,
          String(sum),
        );
      }
    });
  }
  if (filter.recovery && filter.recovery.alpha_slow >= filter.recovery.alpha_fast) {
    // The short-term average must react faster than the long-term one, or recovery never triggers.
    report(
      'filter.recovery.alpha_slow',
      'alpha_slow must be smaller than alpha_fast',
      `< ${filter.recovery.alpha_fast}`,
      String(filter.recovery.alpha_slow),
    );
  }
  if (filter.kld && filter.kld.min_particles > filter.kld.max_particles) {
    report(
      'filter.kld.min_particles',
      'min_particles must not exceed max_particles',
      `<= ${filter.kld.max_particles}`,
      String(filter.kld.min_particles),
    );
  }
  if (
    filter.scan_model &&
    Math.abs(filter.scan_model.z_hit + filter.scan_model.z_rand - 1) > CONFUSION_ROW_TOLERANCE
  ) {
    issues.add({
      file: FILE,
      field: 'filter.scan_model',
      message: 'z_hit + z_rand should be 1 (the model will renormalise them)',
      found: String(filter.scan_model.z_hit + filter.scan_model.z_rand),
      severity: 'warning',
    });
  }
  return issues.errorCount === before;
}
