import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeMcap } from '../support/recordings/write-mcap';
import { DESKTOP, saveScreenshot, useBrowser } from './support/browser';
import { openCaseFromList } from './support/open-case';
import { startReplayAndWait } from './support/replays';
import { signInAs } from './support/sign-in';

/**
 * The case page's robot-recording upload, as an investigator uses it: an MCAP written by
 * @mcap/core's own writer becomes a valid bundle shown with its overview, and a file that is no
 * recording gets the server's plain-words reason naming the file.
 */
const SAMPLE = path.resolve('sample-logs/wheel-slip');

async function openCase(page: Awaited<ReturnType<ReturnType<typeof useBrowser>['open']>>) {
  await signInAs(page, 'investigator');
  await openCaseFromList(page, /rack row B/i);
  await page.getByRole('heading', { name: 'Robot recording' }).waitFor();
}

describe('robot recording upload on the case page', () => {
  const browser = useBrowser();

  it('reads a recording into a bundle that replays with its flag, then names what is wrong with a bad file', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-recording-e2e-'));
    const mcap = await writeMcap(SAMPLE, path.join(dir, 'heron-dock.mcap'), {
      compression: 'zstd',
      // 26 s of scans: past the wheel slip at 18-22 s (sample-logs/catalog.json).
      scanLimit: 260,
    });
    const page = await browser.open({ viewport: DESKTOP });
    await openCase(page);
    const panel = page.getByRole('form', { name: 'Upload a robot recording' });
    const send = panel.getByRole('button', { name: 'Read recording' });
    expect(await send.isDisabled()).toBe(true);

    await panel.getByLabel('Recording', { exact: true }).setInputFiles(mcap);
    expect(await panel.getByTestId('chosen-recording').textContent()).toContain('heron-dock.mcap');
    await panel.getByLabel(/Incident time/).fill('21.5');
    await send.click();
    const overview = panel.getByTestId('bundle-overview');
    await overview.waitFor({ timeout: 120_000 });
    const text = (await overview.textContent()) ?? '';
    expect(text).toContain('Valid');
    expect(text).toContain('heron-dock-bundle.zip');
    expect(await panel.getByRole('link', { name: 'Open workspace' }).count()).toBe(1);
    await saveScreenshot(page, 'recording-upload-valid');
    // The derived bundle is listed on the case like any bundle.
    await page.getByTestId('bundle-row').filter({ hasText: 'heron-dock-bundle.zip' }).first().waitFor();

    // The derived bundle replays in the workspace and its flags are listed there. The import's
    // default settings (global start, 1000 particles) are not the sample's own, so which flag
    // the slip raises first differs; that some flag is raised after the slip at 18 s does not.
    await panel.getByRole('link', { name: 'Open workspace' }).click();
    await startReplayAndWait(page, 'From the dock recording');
    const flags = page.getByRole('list', { name: 'Flags in this replay' }).getByRole('listitem');
    await flags.first().waitFor({ timeout: 60_000 });
    expect(await flags.count()).toBeGreaterThan(0);
    // Each flag's (i) buttons sit beside its title's words, never over them.
    const covered = await flags.evaluateAll((items) =>
      items.some((item) => {
        const title = item.querySelector('[data-testid="flag-title"]');
        if (!title) return true;
        const range = document.createRange();
        range.selectNodeContents(title);
        const words = [...range.getClientRects()];
        const buttons = [...item.querySelectorAll('button[aria-label^="What is"]')].map((b) =>
          b.getBoundingClientRect(),
        );
        return words.some((w) =>
          buttons.some((b) => w.left < b.right && b.left < w.right && w.top < b.bottom && b.top < w.bottom),
        );
      }),
    );
    expect(covered).toBe(false);
    await saveScreenshot(page, 'recording-upload-replayed');
    await page.getByRole('link', { name: 'Back to the case' }).click();
    await page.getByRole('heading', { name: 'Robot recording' }).waitFor();

    const notRecording = path.join(dir, 'gate-camera.mcap');
    fs.writeFileSync(notRecording, `a camera export, not a robot recording ${Date.now()}`);
    await panel.getByLabel('Recording', { exact: true }).setInputFiles(notRecording);
    await send.click();
    const alert = panel.getByRole('alert').filter({ hasText: 'The recording could not be read' });
    await alert.waitFor({ timeout: 60_000 });
    expect(await alert.textContent()).toContain('gate-camera.mcap');
    await saveScreenshot(page, 'recording-upload-unreadable');

    await page.context().close();
  }, 240_000);
});
