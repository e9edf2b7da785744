import type { TRecordingProgress } from '../../../../shared/contracts/recordings';

/**
 * How far each recording upload has got after its bytes arrived: storing the originals, reading
 * the recording, writing the bundle's tables, checking the bundle. The case page polls it while
 * the upload request is still open, so a recording that takes minutes to read shows its share.
 * Kept in memory per API process (the upload and its polls reach the same process), only for
 * the uploader, and forgotten a while after the upload ends.
 */
interface Entry extends TRecordingProgress {
  caseId: string;
  userId: string;
  endedAt?: number;
}

const KEEP_AFTER_END_MS = 5 * 60_000;
/** An upper bound on entries, so a client inventing ids cannot grow the map without limit. */
const MAX_ENTRIES = 500;

export function createImportProgressBoard(now: () => number = Date.now) {
  const entries = new Map<string, Entry>();

  const forgetOld = () => {
    for (const [id, entry] of entries) {
      if (entry.endedAt !== undefined && now() - entry.endedAt > KEEP_AFTER_END_MS) entries.delete(id);
    }
    while (entries.size >= MAX_ENTRIES) {
      const oldest = entries.keys().next().value;
      if (oldest === undefined) break;
      entries.delete(oldest);
    }
  };

  return {
    start(id: string, owner: { caseId: string; userId: string }) {
      forgetOld();
      entries.set(id, { ...owner, phase: 'storing', fraction: 0 });
    },
    update(id: string, phase: TRecordingProgress['phase'], fraction: number) {
      const entry = entries.get(id);
      if (!entry) return;
      entry.phase = phase;
      entry.fraction = Math.min(1, Math.max(0, fraction));
      if (phase === 'done' || phase === 'failed') entry.endedAt = now();
    },
    /** The progress of upload `id`, if `userId` sent it to case `caseId`. */
    read(id: string, caseId: string, userId: string): TRecordingProgress | undefined {
      const entry = entries.get(id);
      if (!entry || entry.caseId !== caseId || entry.userId !== userId) return undefined;
      return { phase: entry.phase, fraction: entry.fraction };
    },
  };
}

export type ImportProgressBoard = ReturnType<typeof createImportProgressBoard>;
