import * as layout from '../../../shared/archive/archive-layout';
import { type AuditChainEntry, GENESIS_HASH } from '../../../shared/audit-chain';
import type { TArchiveManifest } from '../../../shared/contracts/archives';
import type { AddCheck } from './check-signatures';
import type { ReadArchive } from './read-archive-entries';

/**
 * Compares what the signed manifest pins (the audit chain's length and head, each findings version
 * with its signature count) with what the archive holds, so a truncated chain, a removed and
 * re-chained entry or a dropped signed version is named as such.
 */
export function checkPins(
  manifest: TArchiveManifest,
  chain: AuditChainEntry[] | null,
  read: ReadArchive,
  add: AddCheck,
): void {
  const pinned = manifest.auditChain;
  if (!pinned)
    add({
      kind: 'audit-chain',
      ok: true,
      file: layout.MANIFEST_PATH,
      message: `${layout.MANIFEST_PATH}: no pinned chain head (an archive from before heads were pinned); the chain is checked by its hash alone`,
    });
  else if (chain) {
    const head = chain.at(-1)?.entryHash ?? GENESIS_HASH;
    const ok = chain.length === pinned.entries && head === pinned.headHash;
    add({
      kind: 'audit-chain',
      ok,
      file: layout.AUDIT_CHAIN_PATH,
      message: ok
        ? `${layout.AUDIT_CHAIN_PATH}: ${chain.length} entries ending in ${head.slice(0, 16)}…, as the signed manifest pins`
        : `${layout.AUDIT_CHAIN_PATH}: ${chain.length} entries ending in ${head.slice(0, 16)}…, but the signed manifest pins ${pinned.entries} entries ending in ${pinned.headHash.slice(0, 16)}… (entries removed, added or re-chained after export)`,
    });
  }
  if (!manifest.findings) return;
  const held = new Map<number, number>();
  for (const file of read.contents.keys()) {
    const version = /^findings\/v(\d+)\/canonical\.json$/.exec(file)?.[1];
    if (version) held.set(Number(version), held.get(Number(version)) ?? 0);
  }
  for (const file of read.contents.keys()) {
    const version = layout.versionOfSignaturePath(file);
    if (version !== null) held.set(version, (held.get(version) ?? 0) + 1);
  }
  for (const { version, signatures } of manifest.findings) {
    const found = held.get(version);
    const ok = found === signatures;
    add({
      kind: 'signature',
      ok,
      file: layout.findingsVersionPath(version, 'canonical.json'),
      message: ok
        ? `findings v${version}: present with ${signatures} sign-off signature${signatures === 1 ? '' : 's'}, as the signed manifest pins`
        : found === undefined
          ? `findings v${version}: missing, but the signed manifest pins it with ${signatures} signature${signatures === 1 ? '' : 's'} (a version was dropped)`
          : `findings v${version}: ${found} signature${found === 1 ? '' : 's'}, but the signed manifest pins ${signatures}`,
    });
    held.delete(version);
  }
  for (const version of held.keys())
    add({
      kind: 'signature',
      ok: false,
      file: layout.findingsVersionPath(version, 'canonical.json'),
      message: `findings v${version}: in the archive but not pinned by the signed manifest`,
    });
}
