import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq } from 'drizzle-orm';
import { canEditFindings } from '../../../../shared/case-lifecycle';
import { CASE_STATUS_LABELS } from '../../../../shared/contracts/cases';
import {
  type TFindingsDiff,
  type TFindingsDraft,
  type TFindingsResponse,
  type TFindingsVersionSummary,
  type VERSION_STATES,
  ZFindingsContent,
} from '../../../../shared/contracts/findings';
import { AppError } from '../../../../shared/errors';
import { diffJson } from '../../../../shared/json-diff';
import { SAFETY_CAUTION } from '../../../../shared/safety-caution';
import type { Database, Transaction } from '../../db/client';
import { type FindingVersionRow, findingDrafts, findingReviews, findingVersions } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { assertNotHeld, describeHold, findActiveHold } from '../holds/holds-service';
import { loadCaseState } from '../lifecycle/case-state';
import type { LifecycleService } from '../lifecycle/lifecycle-service';
import type { Notifications } from '../mail/notifications';
import { assertCaseMember } from '../membership/case-access';
import { loadCitedCauseKinds, type ReplayCauses, validateEvidence } from './evidence-citations';
import { readEvidenceNames } from './evidence-names';
import { type FindingsDocument, freezeFindings } from './findings-document';
import { loadPeople } from './people';

/** A stored findings version, or a 404 naming it; `db` may be an open transaction. */
export async function loadVersionRow(
  db: Database,
  caseId: string,
  version: number,
): Promise<FindingVersionRow> {
  const [row] = await db
    .select()
    .from(findingVersions)
    .where(and(eq(findingVersions.caseId, caseId), eq(findingVersions.version, version)));
  if (!row) throw new AppError('not_found', `Case ${caseId} has no findings version ${version}.`);
  return row;
}

/** The highest version number of a case's findings, or null before the first submission. */
export async function latestVersionNumber(db: Database, caseId: string): Promise<number | null> {
  const [latest] = await db
    .select({ version: findingVersions.version })
    .from(findingVersions)
    .where(eq(findingVersions.caseId, caseId))
    .orderBy(desc(findingVersions.version))
    .limit(1);
  return latest?.version ?? null;
}

const SEE_FINDINGS = 'see its findings';

