import fs from 'node:fs';
import path from 'node:path';
import type { Writable } from 'node:stream';
import { auditChainOf, GENESIS_HASH } from '../../../../shared/audit-chain';
import type { Bundle } from '../../../../shared/bundle/types';
import {
  ARCHIVE_FORMAT,
  type TArchiveExport,
  type TArchiveManifest,
  type TArchiveVerification,
} from '../../../../shared/contracts/archives';
import { SAFETY_CAUTION } from '../../../../shared/safety-caution';
import { buildArchiveEntries } from '../../archive/archive-entries';
import { type CaseEvidenceSources, collectCaseEvidence } from '../../archive/collect-case-evidence';
import { renderReport } from '../../archive/report/render-report';
import { signManifest } from '../../archive/sign-manifest';
import { verifyArchive } from '../../archive/verify-archive';
import { writeArchive } from '../../archive/write-archive';
import { PROJECT_ROOT } from '../../config';
import type { Database } from '../../db/client';
import { loadBundleForReplay } from '../../replays/replay-bundle-file';
import type { AuditService } from '../audit/audit-service';
import type { CheckpointService } from '../audit/checkpoint-service';
import type { Notifications } from '../mail/notifications';
import { assertCaseMember } from '../membership/case-access';
import { jwkThumbprint } from '../signing/jwk-thumbprint';
import type { SigningKeyStore } from '../signing/signing-key';

/** Bundles larger than this are archived byte for byte but not parsed for the report's pictures. */
const REPORT_PARSE_LIMIT_BYTES = 256 * 1024 * 1024;

/** Each saved figure as a data: URL, for report.html to show inline (figures are at most 10 MB). */
async function readFigurePictures(evidence: Awaited<ReturnType<typeof collectCaseEvidence>>) {
  const pictures = new Map<string, string>();
  for (const { figure, storedPath } of evidence.figures) {
    const bytes = await fs.promises.readFile(storedPath);
    pictures.set(figure.id, `data:${figure.mediaType};base64,${bytes.toString('base64')}`);
  }
  return pictures;
}

export interface ArchiveExporter {
  id: string;
  email: string;
  role: string;
}

export function readProductVersion(): string {
  return (JSON.parse(fs.readFileSync(path.join(PROJECT_ROOT, 'package.json'), 'utf8')) as { version: string })
    .version;
}

