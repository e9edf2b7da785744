import * as layout from '../../../shared/archive/archive-layout';
import { seriesColumnsToCsv } from '../../../shared/archive/series-csv';
import type { CaseEvidence } from './collect-case-evidence';

/** One archive file: small ones are made in memory, originals are streamed from the evidence store. */
export type ArchiveEntry =
  | { path: string; data: Buffer }
  | { path: string; file: string; expectedSha256: string; expectedSize: number };

const json = (path: string, value: unknown): ArchiveEntry => ({
  path,
  data: Buffer.from(`${JSON.stringify(value, null, 2)}\n`, 'utf8'),
});
const text = (path: string, value: string): ArchiveEntry => ({ path, data: Buffer.from(value, 'utf8') });

/**
 * The content files of a case archive in their fixed order (everything but report.html and the
 * manifest). Only recorded facts go in, never the time of export, so unchanged evidence gives
 * identical files.
 */
export function buildArchiveEntries(evidence: CaseEvidence): ArchiveEntry[] {
  const entries: ArchiveEntry[] = [json(layout.CASE_PATH, evidence.caseRecord)];
  for (const { record, originalPath } of evidence.bundles) {
    entries.push({
      path: layout.bundleOriginalPath(record.sha256),
      file: originalPath,
      expectedSha256: record.sha256,
      expectedSize: record.sizeBytes,
    });
    const { tables: _derivedTables, ...validation } = record;
    entries.push(json(layout.bundleValidationPath(record.sha256), validation));
  }
  entries.push(...recordingOriginalEntries(evidence));
  for (const { replay, bundleSha256, result, series, safety } of evidence.replays) {
    const file = (name: Parameters<typeof layout.replayFilePath>[1]) =>
      layout.replayFilePath(replay.id, name);
    entries.push(
      json(file('replay.json'), {
        id: replay.id,
        bundleId: replay.bundleId,
        bundleSha256,
        bundlePath: layout.bundleOriginalPath(bundleSha256),
        label: replay.label,
        overrides: replay.overrides,
        steps: result.steps,
        // Engine version, digest layout and runtime behind `digest` (absent: layout 1, engine 1.x).
        engine: result.engine ?? null,
        createdBy: replay.createdBy,
        createdAt: replay.createdAt,
        finishedAt: replay.finishedAt,
      }),
      json(file('settings.json'), result.settings),
      text(file('digest'), `${result.digest}\n`),
      text(file('series.csv'), seriesColumnsToCsv(series)),
      json(file('flags.json'), result.flags),
      json(file('metrics.json'), { ...result.metrics, neesBound: result.neesBound }),
    );
    // The separation and stopping analysis, caution included, exactly as the API served it.
    if (safety) entries.push(json(file('safety.json'), safety));
  }
  for (const version of evidence.findings) {
    const { canonical, reviews, ...rest } = version;
    entries.push(
      json(layout.findingsVersionPath(version.version, 'version.json'), {
        ...rest,
        reviews: reviews.map(({ jws, ...review }) => ({ ...review, hasSignature: jws !== null })),
      }),
      text(layout.findingsVersionPath(version.version, 'canonical.json'), canonical),
    );
    reviews
      .filter((review) => review.jws)
      .forEach((review, index) => {
        entries.push(text(layout.findingsSignaturePath(version.version, index), review.jws as string));
      });
  }
  entries.push(json(layout.JWKS_PATH, evidence.jwks), json(layout.FIXES_PATH, evidence.fixes));
  if (evidence.workspace) {
    entries.push(
      json(layout.BOOKMARKS_PATH, evidence.workspace.bookmarks),
      json(layout.SAVED_QUERIES_PATH, evidence.workspace.savedQueries),
    );
  }
  entries.push(...figureEntries(evidence));
  entries.push(json(layout.AUDIT_CHAIN_PATH, evidence.auditChain));
  entries.push(
    text(layout.AUDIT_CHECKPOINTS_PATH, evidence.checkpointLines.map((line) => `${line}\n`).join('')),
  );
  return entries;
}

/** Robot-recording originals byte for byte, and the list saying which bundle each was read into. */
function recordingOriginalEntries({ recordingOriginals }: CaseEvidence): ArchiveEntry[] {
  if (recordingOriginals.length === 0) return [];
  const listed = recordingOriginals.map(({ storedPath: _, ...original }) => ({
    ...original,
    path: layout.recordingOriginalPath(original.sha256, original.name),
  }));
  return [
    ...recordingOriginals.map((original) => ({
      path: layout.recordingOriginalPath(original.sha256, original.name),
      file: original.storedPath,
      expectedSha256: original.sha256,
      expectedSize: original.sizeBytes,
    })),
    json(layout.RECORDING_ORIGINALS_PATH, listed),
  ];
}

/** Saved pictures byte for byte, and the list saying what each shows and where it sits. */
function figureEntries({ figures }: CaseEvidence): ArchiveEntry[] {
  if (figures.length === 0) return [];
  return [
    ...figures.map(({ figure, storedPath }) => ({
      path: layout.figureFilePath(figure.sha256, figure.fileName),
      file: storedPath,
      expectedSha256: figure.sha256,
      expectedSize: figure.sizeBytes,
    })),
    json(
      layout.FIGURES_PATH,
      figures.map(({ figure }) => ({
        ...figure,
        path: layout.figureFilePath(figure.sha256, figure.fileName),
      })),
    ),
  ];
}