/** Findings drafts and their frozen, numbered versions. Reviews live in review-service.ts. */
export function createFindingsService(deps: {
  db: Database;
  audit: AuditService;
  lifecycle: LifecycleService;
  notify: Notifications;
  /** A finished replay's probable causes (for citations of a cause); null when it has none. */
  replayCauses: ReplayCauses;
}) {
  const { db, audit, lifecycle, notify, replayCauses } = deps;

  /** Why the findings cannot be edited now, or null; `executor` may be an open transaction. */
  async function editBlockedReason(executor: Database, caseId: string): Promise<string | null> {
    const hold = await findActiveHold(executor, caseId);
    if (hold) return `The case is ${await describeHold(executor, hold)}.`;
    const { status } = await loadCaseState(executor, caseId);
    return canEditFindings(status)
      ? null
      : `Findings cannot be edited while the case is “${CASE_STATUS_LABELS[status]}”; ${
          status === 'in_review' ? 'wait for the review' : 'reopen the case to start a new version'
        }.`;
  }

  async function getFindings(caseId: string, actor: Actor): Promise<TFindingsResponse> {
    await assertCaseMember(db, caseId, actor, SEE_FINDINGS);
    return readFindings(caseId);
  }

  async function readFindings(caseId: string): Promise<TFindingsResponse> {
    const state = await loadCaseState(db, caseId);
    const [draft] = await db.select().from(findingDrafts).where(eq(findingDrafts.caseId, caseId));
    const latest = await latestVersionNumber(db, caseId);
    const people = await loadPeople(db, draft ? [draft.updatedBy] : []);
    const blocked = await editBlockedReason(db, caseId);
    return {
      caseId,
      caseStatus: state.status,
      draft: draft
        ? {
            content: draft.content as TFindingsDraft,
            updatedBy: people.get(draft.updatedBy) ?? { id: draft.updatedBy, name: '', email: '' },
            updatedAt: draft.updatedAt.toISOString(),
          }
        : null,
      latestVersion: latest,
      canEdit: blocked === null,
      editBlockedReason: blocked,
      safetyCaution: SAFETY_CAUTION,
    };
  }

  async function assertEditable(tx: Transaction, caseId: string, what: string) {
    await assertNotHeld(tx, caseId, what);
    const blocked = await editBlockedReason(tx, caseId);
    if (blocked) throw new AppError('conflict', `${what} is not allowed now. ${blocked}`);
  }

  async function saveDraft(
    caseId: string,
    content: TFindingsDraft,
    actor: Actor,
  ): Promise<TFindingsResponse> {
    await db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'edit its findings');
      await assertEditable(tx, caseId, 'Editing the findings');
      await tx
        .insert(findingDrafts)
        .values({ caseId, content, updatedBy: actor.id })
        .onConflictDoUpdate({
          target: findingDrafts.caseId,
          set: { content, updatedBy: actor.id, updatedAt: new Date() },
        });
      await audit.append(tx, {
        actor,
        action: 'findings.save',
        targetType: 'findings_draft',
        targetId: caseId,
        caseId,
        payload: content,
      });
      await lifecycle.noteWorkStarted(tx, caseId, actor, 'findings.save');
    });
    return readFindings(caseId);
  }

  async function submit(
    caseId: string,
    actor: Actor,
  ): Promise<{ version: number; sha256: string; from: string }> {
    await assertCaseMember(db, caseId, actor, 'submit its findings');
    const [pending] = await db.select().from(findingDrafts).where(eq(findingDrafts.caseId, caseId));
    const pendingEvidence = pending ? (ZFindingsContent.safeParse(pending.content).data?.evidence ?? []) : [];
    const causeKinds = await loadCitedCauseKinds(pendingEvidence, replayCauses);
    const submitted = await db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'submit its findings');
      await assertEditable(tx, caseId, 'Submitting the findings');
      const { from } = await lifecycle.assertTransition(tx, caseId, 'in_review', actor.role, false);
      const [draft] = await tx.select().from(findingDrafts).where(eq(findingDrafts.caseId, caseId));
      if (!draft)
        throw new AppError(
          'conflict',
          'There is no findings draft to submit; save one first (PUT .../findings).',
        );
      const content = ZFindingsContent.parse(draft.content);
      await validateEvidence(tx, caseId, content.evidence, causeKinds);
      const state = await loadCaseState(tx, caseId);
      const version = ((await latestVersionNumber(tx, caseId)) ?? 0) + 1;
      const author = (await loadPeople(tx, [actor.id])).get(actor.id);
      if (!author) throw new AppError('not_found', `No user ${actor.id}.`);
      const submittedAt = new Date().toISOString();
      const document: FindingsDocument = {
        schema: 'driftcase.findings/1',
        caseId,
        caseReference: state.reference,
        version,
        author,
        submittedAt,
        content,
      };
      const frozen = freezeFindings(document);
      // The unique (case, version) key makes a racing second submission fail instead of forking.
      await tx
        .insert(findingVersions)
        .values({ id: randomUUID(), caseId, version, authorId: actor.id, submittedAt, ...frozen });
      await lifecycle.transition(tx, caseId, 'in_review', actor.role, false);
      await audit.append(tx, {
        actor,
        action: 'findings.submit',
        targetType: 'findings_version',
        targetId: String(version),
        caseId,
        details: { version, sha256: frozen.sha256, from, to: 'in_review' },
      });
      return { version, sha256: frozen.sha256, from, state, author };
    });
    const { state, author, ...result } = submitted;
    await notify.findingsSubmitted({
      caseId,
      caseReference: state.reference,
      title: state.title,
      version: result.version,
      author,
    });
    return result;
  }

  const versionRow = (caseId: string, version: number) => loadVersionRow(db, caseId, version);

  async function versionStates(caseId: string): Promise<Map<number, (typeof VERSION_STATES)[number]>> {
    const versions = await db
      .select({ version: findingVersions.version })
      .from(findingVersions)
      .where(eq(findingVersions.caseId, caseId))
      .orderBy(asc(findingVersions.version));
    const reviews = await db
      .select({ version: findingReviews.version, kind: findingReviews.kind })
      .from(findingReviews)
      .where(eq(findingReviews.caseId, caseId));
    const last = versions.at(-1)?.version;
    return new Map(
      versions.map(({ version }) => {
        const kinds = reviews.filter((r) => r.version === version).map((r) => r.kind);
        if (kinds.includes('signoff')) return [version, 'signed'];
        if (kinds.includes('return')) return [version, 'returned'];
        return [version, version === last ? 'submitted' : 'superseded'];
      }),
    );
  }

  async function listVersions(caseId: string, actor: Actor): Promise<TFindingsVersionSummary[]> {
    await assertCaseMember(db, caseId, actor, SEE_FINDINGS);
    return readVersions(caseId);
  }

  /** The case's findings versions, unchecked: for the archive export, which checks membership once. */
  async function readVersions(caseId: string): Promise<TFindingsVersionSummary[]> {
    await loadCaseState(db, caseId);
    const rows = await db
      .select()
      .from(findingVersions)
      .where(eq(findingVersions.caseId, caseId))
      .orderBy(asc(findingVersions.version));
    const people = await loadPeople(
      db,
      rows.map((r) => r.authorId),
    );
    const states = await versionStates(caseId);
    return rows.map((row) => ({
      version: row.version,
      sha256: row.sha256,
      author: people.get(row.authorId) ?? { id: row.authorId, name: '', email: '' },
      submittedAt: row.submittedAt,
      state: states.get(row.version) ?? 'submitted',
    }));
  }

  async function diffVersions(
    caseId: string,
    from: number,
    to: number,
    actor: Actor,
  ): Promise<TFindingsDiff> {
    await assertCaseMember(db, caseId, actor, SEE_FINDINGS);
    const [before, after] = await Promise.all([versionRow(caseId, from), versionRow(caseId, to)]);
    const content = (row: FindingVersionRow) => (JSON.parse(row.canonical) as FindingsDocument).content;
    return { from, to, changes: diffJson(content(before), content(after)) };
  }

  /** What each citable item of the case is called, so citations read by name. */
  async function getEvidenceNames(caseId: string, actor: Actor) {
    await assertCaseMember(db, caseId, actor, SEE_FINDINGS);
    return readEvidenceNames(db, caseId);
  }

  return {
    getFindings,
    getEvidenceNames,
    saveDraft,
    submit,
    versionRow,
    versionStates,
    listVersions,
    readVersions,
    diffVersions,
    editBlockedReason,
  };
}

export type FindingsService = ReturnType<typeof createFindingsService>;
