import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import type { Role } from '@shared/roles';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

// One of the seeded demo cases (invented site "Harbourline Cold Store"); other browser tests leave it alone.
const CASE_TITLE = 'Contact with rack row B after the overnight re-layout';

async function findCaseId(page: Page): Promise<{ id: string; reference: string }> {
  const response = await page.request.get(`/api/cases?q=${encodeURIComponent(CASE_TITLE)}`);
  const body = (await response.json()) as { items: { id: string; reference: string; title: string }[] };
  const found = body.items.find((item) => item.title === CASE_TITLE);
  if (!found) throw new Error(`case-work e2e: the demo case "${CASE_TITLE}" is not seeded`);
  return found;
}

/** Starts a replay over the API (as the signed-in person) and waits until it is done. */
async function runReplay(page: Page, caseId: string, label: string): Promise<string> {
  const cookies = await page.context().cookies();
  const csrf = cookies.find((cookie) => cookie.name === CSRF_COOKIE)?.value ?? '';
  const bundles = (await (await page.request.get(`/api/cases/${caseId}/bundles`)).json()) as {
    items: { id: string }[];
  };
  const bundleId = bundles.items[0]?.id;
  const started = await page.request.post(`/api/bundles/${bundleId}/replays`, {
    headers: { [CSRF_HEADER]: csrf },
    data: { label },
  });
  expect(started.status()).toBe(202);
  const { id } = (await started.json()) as { id: string };
  for (let attempt = 0; attempt < 120; attempt += 1) {
    const list = (await (await page.request.get(`/api/bundles/${bundleId}/replays`)).json()) as {
      items: { id: string; status: string }[];
    };
    const status = list.items.find((replay) => replay.id === id)?.status;
    if (status === 'done') return id;
    if (status === 'failed' || status === 'cancelled') throw new Error(`replay ${id} ended ${status}`);
    await page.waitForTimeout(500);
  }
  throw new Error(`replay ${id} did not finish within 60 s`);
}

async function openAs(browser: ReturnType<typeof useBrowser>, role: Role, path: string): Promise<Page> {
  const page = await browser.open();
  await signInAs(page, role);
  await page.goto(path);
  return page;
}

