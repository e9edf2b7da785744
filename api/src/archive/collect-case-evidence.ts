import fs from 'node:fs';
import path from 'node:path';
import { type AuditChainEntry, auditChainOf } from '../../../shared/audit-chain';
import type { TBundleRecord } from '../../../shared/contracts/bundles';
import type { TCase } from '../../../shared/contracts/cases';
import type { TFigure } from '../../../shared/contracts/figures';
import type { TFindingsVersion } from '../../../shared/contracts/findings';
import type { TFix } from '../../../shared/contracts/fixes';
import type { TJwkSet } from '../../../shared/contracts/keys';
import type { TProbableCause, TReplay } from '../../../shared/contracts/replays';
import type { SafetyReport } from '../../../shared/safety/safety-report';
import type { ReplayResultFile } from '../replays/replay-files';
import { readCauses, readReplayResultFile, readSafety } from '../replays/replay-files';
import { collectRecordingOriginals, type RecordingOriginal } from './collect-recording-originals';

/**
 * Bookmarks and saved queries of a case, when the workspace services exist. Kept as an optional
 * hook so the archive does not depend on them; each item is written as JSON unchanged.
 */
export interface WorkspaceEvidenceSource {
  listBookmarks(caseId: string): Promise<unknown[]>;
  /** Each saved query should carry its result hash (`resultSha256`). */
  listSavedQueries(caseId: string): Promise<unknown[]>;
}

/** What the archive is made of, read once so every part of the archive tells the same story. */
export interface CaseEvidence {
  caseRecord: TCase;
  bundles: { record: TBundleRecord; originalPath: string }[];
  /** Finished replays only, oldest first; `series` is the stored per-step columns. */
  replays: {
    replay: TReplay;
    bundleSha256: string;
    result: ReplayResultFile;
    series: Record<string, (number | null)[]>;
    /** Separation and stopping analysis; null for replays made before it existed. */
    safety: SafetyReport | null;
    /** Probable causes; null for replays made before they were ranked. */
    causes: TProbableCause[] | null;
  }[];
  findings: TFindingsVersion[];
  fixes: TFix[];
  auditChain: AuditChainEntry[];
  /** Robot-recording originals the case's custody entries name (kept beside the bundles made from them). */
  recordingOriginals: RecordingOriginal[];
  /** Signed checkpoints of the case's chain, one compact JWS each. */
  checkpointLines: string[];
  jwks: TJwkSet;
  workspace: { bookmarks: unknown[]; savedQueries: unknown[] } | null;
  /** Pictures saved to the case, each with its stored file (cited by findings or not: all are evidence). */
  figures: { figure: TFigure; storedPath: string }[];
}

export interface CaseEvidenceSources {
  getCase(caseId: string): Promise<TCase>;
  listCaseBundles(caseId: string): Promise<TBundleRecord[]>;
  originalPathFor(sha256: string): string;
  listBundleReplays(bundleId: string): Promise<TReplay[]>;
  /** The folder of a finished replay's result files, rebuilt from the original when missing. */
  replayResultDir(replayId: string): Promise<string>;
  listFindingsVersions(caseId: string): Promise<{ version: number }[]>;
  getFindingsVersion(caseId: string, version: number): Promise<TFindingsVersion>;
  listFixes(caseId: string): Promise<TFix[]>;
  readCaseChain(caseId: string): Promise<AuditChainEntry[]>;
  checkpointLines(chain: string): Promise<string[]>;
  jwks(): Promise<TJwkSet>;
  workspace?: WorkspaceEvidenceSource;
  /** The case's saved pictures, when the figures service exists. */
  listFigures?(caseId: string): Promise<TFigure[]>;
}

const byTimeThenId = (a: { createdAt: string; id: string }, b: { createdAt: string; id: string }) =>
  a.createdAt.localeCompare(b.createdAt) || a.id.localeCompare(b.id);

/** Reads everything the archive of one case holds, in a fixed order. */
export async function collectCaseEvidence(
  caseId: string,
  sources: CaseEvidenceSources,
): Promise<CaseEvidence> {
  const caseRecord = await sources.getCase(caseId);
  const records = await sources.listCaseBundles(caseId);
  const replays: CaseEvidence['replays'] = [];
  for (const record of records) {
    const finished = (await sources.listBundleReplays(record.id)).filter((r) => r.status === 'done');
    for (const replay of finished.sort(byTimeThenId)) {
      // Never skipped: a sealed archive that silently lacked a finished replay would mislead.
      const dir = await sources.replayResultDir(replay.id);
      const series = JSON.parse(fs.readFileSync(path.join(dir, 'series.json'), 'utf8'));
      replays.push({
        replay,
        bundleSha256: record.sha256,
        result: readReplayResultFile(dir),
        series,
        safety: readSafety(dir),
        causes: readCauses(dir),
      });
    }
  }
  const versions = await sources.listFindingsVersions(caseId);
  const findings: TFindingsVersion[] = [];
  for (const { version } of versions) findings.push(await sources.getFindingsVersion(caseId, version));
  const workspace = sources.workspace
    ? {
        bookmarks: await sources.workspace.listBookmarks(caseId),
        savedQueries: await sources.workspace.listSavedQueries(caseId),
      }
    : null;
  const auditChain = await sources.readCaseChain(caseId);
  return {
    caseRecord,
    bundles: records.map((record) => ({ record, originalPath: sources.originalPathFor(record.sha256) })),
    replays,
    findings,
    fixes: await sources.listFixes(caseId),
    auditChain,
    recordingOriginals: await collectRecordingOriginals(auditChain, sources.originalPathFor),
    checkpointLines: await sources.checkpointLines(auditChainOf(caseId)),
    jwks: await sources.jwks(),
    workspace,
    figures: ((await sources.listFigures?.(caseId)) ?? []).map((figure) => ({
      figure,
      storedPath: sources.originalPathFor(figure.sha256),
    })),
  };
}
