import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { JSONWebKeySet } from 'jose';
import * as layout from '../../../shared/archive/archive-layout';
import { compareWithManifest } from '../../../shared/archive/compare-with-manifest';
import { type AuditChainEntry, verifyAuditChain } from '../../../shared/audit-chain';
import {
  type TArchiveCheck,
  type TArchiveVerification,
  ZArchiveManifest,
} from '../../../shared/contracts/archives';
import { DIGEST_LAYOUT, ENGINE_VERSION, type EngineStamp, replayBundle } from '../../../shared/engine';
import type { ReplaySettings } from '../../../shared/engine/settings';
import { hashFile } from '../bundles/sha256-file';
import { DEFAULT_ZIP_LIMITS, type ZipLimits } from '../bundles/zip-limits';
import { loadBundleForReplay } from '../replays/replay-bundle-file';
import { checkPins } from './check-pins';
import { checkSignatures } from './check-signatures';
import { ArchiveRefusedError, type ReadArchive, readArchiveEntries } from './read-archive-entries';
import { resolveTrust, type TrustAnchor } from './trust-anchor';

export interface VerifyOptions {
  /** Skip re-running replays (fast structural check only); the report says so. */
  skipReplays?: boolean;
  /** Unpacking limits; the bundle reader's by default (the server passes MAX_UNPACKED_BYTES). */
  zipLimits?: Partial<ZipLimits>;
  /** Keys or thumbprints trusted from outside the archive; without one signatures are not anchored. */
  trust?: TrustAnchor;
}

type Check = (
  kind: TArchiveCheck['kind'],
  ok: boolean,
  file: string | null,
  message: string,
  olderDigestLayout?: number,
) => void;

/** The digest layout a recorded replay used: its stamp's, or 1 for replays from before stamps (engine 1.x). */
function recordedLayout(engine: EngineStamp | null | undefined): number {
  return typeof engine?.digestLayout === 'number' ? engine.digestLayout : 1;
}

function describeStamp(engine: EngineStamp | null | undefined): string {
  return engine
    ? `engine ${engine.engine}, digest layout ${engine.digestLayout}, ${engine.runtime}`
    : 'engine 1.x, digest layout 1 (recorded before replays carried an engine stamp)';
}

function parseJson<T>(read: ReadArchive, file: string, check: Check): T | null {
  const bytes = read.contents.get(file);
  if (!bytes) return null;
  try {
    return JSON.parse(bytes.toString('utf8')) as T;
  } catch (error) {
    check('manifest', false, file, `${file}: not valid JSON (${(error as Error).message})`);
    return null;
  }
}

async function checkReplays(read: ReadArchive, check: Check) {
  const bundles = new Map<string, Awaited<ReturnType<typeof loadBundleForReplay>>>();
  for (const digestPath of [...read.contents.keys()].filter((f) => layout.replayIdOfDigestPath(f)).sort()) {
    const id = layout.replayIdOfDigestPath(digestPath) as string;
    const settingsPath = layout.replayFilePath(id, 'settings.json');
    const info = parseJson<{ bundlePath?: string; engine?: EngineStamp | null }>(
      read,
      layout.replayFilePath(id, 'replay.json'),
      check,
    );
    const settings = parseJson<ReplaySettings>(read, settingsPath, check);
    const original = info?.bundlePath ? read.extracted.get(info.bundlePath) : undefined;
    if (!info?.bundlePath || !settings || !original) {
      check(
        'replay',
        false,
        digestPath,
        `replay ${id}: cannot re-run (replay.json, settings.json or the original bundle is missing)`,
      );
      continue;
    }
    try {
      let bundle = bundles.get(original);
      if (!bundle) {
        bundle = await loadBundleForReplay(original);
        bundles.set(original, bundle);
      }
      const expected = (read.contents.get(digestPath) as Buffer).toString('utf8').trim();
      const actual = replayBundle(bundle, {}, { settings, keyframeInterval: 0 }).digest;
      const layoutThen = recordedLayout(info.engine);
      if (actual === expected)
        check(
          'replay',
          true,
          digestPath,
          `replay ${id}: re-run from ${info.bundlePath} gives the recorded digest ${expected} (recorded by ${describeStamp(info.engine)}; re-run by engine ${ENGINE_VERSION}, digest layout ${DIGEST_LAYOUT})`,
        );
      else if (layoutThen !== DIGEST_LAYOUT)
        check(
          'replay',
          false,
          digestPath,
          `replay ${id}: digest not comparable, not a sign of tampering: it was recorded by ${describeStamp(info.engine)}, and this verifier (engine ${ENGINE_VERSION}) computes digest layout ${DIGEST_LAYOUT}, whose numbers differ by design (see the engine's digest layout history). The replay's files are still covered by the manifest hashes and signature checked above; to re-confirm this digest, verify with the Driftcase release that recorded it, or re-run the replay and compare the new digest.`,
          layoutThen,
        );
      else
        check(
          'replay',
          false,
          digestPath,
          `replay ${id}: re-run gives digest ${actual}, ${digestPath} says ${expected} (both digest layout ${DIGEST_LAYOUT}): the bundle, the settings or the digest were changed after export`,
        );
    } catch (error) {
      check('replay', false, digestPath, `replay ${id}: re-run failed (${(error as Error).message})`);
    }
  }
}

/**
 * Verifies an evidence archive without the database: every file against manifest.json, the
 * manifest's and findings' signatures against keys/jwks.json, the audit hash chain, and every
 * replay re-run from the included original bundle. Throws only for an unreadable file.
 */
