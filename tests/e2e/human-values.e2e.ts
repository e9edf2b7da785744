import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import type { Role } from '@shared/roles';
import type { Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { queryResultSha256 } from '../../shared/query-result-hash';
import { readZipEntries } from '../archive/rewrite-zip';
import { findRawValues, htmlTextPieces } from '../support/raw-values';
import { saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

// A seeded demo case no other browser test changes (invented site; see api/src/seed/demo-cases.ts).
const CASE_TITLE = 'Robot nudged sideways by a reversing reach truck in aisle 3';

/** The text nodes of the whole page, hidden ones included (options, screen-reader text). */
function pageTextPieces(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const pieces: string[] = [];
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let node = walker.nextNode(); node; node = walker.nextNode()) {
      if (!node.parentElement?.closest('script, style')) pieces.push(node.textContent ?? '');
    }
    return pieces;
  });
}

async function expectHumanValues(page: Page, where: string) {
  const found = findRawValues(await pageTextPieces(page));
  expect(found, `raw values on ${where}`).toEqual([]);
}

/** Waits until the page has its data: no skeleton or busy region, and fonts ready for screenshots. */
async function settle(page: Page) {
  await page.waitForLoadState('networkidle');
  await page.waitForFunction(() => !document.querySelector('[aria-busy="true"]'), undefined, {
    timeout: 30_000,
  });
  await page.evaluate(() => document.fonts.ready);
}

/** JSON calls as the signed-in person, with the CSRF header the API wants on writes. */
function apiOf(page: Page) {
  const headers = async () => {
    const csrf = (await page.context().cookies()).find((cookie) => cookie.name === CSRF_COOKIE)?.value ?? '';
    return { [CSRF_HEADER]: csrf };
  };
  const check = async (response: Awaited<ReturnType<Page['request']['get']>>, what: string) => {
    if (!response.ok()) throw new Error(`${what}: ${response.status()} ${await response.text()}`);
    // biome-ignore lint/suspicious/noExplicitAny: a test reads the few fields it needs from JSON answers
    return response.json() as Promise<any>;
  };
  return {
    get: async (url: string) => check(await page.request.get(url), `GET ${url}`),
    post: async (url: string, data: object = {}) =>
      check(await page.request.post(url, { headers: await headers(), data }), `POST ${url}`),
    put: async (url: string, data: object) =>
      check(await page.request.put(url, { headers: await headers(), data }), `PUT ${url}`),
  };
}

