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
    // An incident replay of its own (the seeded one may still be running), then the manifest's own
    // settings again: the same digest as the incident replay, so nothing improves.
    await replayOverApi(engineer, bundleId, { label: `Incident ${Date.now() % 100_000}` });
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
    // Side by side, causes too: the same settings found the same causes (same digest).
    const causes = card.getByRole('row', { name: /Probable causes/ }).getByRole('cell');
    await expect.poll(() => causes.allTextContents(), { timeout: 15_000 }).not.toContain('…');
    const [originalCauses, verificationCauses] = await causes.allTextContents();
    expect(originalCauses).not.toBe('—');
    expect(verificationCauses).toBe(originalCauses);
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

  it('starts the verification replay from the settings form, not from typed JSON', async () => {
    const engineer = await browser.open();
    await signInAs(engineer, 'engineer');
    const { caseId } = await findCase(engineer, MOVED_RACK_CASE);
    await engineer.goto(`/cases/${caseId}/fixes`);
    await engineer.getByRole('button', { name: 'Link a fix' }).click();
    expect(await engineer.getByLabel(/Fixed settings/).count()).toBe(0);
    const description = `Particle count raised ${Date.now() % 100_000}`;
    await engineer.getByLabel(/Change request or ticket URL/).fill('https://tracker.example/CR-2251');
    await engineer.getByLabel('Description').fill(description);

    const settings = engineer
      .getByRole('region', { name: 'Start a verification replay' })
      .getByRole('form', { name: 'Start a replay' });
    // The fields start at the manifest's settings, as in the workspace.
    expect(await settings.getByRole('textbox', { name: 'Particles' }).inputValue()).not.toBe('');
    await settings.getByRole('textbox', { name: 'Label' }).fill('Verification, 900 particles');
    await settings.getByRole('textbox', { name: 'Particles' }).fill('900');
    await settings.getByRole('button', { name: 'Start replay' }).click();
    await expect
      .poll(() => engineer.getByLabel(/Verification replay/).inputValue(), { timeout: 15_000 })
      .not.toBe('');
    await saveScreenshot(engineer, 'fix-link-settings-form');
    await engineer.getByRole('button', { name: 'Link fix' }).click();
    await engineer.getByRole('article', { name: `Fix: ${description}` }).waitFor();

    // What was typed in the form is what the replay ran with (the only override).
    const fixes = (await (await engineer.request.get(`/api/cases/${caseId}/fixes`)).json()).items as {
      description: string;
      verificationReplayId: string;
    }[];
    const replayId = fixes.find((fix) => fix.description === description)?.verificationReplayId;
    const replay = await (await engineer.request.get(`/api/replays/${replayId}`)).json();
    expect(replay.overrides).toEqual({ particles: 900 });
    expect(replay.label).toBe('Verification, 900 particles');
    await engineer.context().close();
  });
});