export async function verifyArchive(
  zipPath: string,
  options: VerifyOptions = {},
): Promise<TArchiveVerification> {
  const checks: TArchiveCheck[] = [];
  const check: Check = (kind, ok, file, message, olderDigestLayout) =>
    checks.push(
      olderDigestLayout === undefined
        ? { kind, ok, file, message }
        : { kind, ok, file, message, olderDigestLayout },
    );
  const { sha256: archiveSha256 } = await hashFile(zipPath);
  let signaturesAnchored = false;
  const tempDir = await fs.promises.mkdtemp(path.join(os.tmpdir(), 'driftcase-verify-'));
  try {
    let read: ReadArchive;
    try {
      read = await readArchiveEntries(zipPath, tempDir, { ...DEFAULT_ZIP_LIMITS, ...options.zipLimits });
    } catch (error) {
      if (error instanceof ArchiveRefusedError) {
        for (const problem of error.problems)
          check('file', false, problem.file, `${problem.file}: ${problem.message}`);
        return { ok: false, archiveSha256, signaturesAnchored, checks };
      }
      check('file', false, null, `the file is not a readable zip archive (${(error as Error).message})`);
      return { ok: false, archiveSha256, signaturesAnchored, checks };
    }
    for (const name of read.duplicates)
      check('file', false, name, `${name}: appears more than once in the archive`);
    const rawManifest = parseJson<unknown>(read, layout.MANIFEST_PATH, check);
    const manifest = ZArchiveManifest.safeParse(rawManifest);
    if (!manifest.success) {
      const why =
        rawManifest === null
          ? 'missing'
          : `not a valid manifest (${manifest.error.issues[0]?.path.join('.')}: ${manifest.error.issues[0]?.message})`;
      check('manifest', false, layout.MANIFEST_PATH, `${layout.MANIFEST_PATH}: ${why}`);
    } else {
      check(
        'manifest',
        true,
        layout.MANIFEST_PATH,
        `${layout.MANIFEST_PATH}: ${manifest.data.format}, case ${manifest.data.case.reference}, exported ${manifest.data.exportedAt} by ${manifest.data.exportedBy.email}, ${manifest.data.files.length} files`,
      );
      checks.push(
        ...compareWithManifest(
          manifest.data.files,
          read.found,
          new Set([layout.MANIFEST_PATH, layout.MANIFEST_SIGNATURE_PATH]),
        ),
      );
    }
    const trust = resolveTrust(options.trust, parseJson<JSONWebKeySet>(read, layout.JWKS_PATH, check));
    signaturesAnchored = trust.anchored;
    checks.push(
      trust.anchored
        ? { kind: 'trust', ok: trust.ok, file: null, message: trust.message }
        : { kind: 'trust', ok: false, unanchored: true, file: layout.JWKS_PATH, message: trust.message },
    );
    await checkSignatures(read, trust, (c) => checks.push(c));
    const chain = parseJson<AuditChainEntry[]>(read, layout.AUDIT_CHAIN_PATH, check);
    if (!Array.isArray(chain))
      check(
        'audit-chain',
        false,
        layout.AUDIT_CHAIN_PATH,
        `${layout.AUDIT_CHAIN_PATH}: missing or not a list of entries`,
      );
    else {
      const report = verifyAuditChain(chain);
      if (report.ok)
        check(
          'audit-chain',
          true,
          layout.AUDIT_CHAIN_PATH,
          `${layout.AUDIT_CHAIN_PATH}: ${report.entries} entries, hash chain intact`,
        );
      else
        check(
          'audit-chain',
          false,
          layout.AUDIT_CHAIN_PATH,
          `${layout.AUDIT_CHAIN_PATH}: chain broken at entry ${report.firstBroken?.chainSeq} (${report.firstBroken?.reason})`,
        );
    }
    if (manifest.success)
      checkPins(manifest.data, Array.isArray(chain) ? chain : null, read, (c) => checks.push(c));
    if (options.skipReplays)
      check('replay', true, null, 'replays: re-run skipped on request (digests not checked)');
    else await checkReplays(read, check);
  } finally {
    await fs.promises.rm(tempDir, { recursive: true, force: true });
  }
  return { ok: checks.every((c) => c.ok), archiveSha256, signaturesAnchored, checks };
}

/**
 * How a verification ends, as the CLI's exit code: 0 every check held against a trusted key; 3
 * nothing failed but something could not be confirmed (signatures not anchored to a trusted key,
 * or replay digests from an older engine); 2 a check failed (tampering or damage).
 */
export function verificationOutcome(result: TArchiveVerification): 0 | 2 | 3 {
  if (result.ok) return 0;
  const isUnconfirmed = (c: TArchiveCheck) => c.olderDigestLayout !== undefined || c.unanchored === true;
  return result.checks.every((c) => c.ok || isUnconfirmed(c)) ? 3 : 2;
}

/**
 * One line per check, as the CLI prints them: ok, FAIL, OLD for a digest of an older layout, or
 * WARN for a signature not anchored to a trusted key.
 */
export function formatCheckLine(check: TArchiveCheck): string {
  const mark = check.ok
    ? 'ok  '
    : check.olderDigestLayout !== undefined
      ? 'OLD '
      : check.unanchored
        ? 'WARN'
        : 'FAIL';
  return `${mark} ${check.kind.padEnd(11)} ${check.message}`;
}