/** Evidence archives: streamed export with custody, and the list of past exports. */
export function createArchiveService(deps: {
  db: Database;
  sources: CaseEvidenceSources;
  keys: SigningKeyStore;
  audit: AuditService;
  notify: Notifications;
  checkpoints: CheckpointService;
  maxUnpackedBytes: number;
  /** The zone report.html shows times in (`SITE_TIME_ZONE`). */
  siteTimeZone: string;
}) {
  const productVersion = readProductVersion();

  async function parseForReport(evidence: Awaited<ReturnType<typeof collectCaseEvidence>>) {
    const parsed = new Map<string, Bundle | null>();
    const replayed = new Set(evidence.replays.map((r) => r.bundleSha256));
    for (const { record, originalPath } of evidence.bundles) {
      const isUseful = record.status === 'valid' && replayed.has(record.sha256);
      if (!isUseful || record.sizeBytes > REPORT_PARSE_LIMIT_BYTES) continue;
      parsed.set(
        record.sha256,
        await loadBundleForReplay(originalPath, deps.maxUnpackedBytes).catch(() => null),
      );
    }
    return parsed;
  }

  /**
   * Reads the case (so a missing case fails before any byte is sent) and returns its file name and
   * a writer. The writer streams the zip into `sink`, appends the custody entry with the archive's
   * SHA-256 to the case's audit trail, notifies legal, and only then ends `sink`.
   */
  async function prepareExport(caseId: string, exporter: ArchiveExporter) {
    await assertCaseMember(deps.db, caseId, exporter, 'export its evidence archive');
    const evidence = await collectCaseEvidence(caseId, deps.sources);
    const reference = evidence.caseRecord.reference;
    return {
      fileName: `${reference}-evidence.zip`,
      async writeTo(sink: Writable) {
        const entries = buildArchiveEntries(evidence);
        const key = await deps.keys.current();
        const report = renderReport({
          signingKeyThumbprint: jwkThumbprint(key.publicJwk),
          evidence,
          bundles: await parseForReport(evidence),
          productVersion,
          safetyCaution: SAFETY_CAUTION,
          siteTimeZone: deps.siteTimeZone,
          figurePictures: await readFigurePictures(evidence),
        });
        entries.unshift({ path: 'report.html', data: Buffer.from(report, 'utf8') });
        const exportedAt = new Date().toISOString();
        const written = await writeArchive(
          entries,
          sink,
          (files): TArchiveManifest => ({
            format: ARCHIVE_FORMAT,
            case: { id: caseId, reference, title: evidence.caseRecord.title },
            exportedAt,
            exportedBy: exporter,
            productVersion,
            safetyCaution: SAFETY_CAUTION,
            files,
            auditChain: {
              chain: auditChainOf(caseId),
              entries: evidence.auditChain.length,
              headHash: evidence.auditChain.at(-1)?.entryHash ?? GENESIS_HASH,
            },
            findings: evidence.findings.map((version) => ({
              version: version.version,
              signatures: version.reviews.filter((review) => review.jws).length,
            })),
          }),
          (bytes) => signManifest(bytes, key, { signedBy: exporter.email, signedAt: exportedAt }),
        );
        await deps.audit.appendAlone({
          actor: exporter,
          action: 'archive.export',
          targetType: 'archive',
          targetId: written.sha256,
          caseId,
          payload: { exportedAt, files: written.files },
          details: { sha256: written.sha256, size: written.size, files: written.files.length },
        });
        // Every export anchors every chain head outside the database (file + mail to legal).
        await deps.checkpoints.checkpointAll('export');
        await deps.notify.archiveExported({
          caseId,
          sha256: written.sha256,
          exportedByEmail: exporter.email,
        });
        return written;
      },
    };
  }

  /** Past exports of a case, oldest first, read from its audit trail (the custody record). */
  async function listExports(caseId: string, actor: ArchiveExporter): Promise<TArchiveExport[]> {
    await assertCaseMember(deps.db, caseId, actor, 'see its evidence archives');
    const chain = await deps.audit.readCaseChain(caseId);
    return chain
      .filter((entry) => entry.action === 'archive.export')
      .map((entry) => ({
        auditEntry: entry.chainSeq,
        exportedAt: entry.at,
        exportedBy: entry.actorEmail,
        sha256: String(entry.details.sha256),
        size: typeof entry.details.size === 'number' ? entry.details.size : null,
      }));
  }

  /**
   * Verifies an uploaded archive, records the check (`archive.verify`, with the archive's SHA-256
   * and the verdict) and removes the uploaded copy.
   */
  async function verifyUploadedArchive(file: string, actor: ArchiveExporter): Promise<TArchiveVerification> {
    try {
      // The server trusts only its own key store (current and retired keys), never the archive's copy.
      const verification = await verifyArchive(file, {
        zipLimits: { maxTotalBytes: deps.maxUnpackedBytes },
        checkpoints: { lines: await deps.checkpoints.readLines(), label: "this server's checkpoint file" },
        trust: { keys: (await deps.keys.jwks()).keys, label: "this server's signing keys (GET /api/keys)" },
      });
      await deps.audit.appendAlone({
        actor,
        action: 'archive.verify',
        targetType: 'archive',
        targetId: verification.archiveSha256,
        details: { ok: verification.ok },
        payload: verification,
      });
      return verification;
    } finally {
      await fs.promises.rm(file, { force: true });
    }
  }

  return { prepareExport, listExports, verifyUploadedArchive };
}

export type ArchiveService = ReturnType<typeof createArchiveService>;
