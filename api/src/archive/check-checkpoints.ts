import * as layout from '../../../shared/archive/archive-layout';
import { type AuditChainEntry, auditChainOf } from '../../../shared/audit-chain';
import type { TArchiveManifest } from '../../../shared/contracts/archives';
import type { AddCheck } from './check-signatures';
import { compareWithCheckpoints, readCheckpointLines } from './compare-checkpoints';
import type { ReadArchive } from './read-archive-entries';
import type { ResolvedTrust } from './trust-anchor';

/**
 * Compares the archived chain with every signed checkpoint the verifier can see: those inside
 * the archive and those given from outside (the server's checkpoint file, or a copy legal kept
 * via `--checkpoints`). Only checkpoints signed by a trusted key count; only those made up to
 * the export are expected to be covered by it.
 */
export async function checkCheckpoints(
  read: ReadArchive,
  chain: AuditChainEntry[],
  manifest: TArchiveManifest,
  trust: ResolvedTrust,
  external: { lines: string[]; label: string } | undefined,
  add: AddCheck,
): Promise<void> {
  const chainName = manifest.auditChain?.chain ?? auditChainOf(manifest.case.id);
  const sources = [
    {
      lines: (read.contents.get(layout.AUDIT_CHECKPOINTS_PATH)?.toString('utf8') ?? '').split('\n'),
      label: layout.AUDIT_CHECKPOINTS_PATH,
    },
    ...(external ? [external] : []),
  ];
  let checked = 0;
  let failed = false;
  for (const source of sources) {
    const { checkpoints, problems } = await readCheckpointLines(source.lines, trust.keys);
    const comparison = compareWithCheckpoints(chainName, chain, checkpoints, manifest.exportedAt);
    checked += comparison.checked;
    for (const problem of [...problems, ...comparison.problems]) {
      failed = true;
      add({
        kind: 'checkpoint',
        ok: false,
        file: layout.AUDIT_CHAIN_PATH,
        message: `${source.label}: ${problem}`,
      });
    }
  }
  if (!failed)
    add({
      kind: 'checkpoint',
      ok: true,
      file: layout.AUDIT_CHAIN_PATH,
      message:
        checked > 0
          ? `${layout.AUDIT_CHAIN_PATH}: agrees with ${checked} signed checkpoint${checked === 1 ? '' : 's'} of its head made up to the export (${sources.map((s) => s.label).join(', ')})`
          : `${layout.AUDIT_CHAIN_PATH}: no signed checkpoint of this chain from before the export was available (${sources.map((s) => s.label).join(', ')})`,
    });
}