describe('case work', () => {
  const browser = useBrowser();

  it('walks findings, send-back, resubmission, sign-off, fix and verification, all audited and mailed', async () => {
    // 1. The investigator cites a replay in the findings and submits them.
    const investigator = await browser.open();
    await signInAs(investigator, 'investigator');
    const { id: caseId, reference } = await findCaseId(investigator);
    const replayLabel = `Incident replay ${Date.now() % 100_000}`;
    await runReplay(investigator, caseId, replayLabel);

    await investigator.goto(`/cases/${caseId}/findings`);
    await investigator.getByRole('heading', { name: 'Findings', exact: true }).waitFor();
    await investigator
      .getByLabel('Summary')
      .fill('Tug touched rack B2 upright at 0.2 m/s after the re-layout.');
    await investigator.getByLabel('Incident class').selectOption('contact_no_injury');
    await investigator.getByLabel('Root cause category').selectOption('map_out_of_date');
    await investigator
      .getByLabel('Root cause explained')
      .fill('The map still showed row B in its old place.');
    await investigator.getByLabel('Cite a').selectOption('replay');
    const replaySelect = investigator.getByLabel('Replay', { exact: true });
    const replayOption = replaySelect.locator('option', { hasText: replayLabel });
    await replayOption.waitFor({ state: 'attached' });
    await replaySelect.selectOption((await replayOption.getAttribute('value')) ?? '');
    await investigator.getByRole('button', { name: 'Add evidence' }).click();
    await investigator
      .getByText(/digest [0-9a-f]{16,}/)
      .first()
      .waitFor();
    // Cited by name, opening the replay it cites (not by its id).
    const cited = investigator.getByTestId('evidence-citation').getByRole('link', { name: replayLabel });
    await cited.waitFor();
    expect(await cited.getAttribute('href')).toContain(`replay=`);
    await investigator.getByRole('button', { name: 'Add corrective action' }).click();
    await investigator
      .getByLabel('Corrective action 1', { exact: true })
      .fill('Re-map dock hall B after every layout change');
    await investigator.getByLabel('Owner of action 1').fill('Site engineering, Dock Hall B');
    await investigator.getByLabel('Due date of action 1').fill('2026-12-01');
    await investigator.getByText('Safety caution.').first().waitFor();
    await saveScreenshot(investigator, 'findings-editor');
    await investigator.getByRole('button', { name: 'Submit for review' }).click();
    await investigator
      .getByRole('dialog', { name: 'Submit these findings for review?' })
      .getByRole('button', { name: 'Submit' })
      .click();
    await investigator.getByRole('heading', { name: 'Findings version 1' }).waitFor();

    // 2. The reviewer returns version 1 with a comment.
    const reviewer = await openAs(browser, 'reviewer', `/cases/${caseId}/findings/versions/1`);
    await reviewer.getByRole('button', { name: 'Return with comments' }).click();
    const sendBack = reviewer.getByRole('dialog', { name: 'Return version 1 with comments' });
    await sendBack.getByRole('button', { name: 'Return to the author' }).click();
    await sendBack.getByText('Say what needs to change').waitFor(); // the comment is required
    await sendBack
      .getByLabel('Comments for the author')
      .fill('Name the layout change and when the map was last built.');
    await sendBack.getByRole('button', { name: 'Return to the author' }).click();
    await reviewer.getByText('Name the layout change and when the map was last built.').first().waitFor();

    // 3. The investigator edits and resubmits: version 2.
    await investigator.goto(`/cases/${caseId}/findings`);
    const summary = investigator.getByLabel('Summary');
    await summary.fill(
      'Tug touched rack B2 upright at 0.2 m/s; row B moved 1.2 m overnight, map built a week before.',
    );
    await investigator.getByRole('button', { name: 'Submit for review' }).click();
    await investigator
      .getByRole('dialog', { name: 'Submit these findings for review?' })
      .getByRole('button', { name: 'Submit' })
      .click();
    await investigator.getByRole('heading', { name: 'Findings version 2' }).waitFor();
    await investigator.getByRole('link', { name: 'Changes from version 1' }).first().click();
    await investigator.getByRole('cell', { name: 'Summary' }).waitFor();

    // 4. The reviewer signs version 2 after ticking the caution.
    await reviewer.goto(`/cases/${caseId}/findings/versions/2`);
    await reviewer.getByRole('button', { name: 'Sign off', exact: true }).click();
    const sign = reviewer.getByRole('dialog', { name: 'Sign off findings version 2' });
    await sign.getByRole('complementary', { name: 'Safety caution' }).waitFor();
    await sign.getByRole('button', { name: 'Sign off version 2' }).click();
    await sign.getByText(/Tick that you have read the safety caution/).waitFor();
    await sign.getByLabel('I have read this safety caution.').check();
    await sign.getByRole('button', { name: 'Sign off version 2' }).click();
    await reviewer.getByText('Signature valid').waitFor();
    await saveScreenshot(reviewer, 'findings-signed-version');

    // 5. The engineer links a fix with a verification replay started from the form.
    const engineer = await openAs(browser, 'engineer', `/cases/${caseId}/fixes`);
    await engineer.getByRole('button', { name: 'Link a fix' }).click();
    await engineer.getByLabel(/Change request or ticket URL/).fill('https://tracker.example/CR-2217');
    await engineer
      .getByLabel('Description')
      .fill('Map rebuilt after the row B move; layout changes now trigger a re-map.');
    await engineer.getByLabel(/Software version/).fill('nav-stack 4.12.1');
    const settings = engineer
      .getByRole('region', { name: 'Start a verification replay' })
      .getByRole('form', { name: 'Start a replay' });
    await settings.getByRole('textbox', { name: 'Particles' }).fill('800');
    await settings.getByRole('button', { name: 'Start replay' }).click();
    await expect
      .poll(() => engineer.getByLabel(/Verification replay/).inputValue(), { timeout: 15_000 })
      .not.toBe('');
    await engineer.getByRole('button', { name: 'Link fix' }).click();
    const fixCard = engineer.getByRole('article', { name: /Fix: Map rebuilt/ });
    await fixCard.getByText('RMSE against reference').waitFor({ timeout: 60_000 });

    // 6. The investigator marks it verified, with a comment (and the confirmation, were nothing better).
    await investigator.goto(`/cases/${caseId}/fixes`);
    const verifiedCard = investigator.getByRole('article', { name: /Fix: Map rebuilt/ });
    await verifiedCard.getByText('RMSE against reference').waitFor({ timeout: 60_000 });
    await verifiedCard.getByRole('button', { name: 'Mark verified' }).click();
    const verifyDialog = investigator.getByRole('dialog', { name: 'Mark the fix verified' });
    await verifyDialog
      .getByLabel('What you checked')
      .fill('Verification replay checked beside the incident.');
    const confirmation = verifyDialog.getByLabel(/I verify this fix although/);
    if ((await confirmation.count()) > 0) await confirmation.check();
    await verifyDialog.getByRole('button', { name: 'Mark verified' }).click();
    await verifiedCard
      .getByText(/Verified by/)
      .first()
      .waitFor();

    // 7. The reviewer sees every step in the audit trail, and the chain verifies.
    await reviewer.goto(`/cases/${caseId}`);
    await reviewer.getByRole('list', { name: 'Case history' }).waitFor();
    await reviewer.getByText('Fix marked verified').waitFor();
    await saveScreenshot(reviewer, 'case-work-case-page');
    await reviewer.goto(`/cases/${caseId}/audit`);
    await reviewer.getByRole('table').waitFor();
    // People read the actions' labels; the recorded codes stay in a data attribute for machines.
    const actions = await reviewer
      .locator('tbody td:nth-child(5) [data-action]')
      .evaluateAll((cells) => cells.map((cell) => cell.getAttribute('data-action')));
    for (const action of [
      'findings.submit',
      'findings.return',
      'findings.signoff',
      'fix.link',
      'fix.verify',
    ]) {
      expect(actions).toContain(action);
    }
    expect(actions.filter((action) => action === 'findings.submit')).toHaveLength(2);
    const labels = await reviewer.locator('tbody td:nth-child(5)').allInnerTexts();
    expect(labels).toContain('Findings submitted for sign-off');
    expect(labels).not.toContain('findings.submit');
    await reviewer.getByRole('button', { name: 'Verify chain' }).click();
    await reviewer.getByText(/Chain intact: \d+ entries verified/).waitFor();
    await saveScreenshot(reviewer, 'case-work-audit');

    // 8. The admin finds the mails in the Outbox.
    const admin = await openAs(browser, 'admin', '/admin/outbox');
    await admin.getByRole('heading', { name: 'Outbox' }).waitFor();
    await admin.getByRole('table').waitFor();
    const subjects = await admin.locator('tbody td:nth-child(3)').allInnerTexts();
    const mine = subjects.filter((subject) => subject.includes(reference));
    for (const expected of [
      'findings v1 ready for review',
      'findings v1 returned with comments',
      'findings v2 ready for review',
      'findings v2 signed off',
      'fix linked',
    ]) {
      expect(mine.some((subject) => subject.includes(expected))).toBe(true);
    }
    await admin.getByRole('button', { name: new RegExp(`${reference}: fix linked`) }).click();
    await admin
      .getByRole('article')
      .getByText('tracker.example', { exact: false })
      .waitFor()
      .catch(() => undefined);
    await saveScreenshot(admin, 'case-work-outbox');

    for (const page of [investigator, reviewer, engineer, admin]) await page.context().close();
  });

  it('legal places a hold: the case shows a banner and the findings cannot be edited until it is lifted', async () => {
    const legal = await browser.open();
    await signInAs(legal, 'legal');
    const cases = (await (await legal.request.get('/api/cases?q=freezer')).json()) as {
      items: { id: string }[];
    };
    const caseId = cases.items[0]?.id ?? '';
    await legal.goto(`/cases/${caseId}`);
    await legal.getByRole('button', { name: 'Place legal hold' }).click();
    const dialog = legal.getByRole('dialog', { name: 'Place a legal hold' });
    await dialog.getByLabel('Reason').fill('Insurer notified; preserve all records.');
    await dialog.getByRole('button', { name: 'Place hold' }).click();
    await legal.getByText('Legal hold: nothing of this case may be deleted or edited').waitFor();

    const investigator = await openAs(browser, 'investigator', `/cases/${caseId}/findings`);
    await investigator.getByText('Editing is not possible now').waitFor();
    expect(await investigator.getByRole('button', { name: 'Save draft' }).isDisabled()).toBe(true);

    await legal.getByRole('button', { name: 'Lift hold' }).click();
    await legal
      .getByRole('dialog', { name: 'Lift the legal hold' })
      .getByRole('button', { name: 'Lift hold' })
      .click();
    await legal.getByRole('button', { name: 'Place legal hold' }).waitFor();
    await investigator.reload();
    await investigator.getByLabel('Summary').waitFor();
    expect(await investigator.getByRole('button', { name: 'Save draft' }).isDisabled()).toBe(false);
    for (const page of [legal, investigator]) await page.context().close();
  });
});
