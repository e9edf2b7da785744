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
  /**
   * The case's audit chain as exported: its length and head hash, pinned under the manifest's
   * signature so a truncated or re-chained `audit/chain.json` is refused even if its listed hash
   * were made to match. Absent in archives from before it was pinned.
   */
  auditChain: z
    .object({ chain: z.string(), entries: z.number().int().nonnegative(), headHash: z.string() })
    .optional(),
  /** Each findings version in the archive with the number of sign-off signatures it carries. */
  findings: z
    .array(z.object({ version: z.number().int().positive(), signatures: z.number().int() }))
    .optional(),
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

export const ARCHIVE_CHECK_KINDS = [
  'manifest',
  'file',
  'trust',
  'signature',
  'audit-chain',
  'checkpoint',
  'replay',
] as const;

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
  /**
   * Set on the `trust` check when no trusted key was given: the signatures were only compared
   * with the key inside the archive, which whoever edits the archive can replace. Not a failure
   * of the evidence, and not a pass either.
   */
  unanchored: z.boolean().optional(),
});
export type TArchiveCheck = z.infer<typeof ZArchiveCheck>;

/** `POST /api/archives/verify` response; the CLI prints the same checks. */
export const ZArchiveVerification = z.object({
  ok: z.boolean(),
  /** SHA-256 of the archive file itself, to compare with the custody record. */
  archiveSha256: ZSha256Hex,
  /** Whether signatures were checked against trusted keys (never only the archive's own). */
  signaturesAnchored: z.boolean(),
  checks: z.array(ZArchiveCheck),
});
export type TArchiveVerification = z.infer<typeof ZArchiveVerification>;
