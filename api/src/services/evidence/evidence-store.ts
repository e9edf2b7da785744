import fs from 'node:fs';
import path from 'node:path';
import { hashFile } from '../../bundles/sha256-file';

export interface StoredEvidence {
  sha256: string;
  sizeBytes: number;
  /** Absolute path of the read-only stored copy. */
  path: string;
  /** False when the same bytes were already stored. */
  isNew: boolean;
}

/**
 * Content-addressed, write-once store for original evidence files under `DATA_DIR/evidence`.
 * A file is named by the SHA-256 of its bytes, so the same upload is stored once and any later
 * change to a stored file is detectable by re-hashing it.
 */
export function createEvidenceStore(dataDir: string) {
  const root = path.join(dataDir, 'evidence');
  const incoming = path.join(dataDir, 'incoming');
  fs.mkdirSync(root, { recursive: true });
  fs.mkdirSync(incoming, { recursive: true });

  const pathFor = (sha256: string) => path.join(root, sha256.slice(0, 2), `${sha256}.bin`);

  /** Moves a freshly uploaded temporary file into the store (or drops it if already stored). */
  async function storeUploadedFile(tempFile: string): Promise<StoredEvidence> {
    const { sha256, size: sizeBytes } = await hashFile(tempFile);
    const target = pathFor(sha256);
    if (fs.existsSync(target)) {
      await fs.promises.rm(tempFile, { force: true });
      return { sha256, sizeBytes, path: target, isNew: false };
    }
    await fs.promises.mkdir(path.dirname(target), { recursive: true });
    await fs.promises.rename(tempFile, target);
    await fs.promises.chmod(target, 0o444);
    return { sha256, sizeBytes, path: target, isNew: true };
  }

  return { root, incoming, pathFor, storeUploadedFile };
}

export type EvidenceStore = ReturnType<typeof createEvidenceStore>;
