import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DESKTOP, NARROW, saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

async function hasHorizontalOverflow(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth);
}

describe('cases', () => {
  const browser = useBrowser();

  it('an investigator opens a case and finds it in the list', async () => {
    // The site's zone is Berlin (global setup); this browser runs on Chicago time, so every time typed
    // and shown must follow the site, not the browser. Berlin is on CET (UTC+01:00) on 14 March 2026:
    // EU summer time starts on the last Sunday of March (Directive 2000/84/EC, article 2), 29 March.
    const page = await browser.open({ timezoneId: 'America/Chicago' });
    await signInAs(page, 'investigator');
    await page.getByRole('link', { name: 'New case' }).first().click();
    await page.getByRole('heading', { name: 'New case' }).waitFor();

    // A run number keeps the title unique when the suite runs twice against one data directory.
    const title = `Tug halted beside cold store, run ${Date.now() % 100_000}`;
    await page.getByLabel('Title').fill(title);
    await page.getByLabel('Site').fill('Quayside cold store');
    await page.getByLabel('Robot id').fill('TUG-31');
    await page.getByLabel('Incident time').fill('2026-03-14T09:12:00');
    await page.getByLabel('Severity').selectOption('high');
    await page
      .getByLabel(/Summary/)
      .fill('Protective stop 0.4 m from a pallet; operator reported a jump on the map.');
    await saveScreenshot(page, 'new-case');
    await page.getByRole('button', { name: 'Create case' }).click();

    await page.getByRole('heading', { name: title }).waitFor();
    await saveScreenshot(page, 'case-detail');
    const facts = page.getByRole('region', { name: 'Incident' });
    expect(await facts.innerText()).toContain('14 Mar 2026, 09:12 CET');
    expect(await facts.innerText()).toContain('14 Mar 2026, 08:12:00 UTC');
    expect(await facts.locator('time').first().getAttribute('datetime')).toBe('2026-03-14T08:12:00.000Z');
    // A new case waits for evidence, held by an investigator.
    const path = page.getByRole('region', { name: 'Case path' });
    expect(await path.getByTestId('case-standing').innerText()).toBe('Waiting for evidence');
    expect(await path.innerText()).toMatch(
      /held by Investigator since \d{1,2} [A-Z][a-z]{2} 2026, \d{2}:\d{2} CES?T/,
    );

    await page.getByRole('link', { name: 'All cases' }).click();
    await page.getByLabel('Search').fill(title);
    const row = page.getByRole('row', { name: new RegExp(title) });
    await row.waitFor();
    const cells = (await row.getByRole('cell').allInnerTexts()).map((text) => text.trim());
    expect(cells.slice(1, 5)).toEqual([title, 'Quayside cold store', 'TUG-31', '14 Mar 2026, 09:12 CET']);
    expect(cells[5]).toBe('High');
    expect(cells[6]).toContain('Waiting for evidence');
    expect(cells[6]).toContain('Investigator');
    await page.context().close();
  });

  it('shows client-side field errors beside the fields and sends nothing', async () => {
    const page = await browser.open();
    await signInAs(page, 'investigator');
    await page.goto('/cases/new');
    let posted = false;
    page.on('request', (request) => {
      if (request.method() === 'POST' && request.url().endsWith('/api/cases')) posted = true;
    });
    await page.getByLabel('Title').fill('ab');
    await page.getByRole('button', { name: 'Create case' }).click();
    await page.getByText('Use at least 3 characters').waitFor();
    await page.getByText('Enter the date and time of the incident').waitFor();
    await page.getByText('Choose a severity').waitFor();
    expect(await page.getByLabel('Title').getAttribute('aria-invalid')).toBe('true');
    expect(posted).toBe(false);
    await page.context().close();
  });

  it('sorts by a column header and keeps the sort after a reload', async () => {
    const page = await browser.open();
    await signInAs(page, 'reviewer');
    await page.getByRole('row').nth(1).waitFor();
    const titleHeader = page.getByRole('columnheader', { name: /Title/ });
    // Wait for the sorted answer itself: the URL changes a moment before the table re-renders.
    const sortedResponse = page.waitForResponse((response) => response.url().includes('sort=title'));
    await titleHeader.getByRole('button').click();
    await sortedResponse;
    await page.waitForURL(/sort=title/);
    await page.waitForFunction(
      () =>
        document.querySelector('th[aria-sort="ascending"]')?.textContent?.includes('Title') &&
        !document.querySelector('table[aria-busy="true"]'),
    );
    const titles = async () =>
      (await page.locator('tbody tr td:nth-child(2)').allTextContents()).map((t) => t.trim());
    const before = await titles();
    expect(before.length).toBeGreaterThan(1);
    // Server sort order is compared with the browser's own collation as an outside reference.
    const collator = new Intl.Collator('en', { sensitivity: 'base' });
    expect([...before].sort(collator.compare)).toEqual(before);
    await page.reload();
    await page.getByRole('row').nth(1).waitFor();
    expect(await page.getByRole('columnheader', { name: /Title/ }).getAttribute('aria-sort')).toBe(
      'ascending',
    );
    await page.context().close();
  });

  it('takes screenshots of the case list at 1280x800 and 1024 px wide', async () => {
    for (const [viewport, name] of [
      [DESKTOP, 'case-list'],
      [NARROW, 'case-list-1024'],
    ] as const) {
      const page = await browser.open({ viewport });
      await signInAs(page, 'investigator');
      await page.getByRole('row').nth(1).waitFor();
      await page.waitForFunction(() => !document.querySelector('[aria-busy="true"]'));
      await page.evaluate(() => document.fonts.ready);
      expect(await hasHorizontalOverflow(page)).toBe(false);
      await saveScreenshot(page, name);
      await page.context().close();
    }
  });
});
