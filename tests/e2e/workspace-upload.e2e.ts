import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { zipFolder } from '../../api/src/bundles/zip-folder';
import { DESKTOP, saveScreenshot, useBrowser } from './support/browser';
import { openCaseFromList } from './support/open-case';
import { signInAs } from './support/sign-in';

const SAMPLES = path.resolve('sample-logs');

/** A copy of a sample bundle with one odometry value broken, zipped; unique bytes on every run. */
async function brokenBundleZip(dir: string): Promise<string> {
  const folder = path.join(dir, 'broken');
  fs.cpSync(path.join(SAMPLES, 'healthy-shift'), folder, { recursive: true });
  const odometry = path.join(folder, 'odometry.csv').toString();
  const lines = fs.readFileSync(odometry, 'utf8').split('\n');
  const cells = lines[3].split(',');
  cells[1] = 'not-a-number';
  lines[3] = cells.join(',');
  // A run-specific note keeps the bytes fresh, so the upload is never recognised as a duplicate.
  fs.writeFileSync(odometry, lines.join('\n'));
  fs.appendFileSync(path.join(folder, 'events.csv'), `0.5,operator_note,run ${Date.now()}\n`);
  return zipFolder(folder, path.join(dir, 'broken-bundle.zip'));
}

describe('bundle upload page', () => {
  const browser = useBrowser();

  it('shows a valid bundle overview, then a broken bundle errors by file and line, listed as invalid', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-upload-e2e-'));
    const goodZip = await zipFolder(path.join(SAMPLES, 'healthy-shift'), path.join(dir, 'healthy-shift.zip'));
    const badZip = await brokenBundleZip(dir);

    const page = await browser.open({ viewport: DESKTOP });
    await signInAs(page, 'investigator');
    await openCaseFromList(page, /rack row B/i);
    await page.getByRole('link', { name: 'Upload bundle' }).click();
    await page.getByRole('heading', { name: 'Upload an incident bundle' }).waitFor();

    await page.getByLabel('Bundle file (.zip)').setInputFiles(goodZip);
    const overview = page.getByTestId('bundle-overview');
    await overview.waitFor({ timeout: 60_000 });
    const text = (await overview.textContent()) ?? '';
    expect(text).toContain('Valid');
    expect(text).toContain('odometry.csv');
    expect(text).toMatch(/Duration\s*[\d.]+\s*s/);
    await saveScreenshot(page, 'upload-valid');

    await page.getByLabel('Bundle file (.zip)').setInputFiles(badZip);
    const report = page.getByTestId('validation-report');
    await report.waitFor({ timeout: 60_000 });
    const odometryIssues = report.getByRole('region', { name: 'Problems in odometry.csv' });
    // Line 4 of the file (header is line 1) holds the broken x value.
    expect(await odometryIssues.textContent()).toMatch(/4\s*x/);
    await saveScreenshot(page, 'upload-invalid');
    const sha = ((await page.getByTestId('bundle-overview').textContent()) ?? '').match(
      /SHA-256 ([0-9a-f]{64})/,
    )?.[1];
    expect(sha).toBeTruthy();

    await page.getByRole('link', { name: 'Back to the case' }).click();
    const invalidRow = page.getByTestId('bundle-row').filter({ hasText: 'broken-bundle.zip' });
    await invalidRow.first().waitFor();
    const rowText = (await invalidRow.first().textContent()) ?? '';
    expect(rowText).toContain('Invalid');
    expect(rowText).toContain(sha!.slice(0, 12));
    await saveScreenshot(page, 'case-bundles');
  }, 180_000);
});
