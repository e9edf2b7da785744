import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import type { TFindingsVersion, TSignatureStatus } from '../../../../shared/contracts/findings';
import { AppError } from '../../../../shared/errors';
import { SAFETY_CAUTION } from '../../../../shared/safety-caution';
import type { Database } from '../../db/client';
import { findingReviews } from '../../db/schema';
import { loadCaseState } from '../lifecycle/case-state';
import type { LifecycleService } from '../lifecycle/lifecycle-service';
import type { Notifications } from '../mail/notifications';
import { signDetached, verifyDetached } from '../signing/detached-jws';
import type { SigningKeyStore } from '../signing/signing-key';
import type { FindingsDocument } from './findings-document';
import type { Actor, FindingsService } from './findings-service';
import { loadPeople } from './people';

/** Reviewer decisions on findings versions: detached-JWS sign-off or return with a comment. */
export function createReviewService(deps: {
  db: Database;
  findings: FindingsService;
  lifecycle: LifecycleService;
  notify: Notifications;
  keys: SigningKeyStore;
}) {
  const { db, findings, lifecycle, notify, keys } = deps;
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
  async function getVersion(caseId: string, version: number): Promise<TFindingsVersion> {
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

  async function assertReviewable(caseId: string, version: number, reviewer: Actor, verb: string) {
    const row = await findings.versionRow(caseId, version);
    const { status } = await loadCaseState(db, caseId);
    const latest = (await findings.listVersions(caseId)).at(-1)?.version;
    if (status !== 'in_review' || latest !== version) {
      throw new AppError(
        'illegal_transition',
        `Version ${version} cannot be ${verb}: the case is ${status} and the version under review is ${
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

  async function signOff(caseId: string, version: number, reviewer: Actor & { email: string }) {
    const row = await assertReviewable(caseId, version, reviewer, 'signed');
    await lifecycle.assertTransition(caseId, 'signed_off', reviewer.role, false);
    const signingKey = await keys.current();
    const signedAt = new Date().toISOString();
    const jws = await signDetached(encoder.encode(row.canonical), signingKey, {
      signedBy: reviewer.email,
      signedAt,
    });
    await db.insert(findingReviews).values({
      id: randomUUID(),
      caseId,
      version,
      kind: 'signoff',
      reviewerId: reviewer.id,
      at: signedAt,
      jws,
      kid: signingKey.kid,
      meta: { acknowledgedCaution: SAFETY_CAUTION },
    });
    await lifecycle.transition(caseId, 'signed_off', reviewer.role, false);
    await notify.findingsReviewed({
      caseId,
      version,
      authorId: row.authorId,
      kind: 'signoff',
      reviewerEmail: reviewer.email,
    });
    return {
      version,
      jws,
      signature: await checkSignature(jws, row.canonical),
      safetyCaution: SAFETY_CAUTION,
    };
  }

  async function returnVersion(
    caseId: string,
    version: number,
    comment: string,
    reviewer: Actor & { email: string },
  ) {
    const row = await assertReviewable(caseId, version, reviewer, 'returned');
    await lifecycle.assertTransition(caseId, 'changes_requested', reviewer.role, false);
    await db.insert(findingReviews).values({
      id: randomUUID(),
      caseId,
      version,
      kind: 'return',
      reviewerId: reviewer.id,
      at: new Date().toISOString(),
      comment,
    });
    await lifecycle.transition(caseId, 'changes_requested', reviewer.role, false);
    await notify.findingsReviewed({
      caseId,
      version,
      authorId: row.authorId,
      kind: 'return',
      reviewerEmail: reviewer.email,
      comment,
    });
    return getVersion(caseId, version);
  }

  return { getVersion, signOff, returnVersion };
}

export type ReviewService = ReturnType<typeof createReviewService>;
