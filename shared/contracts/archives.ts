import { z } from 'zod';

/** Format tag written into every archive manifest; bump the number on an incompatible change. */
export const ARCHIVE_FORMAT = 'driftcase-evidence-archive/1';

const ZSha256Hex = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 as 64 lowercase hex digits');

/** One file of the archive as listed in `manifest.json`. */
export const ZArchiveFileEntry = z.object({
  path: z.string().min(1),
  /** bytes */
  size: z.number().int().nonnegative(),
  sha256: ZSha256Hex,
});
export type TArchiveFileEntry = z.infer<typeof ZArchiveFileEntry>;

/** `manifest.json`: everything else in the archive, with its size and SHA-256. */
export const ZArchiveManifest = z.object({
  format: z.literal(ARCHIVE_FORMAT),
  case: z.object({ id: z.string(), reference: z.string(), title: z.string() }),
  /** RFC 3339 */
  exportedAt: z.string(),
  exportedBy: z.object({ id: z.string(), email: z.string(), role: z.string() }),
  productVersion: z.string(),
  safetyCaution: z.string(),
  files: z.array(ZArchiveFileEntry),
});
export type TArchiveManifest = z.infer<typeof ZArchiveManifest>;

/** `GET /api/cases/:id/archives` item: one past export, read from the case's audit trail. */
export const ZArchiveExport = z.object({
  auditEntry: z.number().int(),
  exportedAt: z.string(),
  exportedBy: z.string().nullable(),
  sha256: ZSha256Hex,
  /** bytes */
  size: z.number().int().nonnegative().nullable(),
});
export type TArchiveExport = z.infer<typeof ZArchiveExport>;
export const ZArchiveExportList = z.object({ items: z.array(ZArchiveExport) });
export type TArchiveExportList = z.infer<typeof ZArchiveExportList>;

export const ARCHIVE_CHECK_KINDS = ['manifest', 'file', 'signature', 'audit-chain', 'replay'] as const;

/** One line of a verification: what was checked, whether it held, and the file it concerns. */
export const ZArchiveCheck = z.object({
  kind: z.enum(ARCHIVE_CHECK_KINDS),
  ok: z.boolean(),
  /** Archive path the check is about, when there is one. */
  file: z.string().nullable(),
  message: z.string(),
  /**
   * Set on a replay check that could not compare digests because the replay was recorded under
   * an older digest layout (an older engine's numbers): not a sign of tampering, and the check
   * is not `ok` either, since its digest was not re-confirmed.
   */
  olderDigestLayout: z.number().optional(),
});
export type TArchiveCheck = z.infer<typeof ZArchiveCheck>;

/** `POST /api/archives/verify` response; the CLI prints the same checks. */
export const ZArchiveVerification = z.object({
  ok: z.boolean(),
  /** SHA-256 of the archive file itself, to compare with the custody record. */
  archiveSha256: ZSha256Hex,
  checks: z.array(ZArchiveCheck),
});
export type TArchiveVerification = z.infer<typeof ZArchiveVerification>;
