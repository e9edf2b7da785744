/**
 * Where each piece of evidence sits inside an evidence archive. Writer and verifier both use
 * these names, so a renamed folder cannot silently drop a check.
 */

export const MANIFEST_PATH = 'manifest.json';
/** Detached JWS over the exact bytes of manifest.json, made with the server's signing key. */
export const MANIFEST_SIGNATURE_PATH = 'manifest.jws';
export const REPORT_PATH = 'report.html';
export const CASE_PATH = 'case.json';
export const JWKS_PATH = 'keys/jwks.json';
export const AUDIT_CHAIN_PATH = 'audit/chain.json';
/** Signed checkpoints of the case's chain head (one compact JWS a line), as the server kept them. */
export const AUDIT_CHECKPOINTS_PATH = 'audit/checkpoints.jsonl';
export const FIXES_PATH = 'fixes/fixes.json';
export const BOOKMARKS_PATH = 'workspace/bookmarks.json';
export const SAVED_QUERIES_PATH = 'workspace/saved-queries.json';

/** Every picture saved to the case (caption, moment, SHA-256) and where its file is in the archive. */
export const FIGURES_PATH = 'figures/figures.json';
/** A saved picture byte for byte, under its SHA-256 and the file name the server gave it. */
export const figureFilePath = (sha256: string, fileName: string) =>
  `figures/${sha256}/${fileName.replace(/[^A-Za-z0-9._-]/g, '_').replace(/^\.+/, '') || 'figure'}`;

export const bundleOriginalPath = (sha256: string) => `bundles/${sha256}/original.zip`;
export const bundleValidationPath = (sha256: string) => `bundles/${sha256}/validation.json`;

/** Every robot-recording original (recording, map, parameters, robot file) with its SHA-256 and bundle. */
export const RECORDING_ORIGINALS_PATH = 'recordings/originals.json';
/**
 * A robot-recording original, under its SHA-256 and the name it was uploaded with (reduced to
 * letters, digits, `.`, `_` and `-`, so no name can climb out of its folder).
 */
export const recordingOriginalPath = (sha256: string, uploadedName: string) => {
  const safe = uploadedName
    .replace(/^.*[\\/]/, '')
    .replace(/[^A-Za-z0-9._-]/g, '_')
    .replace(/^\.+/, '')
    .slice(-100);
  return `recordings/${sha256}/${safe || 'original'}`;
};

export const replayFilePath = (
  replayId: string,
  file:
    | 'replay.json'
    | 'settings.json'
    | 'digest'
    | 'series.csv'
    | 'flags.json'
    | 'metrics.json'
    | 'safety.json',
) => `replays/${replayId}/${file}`;

export const findingsVersionPath = (version: number, file: 'version.json' | 'canonical.json') =>
  `findings/v${version}/${file}`;
export const findingsSignaturePath = (version: number, index: number) =>
  `findings/v${version}/signatures/signoff-${index + 1}.jws`;

/** `findings/v3/signatures/signoff-1.jws` → 3; null for any other path. */
export function versionOfSignaturePath(path: string): number | null {
  const match = /^findings\/v(\d+)\/signatures\/[^/]+\.jws$/.exec(path);
  return match ? Number(match[1]) : null;
}

/** `replays/<id>/digest` → id; null for any other path. */
export function replayIdOfDigestPath(path: string): string | null {
  const match = /^replays\/([^/]+)\/digest$/.exec(path);
  return match ? match[1] : null;
}

/**
 * Every entry gets this modification time, so re-exporting unchanged evidence yields the same
 * entries; the real export time is in manifest.json. (Zip stores local DOS time, from 1980.)
 */
export const FIXED_ENTRY_DATE = new Date(Date.UTC(2000, 0, 1, 0, 0, 0));
