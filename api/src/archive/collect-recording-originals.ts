import fs from 'node:fs';
import type { AuditChainEntry } from '../../../shared/audit-chain';
import { AppError } from '../../../shared/errors';

/** An original a bundle was derived from (a robot recording, its map, parameters), as archived. */
export interface RecordingOriginal {
  sha256: string;
  /** bytes, of the stored copy; the archive writer re-hashes it against `sha256` */
  sizeBytes: number;
  role: string;
  /** The file name the investigator uploaded. */
  name: string;
  /** SHA-256 of the bundle made from it; null when the recording could not be read. */
  bundleSha256: string | null;
  /** Where the evidence store keeps it. */
  storedPath: string;
}

interface NamedOriginal {
  role?: unknown;
  name?: unknown;
  sha256?: unknown;
}

const SHA256 = /^[0-9a-f]{64}$/;

const namedOriginals = (value: unknown): { role: string; name: string; sha256: string }[] =>
  (Array.isArray(value) ? (value as NamedOriginal[]) : []).flatMap((item) =>
    typeof item?.sha256 === 'string' && SHA256.test(item.sha256)
      ? [{ role: String(item.role ?? 'original'), name: String(item.name ?? ''), sha256: item.sha256 }]
      : [],
  );

/**
 * The originals a case's robot recordings brought in, read from its custody entries: each
 * `bundle.upload` of a derived bundle and each `recording.import_failed` names the stored files
 * with their SHA-256. The audit chain is the source because it is what the archive proves; each
 * original is listed once (first mention), in chain order.
 */
export async function collectRecordingOriginals(
  chain: readonly AuditChainEntry[],
  pathFor: (sha256: string) => string,
): Promise<RecordingOriginal[]> {
  const found = new Map<string, RecordingOriginal>();
  for (const entry of chain) {
    const named =
      entry.action === 'bundle.upload'
        ? namedOriginals(entry.details.derivedFrom)
        : entry.action === 'recording.import_failed'
          ? namedOriginals(entry.details.originals)
          : [];
    const bundleSha256 =
      entry.action === 'bundle.upload' && typeof entry.details.sha256 === 'string'
        ? entry.details.sha256
        : null;
    for (const original of named) {
      const earlier = found.get(original.sha256);
      if (earlier) {
        // A recording that failed once and was read later belongs to the bundle made from it.
        earlier.bundleSha256 ??= bundleSha256;
        continue;
      }
      const storedPath = pathFor(original.sha256);
      const size = await fs.promises.stat(storedPath).then(
        (stat) => stat.size,
        () => {
          throw new AppError(
            'internal',
            `The original ${original.name} (SHA-256 ${original.sha256}) named in the audit trail is missing from the evidence store; the archive was not made.`,
          );
        },
      );
      found.set(original.sha256, { ...original, sizeBytes: size, bundleSha256, storedPath });
    }
  }
  return [...found.values()];
}
