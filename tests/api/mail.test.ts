import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as, caseWithDraft, createPerson, submittedCase } from '../support/case-work-fixtures';
import { startCapturingSmtp } from '../support/fake-smtp';
import { createTestApp, type TestApp } from '../support/test-app';

const PUBLIC_URL = 'https://driftcase.harbourline.example';
let t: TestApp;
let smtp: Awaited<ReturnType<typeof startCapturingSmtp>>;

beforeAll(async () => {
  smtp = await startCapturingSmtp();
  t = await createTestApp({ SMTP_URL: smtp.url, PUBLIC_URL });
});
afterAll(async () => {
  await t.close();
  await smtp.close();
});

describe('notifications', () => {
  it('mails reviewers on submit and the author on return, with a link to the case', async () => {
    const { caseId, version } = await submittedCase(t);
    await t.app.locals.services.mailQueue.processDue();
    const submitted = smtp.messages.find((m) => m.subject.includes(`findings v${version} ready for review`));
    expect(submitted?.to).toEqual(['reviewer@driftcase.example']);
    expect(submitted?.text).toContain(`${PUBLIC_URL}/cases/${caseId}`);
    expect(submitted?.html).toContain(`href="${PUBLIC_URL}/cases/${caseId}"`);

    await as(t, 'reviewer').post(`/api/cases/${caseId}/findings/versions/${version}/return`, {
      comment: 'Cite the replay.',
    });
    await t.app.locals.services.mailQueue.processDue();
    const returned = smtp.messages.find((m) => m.subject.includes('returned with comments'));
    expect(returned?.to).toEqual(['investigator@driftcase.example']);
    expect(returned?.text).toContain('Cite the replay.');
  });

  it("mails a submission to the case's reviewers, and to every reviewer when the case has none", async () => {
    await createPerson(t, {
      email: 'second-reviewer@driftcase.example',
      name: 'Sol Ferreira',
      role: 'reviewer',
      password: 'second-reviewer-pw',
    });
    const recipientsOfSubmit = async (caseId: string) => {
      await as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
      await t.app.locals.services.mailQueue.processDue();
      const reference = (await as(t, 'investigator').get(`/api/cases/${caseId}`)).body.reference;
      return smtp.messages.find((m) => m.subject.includes(`${reference}: findings v1 ready`))?.to;
    };
    // The demo reviewer is on this case; the second reviewer is not, so is not mailed.
    expect(await recipientsOfSubmit(await caseWithDraft(t))).toEqual(['reviewer@driftcase.example']);
    const unreviewed = await caseWithDraft(t, undefined, { team: ['engineer'] });
    expect((await recipientsOfSubmit(unreviewed))?.slice().sort()).toEqual([
      'reviewer@driftcase.example',
      'second-reviewer@driftcase.example',
    ]);
  });

  it('keeps a failed send queued with backoff and never fails the action', async () => {
    const broken = await createTestApp({ SMTP_URL: 'smtp://127.0.0.1:1/?ignoreTLS=true' });
    try {
      const { caseId } = await submittedCase(broken);
      expect(caseId).toBeTruthy();
      await broken.app.locals.services.mailQueue.processDue();
      const stats = await broken.app.locals.services.mailQueue.stats();
      expect(stats).toEqual([{ status: 'pending', total: 1 }]);
    } finally {
      await broken.close();
    }
  });
});
