import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import { CASE_STATUS_LABELS } from '../../../../shared/contracts/cases';
import type { TFindingsVersion, TSignatureStatus } from '../../../../shared/contracts/findings';
import { AppError } from '../../../../shared/errors';
import { SAFETY_CAUTION } from '../../../../shared/safety-caution';
import type { Database, Transaction } from '../../db/client';
import { type FindingVersionRow, findingReviews } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { loadCaseState } from '../lifecycle/case-state';
import type { LifecycleService } from '../lifecycle/lifecycle-service';
import type { Notifications } from '../mail/notifications';
import { assertCaseMember } from '../membership/case-access';
import { signDetached, verifyDetached } from '../signing/detached-jws';
import type { SigningKeyStore } from '../signing/signing-key';
import type { FindingsDocument } from './findings-document';
import { type FindingsService, latestVersionNumber, loadVersionRow } from './findings-service';
import { loadPeople } from './people';

/** Reviewer decisions on findings versions: detached-JWS sign-off or return with a comment. */
export function createReviewService(deps: {
  db: Database;
  audit: AuditService;
  findings: FindingsService;
  lifecycle: LifecycleService;
  notify: Notifications;
  keys: SigningKeyStore;
}) {
  const { db, audit, findings, lifecycle, notify, keys } = deps;
  const encoder = new TextEncoder();

  async function checkSignature(jws: string, canonical: string): Promise<TSignatureStatus> {
    const check = await verifyDetached(jws, encoder.encode(canonical), await keys.jwks());
    return {
      valid: check.valid,
      kid: check.header.kid ?? null,
      signedBy: check.header.signedBy ?? null,
      signedAt: check.header.signedAt ?? null,
      ...(check.valid ? {} : { error: check.error }),
    };
  }

  /** A version with its reviews; a signed one has its signature checked again on every read. */
  async function getVersion(caseId: string, version: number, actor: Actor): Promise<TFindingsVersion> {
    await assertCaseMember(db, caseId, actor, 'see its findings');
    return readVersion(caseId, version);
  }

  /** One version, unchecked: for the archive export, which checks membership once. */
  async function readVersion(caseId: string, version: number): Promise<TFindingsVersion> {
    const row = await findings.versionRow(caseId, version);
    const reviews = await db
      .select()
      .from(findingReviews)
      .where(and(eq(findingReviews.caseId, caseId), eq(findingReviews.version, version)))
      .orderBy(asc(findingReviews.at));
    const people = await loadPeople(db, [row.authorId, ...reviews.map((r) => r.reviewerId)]);
    const person = (id: string) => people.get(id) ?? { id, name: '', email: '' };
    const signoff = reviews.find((r) => r.kind === 'signoff' && r.jws);
    const document = JSON.parse(row.canonical) as FindingsDocument;
    return {
      caseId,
      version,
      sha256: row.sha256,
      author: person(row.authorId),
      submittedAt: row.submittedAt,
      state: (await findings.versionStates(caseId)).get(version) ?? 'submitted',
      content: document.content,
      canonical: row.canonical,
      reviews: reviews.map((r) => ({
        kind: r.kind,
        reviewer: person(r.reviewerId),
        at: r.at,
        comment: r.comment,
        jws: r.jws,
      })),
      signature: signoff?.jws ? await checkSignature(signoff.jws, row.canonical) : null,
      safetyCaution: SAFETY_CAUTION,
    };
  }

  async function assertReviewable(
    tx: Transaction,
    caseId: string,
    version: number,
    reviewer: Actor,
    verb: string,
  ) {
    const row = await loadVersionRow(tx, caseId, version);
    const { status } = await loadCaseState(tx, caseId);
    const latest = await latestVersionNumber(tx, caseId);
    if (status !== 'in_review' || latest !== version) {
      throw new AppError(
        'illegal_transition',
        `Version ${version} cannot be ${verb}: the case is “${CASE_STATUS_LABELS[status]}” and the version under review is ${
          status === 'in_review' ? latest : 'none'
        }.`,
      );
    }
    if (row.authorId === reviewer.id) {
      throw new AppError(
        'forbidden',
        `You wrote version ${version}, so you cannot ${verb === 'signed' ? 'sign' : 'return'} it; another reviewer must.`,
      );
    }
    return row;
  }

  /**
   * One reviewer decision in one transaction: the checks, the review row, the case's move and the
   * audit entry. `review` gives the decision's own columns and facts (signature or comment).
   */
  async function decide(
    caseId: string,
    version: number,
    reviewer: Actor,
    decision: {
      kind: 'signoff' | 'return';
      to: 'signed_off' | 'changes_requested';
      action: 'findings.signoff' | 'findings.return';
      review: (row: FindingVersionRow) => Promise<{
        columns: { at: string; jws?: string; kid?: string; comment?: string; meta?: unknown };
        details: Record<string, unknown>;
        payload: Record<string, unknown>;
      }>;
    },
  ) {
    const verb = decision.kind === 'signoff' ? 'signed' : 'returned';
    return db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, reviewer, `review its findings`);
      const row = await assertReviewable(tx, caseId, version, reviewer, verb);
      await lifecycle.assertTransition(tx, caseId, decision.to, reviewer.role, false);
      const { columns, details, payload } = await decision.review(row);
      await tx.insert(findingReviews).values({
        id: randomUUID(),
        caseId,
        version,
        kind: decision.kind,
        reviewerId: reviewer.id,
        ...columns,
      });
      await lifecycle.transition(tx, caseId, decision.to, reviewer.role, false);
      await audit.append(tx, {
        actor: reviewer,
        action: decision.action,
        targetType: 'findings_version',
        targetId: String(version),
        caseId,
        details: { version, ...details, to: decision.to },
        payload: { version, ...payload },
      });
      return { row, jws: columns.jws };
    });
  }

  async function signOff(caseId: string, version: number, reviewer: Actor) {
    const signingKey = await keys.current();
    const { row, jws } = await decide(caseId, version, reviewer, {
      kind: 'signoff',
      to: 'signed_off',
      action: 'findings.signoff',
      review: async (reviewed) => {
        const at = new Date().toISOString();
        const signature = await signDetached(encoder.encode(reviewed.canonical), signingKey, {
          signedBy: reviewer.email,
          signedAt: at,
        });
        return {
          columns: { at, jws: signature, kid: signingKey.kid, meta: { acknowledgedCaution: SAFETY_CAUTION } },
          details: { kid: signingKey.kid },
          payload: { sha256: reviewed.sha256, jws: signature },
        };
      },
    });
    await notify.findingsReviewed({
      caseId,
      version,
      authorId: row.authorId,
      kind: 'signoff',
      reviewerEmail: reviewer.email,
    });
    const signed = jws as string;
    return {
      version,
      jws: signed,
      signature: await checkSignature(signed, row.canonical),
      safetyCaution: SAFETY_CAUTION,
    };
  }

  async function returnVersion(caseId: string, version: number, comment: string, reviewer: Actor) {
    const { row } = await decide(caseId, version, reviewer, {
      kind: 'return',
      to: 'changes_requested',
      action: 'findings.return',
      review: async () => ({
        columns: { at: new Date().toISOString(), comment },
        details: {},
        payload: { comment },
      }),
    });
    await notify.findingsReviewed({
      caseId,
      version,
      authorId: row.authorId,
      kind: 'return',
      reviewerEmail: reviewer.email,
      comment,
    });
    return readVersion(caseId, version);
  }

  return { getVersion, readVersion, signOff, returnVersion };
}

export type ReviewService = ReturnType<typeof createReviewService>;
