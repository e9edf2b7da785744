import { describe, expect, it } from 'vitest';
import { saveScreenshot, useBrowser } from './support/browser';
import {
  findCase,
  linkFixOverApi,
  MOVED_RACK_CASE,
  replayOverApi,
  signedCaseOverApi,
} from './support/fix-cases';
import { signInAs } from './support/sign-in';

// Issue #12, point 6: "Mark verified" asks for a comment, warns when nothing improved, and is recorded.
describe('fix verification that verifies', () => {
  const browser = useBrowser();

  it('asks for a comment, warns that an unchanged replay improved nothing, needs a confirmation and records it', async () => {
    const engineer = await browser.open();
    await signInAs(engineer, 'engineer');
    const { caseId, bundleId } = await findCase(engineer, MOVED_RACK_CASE);
    // The manifest's own settings again: the same digest as the incident replay, so nothing improves.
    const unchanged = await replayOverApi(engineer, bundleId, { label: `Unchanged ${Date.now() % 100_000}` });
    const description = await linkFixOverApi(engineer, caseId, {
      description: `Speed limit note only ${Date.now() % 100_000}`,
      verificationReplayId: unchanged,
    });

    const investigator = await browser.open();
    await signInAs(investigator, 'investigator');
    await investigator.goto(`/cases/${caseId}/fixes`);
    const card = investigator.getByRole('article', { name: `Fix: ${description}` });
    await card.getByText('RMSE against reference').waitFor({ timeout: 60_000 });
    await card.getByRole('button', { name: 'Mark verified' }).click();

    const dialog = investigator.getByRole('dialog', { name: 'Mark the fix verified' });
    await dialog.getByText('Nothing improved').waitFor();
    await dialog.getByText(/did not improve on the original/).waitFor();
    await dialog.getByRole('button', { name: 'Mark verified' }).click();
    await dialog.getByText(/Write a comment saying what you checked/).waitFor();

    const comment = 'Same flags as the incident: the fix is a speed limit the replay cannot show.';
    await dialog.getByLabel('What you checked').fill(comment);
    await dialog.getByRole('button', { name: 'Mark verified' }).click();
    await dialog.getByText(/Tick that you verify the fix although nothing improved/).waitFor();
    expect(await card.getByText(/Verified by/).count()).toBe(0);

    await dialog.getByLabel(/I verify this fix although/).check();
    await saveScreenshot(investigator, 'fix-verify-dialog-warning');
    await dialog.getByRole('button', { name: 'Mark verified' }).click();
    await card.getByText(comment).waitFor();
    await card.getByText(/confirmed although the replay showed no improvement/).waitFor();

    // Recorded: the case history (which reviewers read) shows the verification with its comment.
    const reviewer = await browser.open();
    await signInAs(reviewer, 'reviewer');
    await reviewer.goto(`/cases/${caseId}`);
    const history = reviewer.getByRole('list', { name: 'Case history' });
    await history.getByText(comment).first().waitFor();
    for (const page of [engineer, investigator, reviewer]) await page.context().close();
  });

  it('names in "Your move" only what the signed-in role can do on a signed case', async () => {
    const [investigator, reviewer, engineer] = await Promise.all([
      browser.open(),
      browser.open(),
      browser.open(),
    ]);
    await signInAs(investigator, 'investigator');
    await signInAs(reviewer, 'reviewer');
    await signInAs(engineer, 'engineer');
    const caseId = await signedCaseOverApi(investigator, reviewer);
    const yourMove = (page: typeof engineer) => page.locator('p').filter({ hasText: 'Your move:' });

    // No fix yet: the engineer is told to link one, never to verify or close (no such button).
    await engineer.goto(`/cases/${caseId}`);
    await yourMove(engineer)
      .getByText(/Link the fix/)
      .waitFor();
    expect(await yourMove(engineer).textContent()).not.toMatch(/close|verify/i);
    expect(await engineer.getByRole('button', { name: /Close/ }).count()).toBe(0);

    // A fix waits for verification: nothing for the engineer; investigator and reviewer verify.
    await linkFixOverApi(engineer, caseId, { description: 'Cross aisle cleared at every shift end' });
    await engineer.reload();
    // The case-work links appear once the lifecycle has loaded, so an absent "Your move" is real.
    await engineer.getByRole('link', { name: 'Fixes' }).first().waitFor();
    expect(await yourMove(engineer).count()).toBe(0);
    await investigator.goto(`/cases/${caseId}`);
    await yourMove(investigator)
      .getByText(/Verify the linked fix/)
      .waitFor();
    expect(await yourMove(investigator).textContent()).not.toMatch(/close/i);
    await reviewer.goto(`/cases/${caseId}`);
    await yourMove(reviewer)
      .getByText(/Verify the linked fix .* then close the case/)
      .waitFor();
    for (const page of [investigator, reviewer, engineer]) await page.context().close();
  });
});
