import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { CAUSES_CAUTION } from '../../shared/causes-caution';
import { SAFETY_CAUTION } from '../../shared/safety-caution';
import { readZipEntries } from '../archive/rewrite-zip';
import { runVerifyArchive } from '../archive/run-verify-archive';
import { saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

const verifyWithCli = (file: string) => runVerifyArchive(file);

describe('evidence archive', () => {
  const browser = useBrowser();

  it('legal exports a demo case from the browser; the offline verifier passes it and catches one changed byte', async () => {
    const page = await browser.open();
    await signInAs(page, 'legal');
    await page
      .getByRole('row', { name: /Tugger brushed a picker/ })
      .getByRole('link')
      .first()
      .click();
    const exportLink = page.getByRole('link', { name: 'Export evidence archive' });
    await exportLink.waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), exportLink.click()]);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-archive-e2e-'));
    const archive = path.join(dir, 'archive.zip');
    await download.saveAs(archive);
    expect(fs.statSync(archive).size).toBeGreaterThan(1000);

    const verified = await verifyWithCli(archive);
    // No check line failed (the summary may say "NO CHECK FAILED" when no trusted key was given).
    expect(verified.stdout).not.toMatch(/^FAIL/m);
    // Without --trusted-keys the signatures are not anchored: exit 3, never "all checks passed".
    expect(verified.stdout).toMatch(/SIGNATURES NOT ANCHORED/);
    expect(verified.code).toBe(3);

    // The same file through the page's verify form.
    await page.getByLabel('Archive (.zip)').setInputFiles(archive);
    await page.getByRole('button', { name: 'Verify' }).click();
    await page.getByText(/All \d+ checks passed/).waitFor({ timeout: 120_000 });
    await saveScreenshot(page, 'archive-verified');

    // The report is self-contained: it renders from a file with no request leaving the page, shows
    // the safety caution, and prints to PDF on A4 and Letter.
    const entries = await readZipEntries(archive);
    const reportFile = path.join(dir, 'report.html');
    fs.writeFileSync(reportFile, entries.get('report.html')!);
    const reportPage = await browser.open();
    const outside: string[] = [];
    reportPage.on('request', (request) => {
      if (!request.url().startsWith('file://') && !request.url().startsWith('data:'))
        outside.push(request.url());
    });
    await reportPage.goto(`file://${reportFile}`);
    await reportPage.getByText(SAFETY_CAUTION.slice(0, 60), { exact: false }).first().waitFor();
    // The wheel-slip demo's probable causes, under their own caution, first the odometry fault
    // the sample injects (sample-logs/catalog.json), with a counterfactual that supports it.
    await reportPage.getByText(CAUSES_CAUTION).first().waitFor();
    const causes = reportPage
      .locator('h4', { hasText: 'Probable causes' })
      .first()
      .locator('xpath=following-sibling::table[1]');
    expect(await causes.locator('tbody tr').first().locator('td').first().textContent()).toBe(
      'Odometry fault',
    );
    expect(await causes.locator('tbody tr').first().textContent()).toMatch(
      /✓ supports.*digest [0-9a-f]{64}/s,
    );
    expect(outside).toEqual([]);
    await saveScreenshot(reportPage, 'archive-report', { fullPage: true });
    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await reportPage.pdf({ format, printBackground: true });
      expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
      fs.writeFileSync(path.resolve(`tests/output/archive-report-${format}.pdf`), pdf);
    }

    // One flipped byte in the middle of the zip (inside a stored file) must fail verification.
    const bytes = fs.readFileSync(archive);
    bytes[Math.floor(bytes.length / 2)] ^= 0xff;
    const tampered = path.join(dir, 'tampered.zip');
    fs.writeFileSync(tampered, bytes);
    const rejected = await verifyWithCli(tampered);
    expect(rejected.code).not.toBe(0);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});
