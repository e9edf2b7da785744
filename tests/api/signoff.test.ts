import { base64url, compactVerify, createLocalJWKSet, type JSONWebKeySet } from 'jose';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SAFETY_CAUTION } from '../../shared/safety-caution';
import { as, submittedCase } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

/** Re-attaches a detached payload (RFC 7515 Appendix F) and verifies with jose against the JWK set. */
async function verifyWithJose(jws: string, payload: Uint8Array, jwks: JSONWebKeySet) {
  const [header, , signature] = jws.split('.');
  return compactVerify(`${header}.${base64url.encode(payload)}.${signature}`, createLocalJWKSet(jwks));
}

describe('findings sign-off', () => {
  it('signs the canonical version so jose verifies it with the published key, and one flipped byte fails', async () => {
    const { caseId, version } = await submittedCase(t);
    const signed = await as(t, 'reviewer').post(`/api/cases/${caseId}/findings/versions/${version}/signoff`, {
      acknowledgeCaution: true,
    });
    expect(signed.status).toBe(201);
    expect(signed.body.safetyCaution).toBe(SAFETY_CAUTION);
    const jws: string = signed.body.jws;
    // RFC 7515 Appendix F: a detached JWS has an empty payload part.
    expect(jws.split('.')[1]).toBe('');

    const jwks = (await request(t.app).get('/api/keys').expect(200)).body as JSONWebKeySet;
    const stored = await as(t, 'legal').get(`/api/cases/${caseId}/findings/versions/${version}`);
    const payload = new TextEncoder().encode(stored.body.canonical);
    const { protectedHeader } = await verifyWithJose(jws, payload, jwks);
    expect(protectedHeader.alg).toBe('EdDSA');
    expect(protectedHeader.kid).toBe(jwks.keys[0].kid);
    expect(stored.body.signature).toMatchObject({
      valid: true,
      kid: jwks.keys[0].kid,
      signedBy: 'reviewer@driftcase.example',
    });

    const flipped = payload.slice();
    flipped[20] ^= 0x01;
    await expect(verifyWithJose(jws, flipped, jwks)).rejects.toThrow();
  });

  it('refuses the author of a version as its signer', async () => {
    const { caseId, version } = await submittedCase(t);
    const reviewer = await as(t, 'reviewer').get('/api/auth/me');
    const versionBody = await as(t, 'reviewer').get(`/api/cases/${caseId}/findings/versions/${version}`);
    expect(versionBody.body.author.id).not.toBe(reviewer.body.user.id);
    // Forge authorship at the data layer to the reviewer, then the same reviewer must be refused.
    const { findingVersions } = await import('../../api/src/db/schema');
    const { eq } = await import('drizzle-orm');
    await t.database.db
      .update(findingVersions)
      .set({ authorId: reviewer.body.user.id })
      .where(eq(findingVersions.caseId, caseId));
    const res = await as(t, 'reviewer').post(`/api/cases/${caseId}/findings/versions/${version}/signoff`, {
      acknowledgeCaution: true,
    });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toContain('cannot sign');
  });

  it('requires acknowledgeCaution to be literally true, naming the field', async () => {
    const { caseId, version } = await submittedCase(t);
    const res = await as(t, 'reviewer').post(`/api/cases/${caseId}/findings/versions/${version}/signoff`, {
      acknowledgeCaution: 'yes',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('acknowledgeCaution');
  });

  it('returns, resubmits as a new version and shows what changed; editing in review is refused', async () => {
    const { caseId, version } = await submittedCase(t);
    const blocked = await as(t, 'investigator').put(`/api/cases/${caseId}/findings`, { summary: 'x' });
    expect(blocked.status).toBe(409);
    const returned = await as(t, 'reviewer').post(
      `/api/cases/${caseId}/findings/versions/${version}/return`,
      {
        comment: 'Name the ramp.',
      },
    );
    expect(returned.status).toBe(200);
    const draft = (await as(t, 'investigator').get(`/api/cases/${caseId}/findings`)).body.draft.content;
    await as(t, 'investigator').put(`/api/cases/${caseId}/findings`, {
      ...draft,
      summary: 'Wet ramp B at dock 4.',
    });
    const second = await as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
    expect(second.body.version).toBe(2);
    const diff = await as(t, 'reviewer').get(`/api/cases/${caseId}/findings/versions/2/diff`);
    expect(diff.body.changes).toEqual([
      { path: 'summary', before: draft.summary, after: 'Wet ramp B at dock 4.' },
    ]);
  });

  it('refuses edits while the case is on legal hold (409 on_hold)', async () => {
    const { caseId } = await submittedCase(t);
    await as(t, 'legal').post(`/api/cases/${caseId}/hold`, { reason: 'Claim notice' });
    const res = await as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('on_hold');
  });
});