describe('human values on every page, mail and report', () => {
  const browser = useBrowser();
  const siteTimeZone = inject('siteTimeZone');

  async function signedIn(role: Role): Promise<Page> {
    const page = await browser.open();
    await signInAs(page, role);
    return page;
  }

  // Not passing yet: its expected "held by … since" line and board columns do not match the
  // merged case path; see the closing note of 2026-12-02. Re-enable when fixed.
  it('a case taken through the whole path shows no raw code or timestamp anywhere', async () => {
    expect(siteTimeZone).toBe('Europe/Berlin');
    const investigator = await signedIn('investigator');
    const asInvestigator = apiOf(investigator);
    const found = await asInvestigator.get(`/api/cases?q=${encodeURIComponent(CASE_TITLE)}`);
    const item = found.items.find((candidate: { title: string }) => candidate.title === CASE_TITLE);
    const caseId: string = item.id;
    const bundleId: string = (await asInvestigator.get(`/api/cases/${caseId}/bundles`)).items[0].id;
    // The seed started one replay of the bundle; wait for it, it is the evidence the findings cite.
    let replay: { id: string; status: string; digest: string } | undefined;
    await expect
      .poll(
        async () => {
          replay = (await asInvestigator.get(`/api/bundles/${bundleId}/replays`)).items[0];
          return replay?.status;
        },
        { timeout: 150_000, interval: 1000 },
      )
      .toBe('done');
    const replayId = replay?.id ?? '';

    // Workspace evidence whose audit actions have compound codes (bookmark.create, saved_query.create).
    await asInvestigator.post(`/api/cases/${caseId}/bookmarks`, {
      replayId,
      step: 3,
      t: 0.3,
      view: { centerX: 4.2, centerY: -1.5, zoom: 40, followRobot: true, layers: ['particles'] },
      note: 'Belief widens as the reach truck pushes the robot.',
    });
    const columns = ['speed_mps'];
    const preview = [[0.4], [0.6]];
    await asInvestigator.post(`/api/cases/${caseId}/queries`, {
      bundleId,
      title: 'Two speed samples',
      sql: 'SELECT 0.4 AS speed_mps UNION ALL SELECT 0.6',
      resultSha256: queryResultSha256(columns, preview),
      rowCount: preview.length,
      columns,
      preview,
    });

    // Findings: drafted, submitted, returned, resubmitted, signed.
    const findings = {
      summary:
        'A reversing reach truck pushed the robot 0.3 m sideways; its belief stayed on the wrong aisle.',
      incidentClass: 'near_miss',
      rootCause: { category: 'environment', text: 'Shared aisle with manual trucks, no separation.' },
      contributingFactors: [],
      evidence: [{ type: 'replay', replayId, digest: replay?.digest }],
      correctiveActions: [
        { description: 'Mark aisle 3 one-way for reach trucks', owner: 'Site safety', dueDate: '2026-12-20' },
      ],
    };
    await asInvestigator.put(`/api/cases/${caseId}/findings`, findings);
    await asInvestigator.post(`/api/cases/${caseId}/findings/submit`);
    const reviewer = await signedIn('reviewer');
    const asReviewer = apiOf(reviewer);
    await asReviewer.post(`/api/cases/${caseId}/findings/versions/1/return`, {
      comment: 'Say how far the robot was pushed and when its belief recovered.',
    });
    await asInvestigator.put(`/api/cases/${caseId}/findings`, {
      ...findings,
      summary: `${findings.summary} It recovered 4 s later.`,
    });
    await asInvestigator.post(`/api/cases/${caseId}/findings/submit`);
    await asReviewer.post(`/api/cases/${caseId}/findings/versions/2/signoff`, { acknowledgeCaution: true });

    // A fix, linked and verified.
    const engineer = await signedIn('engineer');
    const fix = await apiOf(engineer).post(`/api/cases/${caseId}/fixes`, {
      url: 'https://tracker.example/CR-3107',
      description: 'Aisle 3 one-way for reach trucks; robot slows to 0.3 m/s there.',
      verificationReplayId: replayId,
    });
    await asInvestigator.post(`/api/cases/${caseId}/fixes/${fix.id}/verify`, {
      comment: 'Checked the aisle 3 replay.',
      confirmWithoutImprovement: true,
    });

    // The pages each role reads, signed in as someone who may read them.
    const pages: [Page, string][] = [
      [investigator, '/cases'],
      [investigator, '/cases?view=board'],
      [investigator, '/cases/new'],
      [investigator, `/cases/${caseId}`],
      [investigator, `/cases/${caseId}/findings`],
      [investigator, `/bundles/${bundleId}/workspace?replay=${replayId}`],
      [reviewer, `/cases/${caseId}`],
      [reviewer, `/cases/${caseId}/findings/versions/1`],
      [reviewer, `/cases/${caseId}/findings/versions/2`],
      [reviewer, `/cases/${caseId}/findings/diff?from=1&to=2`],
      [reviewer, `/cases/${caseId}/audit`],
      [engineer, `/cases/${caseId}/fixes`],
    ];
    for (const [page, url] of pages) {
      await page.goto(url);
      await settle(page);
      await expectHumanValues(page, url);
    }

    // The case page tells where it stands: signed, fix verified, ready to close, held by a reviewer.
    await reviewer.goto(`/cases/${caseId}`);
    await settle(reviewer);
    const casePath = reviewer.getByRole('region', { name: 'Case path' });
    expect(await casePath.getByTestId('case-standing').innerText()).toBe('Fix verified; ready to close');
    expect(await casePath.innerText()).toMatch(
      /held by Safety reviewer since \d{1,2} [A-Z][a-z]{2} 2026, \d{2}:\d{2} CES?T/,
    );
    expect(await reviewer.getByTestId('site-time-zone').innerText()).toContain('Europe/Berlin');
    await saveScreenshot(reviewer, 'case-page');

    // Legal exports the archive; report.html is read on screen and in print.
    const legal = await signedIn('legal');
    const archiveResponse = await legal.request.get(`/api/cases/${caseId}/archive`);
    expect(archiveResponse.ok()).toBe(true);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-human-values-'));
    const archive = path.join(dir, 'archive.zip');
    fs.writeFileSync(archive, await archiveResponse.body());
    const reportHtml = (await readZipEntries(archive)).get('report.html')!.toString('utf8');
    expect(findRawValues(htmlTextPieces(reportHtml))).toEqual([]);
    const reportFile = path.join(dir, 'report.html');
    fs.writeFileSync(reportFile, reportHtml);
    const report = await browser.open();
    await report.goto(`file://${reportFile}`);
    await report.evaluate(() => document.fonts.ready);
    await expectHumanValues(report, 'report.html');
    expect(await report.locator('body').innerText()).toContain('Times are shown in Europe/Berlin');
    await saveScreenshot(report, 'report-screen');
    await report.emulateMedia({ media: 'print' });
    await saveScreenshot(report, 'report-print');
    fs.rmSync(dir, { recursive: true, force: true });

    // Every mail about the case, as stored and as the outbox shows it.
    const admin = await signedIn('admin');
    const outbox = await apiOf(admin).get('/api/outbox?pageSize=100');
    const reference: string = item.reference;
    const mails = outbox.items.filter((mail: { subject: string }) => mail.subject.includes(reference));
    expect(mails.length).toBeGreaterThanOrEqual(4);
    for (const mail of mails as { subject: string; text: string; html: string }[]) {
      expect(findRawValues([mail.subject, ...mail.text.split('\n'), ...htmlTextPieces(mail.html)])).toEqual(
        [],
      );
    }
    await admin.goto('/admin/outbox');
    await settle(admin);
    await expectHumanValues(admin, '/admin/outbox');
    await admin.getByRole('button', { name: new RegExp(`${reference}: fix linked`) }).click();
    await expectHumanValues(admin, 'a mail in the outbox');
    await admin.goto('/admin/users');
    await settle(admin);
    await expectHumanValues(admin, '/admin/users');
    await admin.goto(`/cases/${caseId}/audit`);
    await settle(admin);
    await expectHumanValues(admin, 'audit trail as admin');

    for (const page of [investigator, reviewer, engineer, legal, report, admin]) await page.context().close();
  });

  it('takes the 1280x800 screenshots: sign-in, case list as a table and as a board', async () => {
    const signIn = await browser.open();
    await signIn.goto('/sign-in');
    await signIn.getByRole('heading', { name: 'Sign in' }).waitFor();
    await signIn.evaluate(() => document.fonts.ready);
    await expectHumanValues(signIn, '/sign-in');
    expect(await signIn.locator('footer').innerText()).toContain('Europe/Berlin');
    await saveScreenshot(signIn, 'sign-in');
    await signIn.context().close();

    const page = await browser.open();
    await signInAs(page, 'reviewer');
    await settle(page);
    await saveScreenshot(page, 'case-list');
    await page.getByText('Board', { exact: true }).click();
    await page.waitForURL(/view=board/);
    await settle(page);
    await expectHumanValues(page, 'the board');
    const board = page.getByRole('region', { name: 'Case list' });
    await board.getByRole('region', { name: 'Closed' }).waitFor();
    const columns = await board
      .getByRole('region')
      .evaluateAll((regions) => regions.map((region) => region.getAttribute('aria-label')));
    expect(columns).toEqual([
      'No evidence yet',
      'Evidence in',
      'Replayed',
      'Findings drafted',
      'Signed',
      'Fix verified',
      'Closed',
    ]);
    await saveScreenshot(page, 'case-list-board');
    await page.context().close();
  });
});
