import { type CsvColumns, type CsvTableSpec, createCsvTableReader } from './csv-table-reader';
import {
  toCommandTable,
  toDetectionTable,
  toEventTable,
  toOdometryTable,
  toOnboardPoseTable,
  toReferencePoseTable,
} from './csv-tables';
import { IssueCollector } from './issue-collector';
import { parseManifest } from './parse-manifest';
import { parseSiteMap } from './parse-site-map';
import { createScanReader } from './scan-reader';
import {
  COMMANDS_SPEC,
  detectionsSpec,
  EVENTS_SPEC,
  ODOMETRY_SPEC,
  ONBOARD_POSE_SPEC,
  REFERENCE_POSE_SPEC,
} from './table-specs';
import {
  BUNDLE_FILES,
  type Bundle,
  type BundleFileName,
  type BundleIssue,
  type Manifest,
  REQUIRED_BUNDLE_FILES,
  type SiteMap,
} from './types';

/** Table files: everything in the bundle except the two JSON documents. */
export type TableFileName = Exclude<BundleFileName, 'manifest.json' | 'map.json'>;

export type BundleReadResult =
  | { ok: true; bundle: Bundle; issues: BundleIssue[] }
  | { ok: false; issues: BundleIssue[] };

/** Receives a table file line by line; `finish()` once its last line has been pushed. */
export interface TableSink {
  pushLine(text: string, lineNumber: number): void;
  finish(): void;
}

export interface BundleReader {
  readManifest(text: string): void;
  readMap(text: string): void;
  /** Call after `readManifest` (scans and detections are checked against it). */
  openTable(name: TableFileName): TableSink;
  /** Any other file: kept as evidence, reported as a warning. */
  noteExtraFile(name: string): void;
  /** Adds a problem found outside the parsers (I/O, zip safety). */
  addIssue(issue: BundleIssue): void;
  finish(): BundleReadResult;
}

export function isBundleFileName(name: string): name is BundleFileName {
  return (BUNDLE_FILES as readonly string[]).includes(name);
}

const CSV_TABLES: Record<Exclude<TableFileName, 'scans.ndjson' | 'detections.csv'>, CsvTableSpec> = {
  'odometry.csv': ODOMETRY_SPEC,
  'onboard_pose.csv': ONBOARD_POSE_SPEC,
  'events.csv': EVENTS_SPEC,
  'commands.csv': COMMANDS_SPEC,
  'reference_pose.csv': REFERENCE_POSE_SPEC,
};

/**
 * Assembles a `Bundle` from files fed one at a time, collecting every issue (up to a limit).
 * Pure: the caller does the I/O, so the same reader serves strings in tests and streams in the API.
 */
export function createBundleReader(issueLimit?: number): BundleReader {
  const issues = new IssueCollector(issueLimit);
  const present = new Set<string>();
  let manifest: Manifest | undefined;
  let map: SiteMap | undefined;
  const tables = new Map<TableFileName, unknown>();

  function csvSink(name: TableFileName, spec: CsvTableSpec): TableSink {
    const reader = createCsvTableReader(name, spec, issues);
    return { pushLine: reader.pushLine, finish: () => tables.set(name, reader.finish()) };
  }

  return {
    readManifest(text) {
      present.add('manifest.json');
      manifest = parseManifest(text, issues);
    },
    readMap(text) {
      present.add('map.json');
      map = parseSiteMap(text, issues);
    },
    openTable(name) {
      present.add(name);
      const isManifestUsable = manifest !== undefined;
      if (name === 'scans.ndjson') {
        if (isManifestUsable && !manifest!.scan) {
          issues.add({
            file: 'manifest.json',
            field: 'scan',
            message: 'scans.ndjson is present but the manifest has no scan block',
          });
        }
        const reader = createScanReader(manifest?.scan?.beams, issues);
        return { pushLine: reader.pushLine, finish: () => tables.set(name, reader.finish()) };
      }
      if (name === 'detections.csv') {
        if (isManifestUsable && !manifest!.detector) {
          issues.add({
            file: 'manifest.json',
            field: 'detector',
            message: 'detections.csv is present but the manifest has no detector block',
          });
        }
        return csvSink(name, detectionsSpec(manifest?.detector?.classes));
      }
      return csvSink(name, CSV_TABLES[name]);
    },
    noteExtraFile(name) {
      issues.add({
        file: name,
        message: 'unknown file: not part of the bundle format; kept but not read',
        severity: 'warning',
      });
    },
    addIssue(issue) {
      issues.add(issue);
    },
    finish() {
      for (const name of REQUIRED_BUNDLE_FILES) {
        if (!present.has(name)) issues.add({ file: name, message: 'required file is missing' });
      }
      if (manifest && map) checkManifestAgainstMap(manifest, map, issues);
      const odometry = tables.get('odometry.csv') as CsvColumns | undefined;
      if (issues.hasErrors() || !manifest || !map || !odometry) return { ok: false, issues: issues.finish() };
      const bundle: Bundle = { manifest, map, odometry: toOdometryTable(odometry) };
      const csv = (name: TableFileName) => tables.get(name) as CsvColumns | undefined;
      if (tables.has('scans.ndjson')) bundle.scans = tables.get('scans.ndjson') as Bundle['scans'];
      if (csv('detections.csv')) bundle.detections = toDetectionTable(csv('detections.csv')!);
      if (csv('onboard_pose.csv')) bundle.onboard = toOnboardPoseTable(csv('onboard_pose.csv')!);
      if (csv('events.csv')) bundle.events = toEventTable(csv('events.csv')!);
      if (csv('commands.csv')) bundle.commands = toCommandTable(csv('commands.csv')!);
      if (csv('reference_pose.csv')) bundle.reference = toReferencePoseTable(csv('reference_pose.csv')!);
      return { ok: true, bundle, issues: issues.finish() };
    },
  };
}

function checkManifestAgainstMap(manifest: Manifest, map: SiteMap, issues: IssueCollector): void {
  if (manifest.filter.initial.mode === 'global' && !map.grid) {
    issues.add({
      file: 'manifest.json',
      field: 'filter.initial.mode',
      message: 'global initialisation spreads particles over free grid cells, but map.json has no rows',
      expected: '"pose", or a map with rows',
      found: '"global"',
    });
  }
  const classes = manifest.detector?.classes;
  if (!classes) return;
  map.landmarks.forEach((landmark, index) => {
    if (!classes.includes(landmark.class)) {
      issues.add({
        file: 'map.json',
        field: `landmarks[${index}].class`,
        message: 'landmark class is not one of the detector classes',
        expected: `one of ${classes.join(', ')}`,
        found: JSON.stringify(landmark.class),
      });
    }
  });
}
