import { queryResultSha256 } from '@shared/query-result-hash';
import { describe, expect, it } from 'vitest';
import { DESKTOP, saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

describe('SQL console', () => {
  const browser = useBrowser();

  it('an investigator runs a starter query, sees a DuckDB error, and saves a query to the case', async () => {
    const page = await browser.open({ viewport: DESKTOP });
    await signInAs(page, 'investigator');
    // The seeded wheel-slip case (api/src/seed/demo-cases.ts) and its bundle, found through the
    // API with the page's own session; other browser tests make cases of their own beside it.
    const cases = await (await page.request.get('/api/cases?search=defrost%20drain')).json();
    const seeded = cases.items.find((c: { title: string }) => /leaking defrost drain/.test(c.title));
    expect(seeded, 'the seeded wheel-slip case').toBeDefined();
    const caseId: string = seeded.id;
    const bundles = await (await page.request.get(`/api/cases/${caseId}/bundles`)).json();
    const bundleId: string = bundles.items[0].id;

    await page.goto(`/cases/${caseId}/bundles/${bundleId}/sql`);
    const run = page.getByRole('button', { name: 'Run query' });
    // DuckDB-wasm loads lazily; the button is enabled once the tables are in.
    await expect.poll(() => run.isEnabled(), { timeout: 60_000 }).toBe(true);

    await page.getByLabel('Starter query').selectOption({ label: 'Largest odometry jumps' });
    await run.click();
    const result = page.getByRole('region', { name: 'Query result' });
    await result.waitFor();
    await expect.poll(() => result.locator('tbody tr').count()).toBeGreaterThan(0);
    expect(await result.locator('thead').textContent()).toContain('jump_m');
    expect(await result.textContent()).toMatch(/20\s*rows in/);

    await page.getByLabel('SQL', { exact: true }).fill('SELECT no_such_column FROM odometry;');
    await page.getByLabel('SQL', { exact: true }).press('Control+Enter');
    const error = page.getByRole('alert').filter({ hasText: 'DuckDB could not run this query' });
    await error.waitFor();
    // DuckDB's binder names the missing column in its own message.
    expect(await error.textContent()).toContain('no_such_column');
    await saveScreenshot(page, 'sql-console-error');

    await page.getByLabel('Starter query').selectOption({ label: 'Largest odometry jumps' });
    await run.click();
    await result.waitFor();
    await page.getByRole('button', { name: 'Save to case as evidence' }).click();
    const title = `Odometry jumps, run ${Date.now() % 100_000}`;
    await page.getByLabel('Title').fill(title);
    await page.getByRole('button', { name: 'Save query' }).click();
    const saved = page.getByRole('list', { name: 'Saved queries' }).getByText(title, { exact: true });
    await saved.waitFor();
    await saved.scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'sql-console');

    // The hash the browser sent matches the shared canonical hash of the stored (whole) preview.
    const stored = (await (await page.request.get(`/api/cases/${caseId}/queries`)).json()).items.find(
      (q: { title: string }) => q.title === title,
    );
    expect(stored.isHashCheckedByServer).toBe(true);
    expect(stored.resultSha256).toBe(queryResultSha256(stored.columns, stored.preview));
  }, 180_000);
});
