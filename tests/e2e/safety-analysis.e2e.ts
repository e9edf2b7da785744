import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readZipEntries } from '../archive/rewrite-zip';
import { saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

const CASE = /Contact with rack row B after the overnight re-layout/;

describe('separation and stopping analysis', () => {
  const browser = useBrowser();

  // Not passing yet: the archive-report half fails after the merge (see the closing note of
  // 2026-12-02). Re-enable when fixed.
  it('shows on the moved-rack incident when the stopping margin went negative and how much was localization error, with the caution; the archive report says the same', async () => {
    const page = await browser.open();
    await signInAs(page, 'investigator');
    await page.getByRole('row').filter({ hasText: CASE }).getByRole('link').first().click();
    await page.getByRole('link', { name: 'Open workspace' }).first().click();
    await page.getByRole('heading', { name: /Workspace/ }).waitFor();
    // The demo seed replays every sample with the robot's own settings when the server starts.
    const scrubber = page.getByRole('slider', { name: 'Replay time' });
    await scrubber.waitFor({ timeout: 180_000 });

    await page.getByRole('tab', { name: 'Separation and stopping' }).click();
    const panel = page.getByTestId('safety-panel');
    await panel.waitFor({ timeout: 60_000 });
    await expect
      .poll(() => panel.getByRole('complementary', { name: 'Safety caution' }).textContent())
      .toMatch(
        /does not replace a formal safety determination.*licensed safety professionals.*orientation only/s,
      );
    const stop = panel.getByTestId('safety-event').filter({ hasText: 'protective_stop' });
    const since = await stop.getByTestId('margin-negative-since').textContent();
    expect(since).toMatch(/^\d+\.\d s$/);
    expect(await stop.getByTestId('localization-share').textContent()).toMatch(/m \(\d+ % of the gap\)/);
    expect(await stop.textContent()).toMatch(/Suggested: Contact/);
    await expect.poll(() => page.getByTestId('timeline').textContent()).toMatch(/Stopping margin/);

    // Jump to the moment the margin went negative: the readout says so.
    await stop.getByTestId('margin-negative-since').getByRole('button').click();
    await expect
      .poll(async () => Number((await scrubber.getAttribute('aria-valuetext'))?.split(' ')[0]))
      .toBe(Number(since?.split(' ')[0]));
    expect(
      Number(
        (await panel.getByTestId('safety-now').textContent())?.match(/Stopping margin(-?[\d.]+) m/)?.[1],
      ),
    ).toBeLessThan(0);
    await saveScreenshot(page, 'safety-analysis');

    // The archive's report carries the same numbers and the caution.
    const legal = await browser.open();
    await signInAs(legal, 'legal');
    await legal.getByRole('row', { name: CASE }).getByRole('link').first().click();
    const exportLink = legal.getByRole('link', { name: 'Export evidence archive' });
    await exportLink.waitFor();
    const [download] = await Promise.all([legal.waitForEvent('download'), exportLink.click()]);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-safety-e2e-'));
    const archive = path.join(dir, 'archive.zip');
    await download.saveAs(archive);
    const entries = await readZipEntries(archive);
    const report = entries.get('report.html')!.toString();
    expect(report).toContain('Separation and stopping');
    expect(report).toMatch(/orientation only/);
    expect(report).toContain(`${since?.split(' ')[0]} <span class="unit">s</span>`);
    const safetyFiles = [...entries.keys()].filter((name) => name.endsWith('/safety.json'));
    expect(safetyFiles.length).toBeGreaterThan(0);
  });
});
