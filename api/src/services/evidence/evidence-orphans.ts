import fs from 'node:fs';
import path from 'node:path';
import { inArray, sql } from 'drizzle-orm';
import type { TEvidenceOrphans, TOrphanFile } from '../../../../shared/contracts/evidence-orphans';
import type { Database } from '../../db/client';
import { bundles, figures } from '../../db/schema';
import type { EvidenceStore } from './evidence-store';

const STORED_NAME = /^([0-9a-f]{64})\.bin$/;

async function describeFile(dataDir: string, file: string): Promise<TOrphanFile> {
  const stat = await fs.promises.stat(file);
  return {
    path: path.relative(dataDir, file).split(path.sep).join('/'),
    sizeBytes: stat.size,
    modifiedAt: stat.mtime.toISOString(),
  };
}

/**
 * Hashes of the robot-recording originals the custody entries name: they have no bundle row of
 * their own (the bundle made from them has one), but are accounted for all the same.
 */
async function recordingOriginalHashes(db: Database): Promise<string[]> {
  const result = await db.execute(sql`
    select distinct original->>'sha256' as "sha256"
    from audit_entries,
      jsonb_array_elements(
        case when jsonb_typeof(coalesce(details->'derivedFrom', details->'originals')) = 'array'
          then coalesce(details->'derivedFrom', details->'originals') else '[]'::jsonb end
      ) as original
    where action in ('bundle.receive', 'bundle.upload', 'recording.import_failed')`);
  const rows = ((result as { rows?: unknown[] }).rows ?? (result as unknown as unknown[])) as {
    sha256: string | null;
  }[];
  return rows.flatMap((row) => (row.sha256 ? [row.sha256] : []));
}

/**
 * Compares `incoming/` and `evidence/` with the bundles and figures tables. It only reports: deleting a file
 * someone may still need (an original whose row was lost) is a decision for a person, so the
 * admin sees the list and the start-up log says how many there are.
 */
export function createEvidenceOrphans({
  db,
  evidence,
  dataDir,
}: {
  db: Database;
  evidence: EvidenceStore;
  dataDir: string;
}) {
  async function findOrphans(): Promise<TEvidenceOrphans> {
    const checkedAt = new Date().toISOString();
    const incomingNames = await fs.promises.readdir(evidence.incoming).catch(() => [] as string[]);
    const incoming = await Promise.all(
      incomingNames.map((name) => describeFile(dataDir, path.join(evidence.incoming, name))),
    );
    const stored: { sha256: string; file: string }[] = [];
    const prefixes = await fs.promises.readdir(evidence.root).catch(() => [] as string[]);
    for (const prefix of prefixes) {
      const names = await fs.promises.readdir(path.join(evidence.root, prefix)).catch(() => [] as string[]);
      for (const name of names) {
        const match = STORED_NAME.exec(name);
        if (match) stored.push({ sha256: match[1], file: path.join(evidence.root, prefix, name) });
      }
    }
    const recorded = new Set<string>();
    for (let i = 0; i < stored.length; i += 500) {
      const chunk = stored.slice(i, i + 500).map((s) => s.sha256);
      const rows = await db
        .select({ sha256: bundles.sha256 })
        .from(bundles)
        .where(inArray(bundles.sha256, chunk));
      // Figures saved to a case are stored beside bundle originals and are recorded too.
      const figureRows = await db
        .select({ sha256: figures.sha256 })
        .from(figures)
        .where(inArray(figures.sha256, chunk));
      for (const row of [...rows, ...figureRows]) recorded.add(row.sha256);
    }
    if (stored.some((s) => !recorded.has(s.sha256))) {
      for (const sha256 of await recordingOriginalHashes(db)) recorded.add(sha256);
    }
    const unrecorded = await Promise.all(
      stored
        .filter((s) => !recorded.has(s.sha256))
        .map(async (s) => ({ ...(await describeFile(dataDir, s.file)), sha256: s.sha256 })),
    );
    return { checkedAt, incoming, unrecorded };
  }

  return { findOrphans };
}

export type EvidenceOrphans = ReturnType<typeof createEvidenceOrphans>;
