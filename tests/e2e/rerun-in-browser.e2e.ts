/**
 * A replay computed by the server, re-run by a reviewer from legal in their own browser: the
 * page downloads the original bundle, replays it in a Web Worker with progress, and shows that
 * the digest matches the server's.
 */
import { describe, expect, it } from 'vitest';
import { DESKTOP, saveScreenshot, useBrowser } from './support/browser';
import { openReplaysList, startReplayAndWait } from './support/replays';
import { signInAs } from './support/sign-in';

describe('re-run in this browser', () => {
  const browser = useBrowser();

  it('lets legal confirm the server digest of an investigator replay', async () => {
    const investigator = await browser.open({ viewport: DESKTOP });
    await signInAs(investigator, 'investigator');
    await investigator
      .getByRole('row')
      .filter({ hasText: /morning picking loop/i })
      .getByRole('link')
      .first()
      .click();
    await investigator.getByRole('link', { name: 'Open workspace' }).first().click();
    await investigator.getByRole('heading', { name: /Workspace/ }).waitFor();
    const label = `Browser check ${Date.now() % 100_000}`;
    await startReplayAndWait(investigator, label);
    const workspaceUrl = investigator.url();

    const legal = await browser.open({ viewport: DESKTOP });
    await signInAs(legal, 'legal');
    await legal.goto(workspaceUrl);
    await openReplaysList(legal);
    const row = legal.getByTestId('replay-row').filter({ hasText: label }).first();
    await row.getByRole('button', { name: 'Re-run in this browser' }).click();
    const verdict = row.locator('[data-verdict]');
    try {
      await verdict.waitFor({ timeout: 120_000 });
    } catch (error) {
      await saveScreenshot(legal, 'rerun-in-browser-failed');
      throw error;
    }
    expect(await verdict.getAttribute('data-verdict')).toBe('match');
    expect(await verdict.textContent()).toMatch(/Digest matches the server's/);
  }, 300_000);
});
