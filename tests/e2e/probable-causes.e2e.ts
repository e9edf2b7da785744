import { describe, expect, it } from 'vitest';
import { saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

// The pushed-aside sample: a reach truck moved the robot 0.7 m at 22.0-22.6 s (sample-logs/catalog.json).
const CASE = /Robot nudged sideways by a reversing reach truck/;

describe('probable causes in the workspace', () => {
  const browser = useBrowser();

  it('puts the injected displacement first on the pushed-aside incident, with its counterfactual and the caution', async () => {
    const page = await browser.open();
    await signInAs(page, 'investigator');
    await page.getByRole('row').filter({ hasText: CASE }).getByRole('link').first().click();
    await page.getByRole('link', { name: 'Open workspace' }).first().click();
    await page.getByRole('heading', { name: /Workspace/ }).waitFor();
    // The demo seed replays every sample with the robot's own settings when the server starts.
    await page.getByRole('slider', { name: 'Replay time' }).waitFor({ timeout: 180_000 });

    await page.getByRole('tab', { name: /Probable causes/ }).click();
    const list = page.getByRole('list', { name: 'Probable causes, most likely first' });
    await list.waitFor({ timeout: 60_000 });
    const first = list.getByRole('listitem').first();
    expect(await first.textContent()).toMatch(/Moved from outside/);
    expect(await first.getByRole('list', { name: 'Counterfactual replays' }).textContent()).toMatch(
      /^Supports/,
    );
    expect(await page.getByRole('complementary', { name: 'Safety caution' }).first().textContent()).toMatch(
      /licensed safety professional/,
    );
    await saveScreenshot(page, 'workspace-probable-causes');
  }, 300_000);
});
