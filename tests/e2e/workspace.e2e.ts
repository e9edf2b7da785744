import { describe, expect, it } from 'vitest';
import { DESKTOP, saveScreenshot, useBrowser } from './support/browser';
import { startReplayAndWait } from './support/replays';
import { signInAs } from './support/sign-in';

describe('investigator workspace', () => {
  const browser = useBrowser();

  it('goes from sign-in to the flagged moment of the wheel-slip incident (leaking defrost drain) and compares two replays', async () => {
    const page = await browser.open({ viewport: DESKTOP });
    await signInAs(page, 'investigator');
    await page
      .getByRole('row')
      .filter({ hasText: /leaking defrost drain/i })
      .getByRole('link')
      .first()
      .click();
    await page.getByRole('link', { name: 'Open workspace' }).first().click();
    await page.getByRole('heading', { name: /Workspace/ }).waitFor();

    await startReplayAndWait(page, `Manifest settings ${Date.now() % 100_000}`);
    const scrubber = page.getByRole('slider', { name: 'Replay time' });
    await scrubber.waitFor({ timeout: 60_000 });
    const canvas = page.getByTestId('map-canvas');

    // Keyboard only: End, Home, one step, then "]" to the next flag or event.
    await scrubber.focus();
    await page.keyboard.press('End');
    const lastStep = Number(await scrubber.getAttribute('aria-valuemax'));
    expect(Number(await scrubber.getAttribute('aria-valuenow'))).toBe(lastStep);
    await page.keyboard.press('Home');
    await page.keyboard.press('ArrowRight');
    expect(await scrubber.getAttribute('aria-valuenow')).toBe('1');
    await page.keyboard.press('Shift+ArrowRight');
    expect(Number(await scrubber.getAttribute('aria-valuenow'))).toBeGreaterThan(1);

    // The flags panel lists the engine's flags; jump with "]" until the cursor is inside one.
    const flags = await page.getByRole('list', { name: 'Flags in this replay' }).getByRole('button').count();
    expect(flags).toBeGreaterThan(0);
    const replayId = new URL(page.url()).searchParams.get('replay');
    const replay = await (await page.request.get(`/api/replays/${replayId}`)).json();
    const isInFlag = (t: number) =>
      replay.flags.some((f: { start: number; end: number }) => t >= f.start - 0.06 && t <= f.end + 0.06);
    const cursorTime = async () => Number((await scrubber.getAttribute('aria-valuetext'))?.split(' ')[0]);
    for (let i = 0; i < 40 && !isInFlag(await cursorTime()); i++) await page.keyboard.press(']');
    expect(isInFlag(await cursorTime())).toBe(true);

    // The map has drawn this very step's particle set (DOM attributes set by the draw call).
    const step = await scrubber.getAttribute('aria-valuenow');
    await expect.poll(() => canvas.getAttribute('data-drawn-step'), { timeout: 20_000 }).toBe(step);
    expect(Number(await canvas.getAttribute('data-particle-count'))).toBeGreaterThan(0);
    // And pixels of the replay colour (#0072B2) are on the canvas. The map fits 1280x800 beside
    // the timeline, so it opens small: follow the robot and zoom in for the cloud to spread out.
    await page.getByLabel('Follow robot').check();
    await page.getByRole('button', { name: 'Zoom in' }).click();
    await page.getByRole('button', { name: 'Zoom in' }).click();
    // Two animation frames: the zoomed view renders, then the canvas draws it.
    await page.evaluate(
      () => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))),
    );
    const bluePixels = await canvas.evaluate((element) => {
      const c = element as HTMLCanvasElement;
      const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      let count = 0;
      for (let i = 0; i < data.length; i += 4) {
        if (
          Math.abs(data[i] - 0) < 40 &&
          Math.abs(data[i + 1] - 114) < 40 &&
          Math.abs(data[i + 2] - 178) < 40
        )
          count++;
      }
      return count;
    });
    expect(bluePixels).toBeGreaterThan(10);
    expect(await page.getByTestId('cursor-readout').textContent()).toContain(`step ${step}`);
    await saveScreenshot(page, 'workspace');
    await page.getByTestId('timeline').scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'workspace-timeline');

    // Pin the flagged moment, move away, then open the bookmark: the cursor returns to it.
    const note = `Belief drifts at the flag, run ${Date.now() % 100_000}`;
    await page.getByRole('button', { name: 'Pin this moment' }).click();
    await page.getByLabel('Note').fill(note);
    await page.getByRole('button', { name: 'Save bookmark' }).click();
    await page.getByRole('button', { name: 'Save bookmark' }).waitFor({ state: 'detached' });
    await scrubber.focus();
    await page.keyboard.press('Home');
    expect(await scrubber.getAttribute('aria-valuenow')).toBe('0');
    await page.getByRole('tab', { name: 'Bookmarks' }).click();
    await page.getByRole('button', { name: `Open bookmark: ${note}` }).click();
    await expect
      .poll(() => page.getByRole('slider', { name: 'Replay time' }).getAttribute('aria-valuenow'))
      .toBe(step);

    // A what-if replay with more particles and recovery, then the comparison page.
    await startReplayAndWait(page, `More particles ${Date.now() % 100_000}`, async (p) => {
      await p.getByLabel('Particles', { exact: true }).fill('1500');
      await p.getByLabel('Recovery (random particles when lost)').check();
    });
    await page.getByRole('link', { name: 'Compare replays' }).click();
    const table = page.getByTestId('comparison-table');
    await table.waitFor({ timeout: 30_000 });
    expect(await table.textContent()).toContain('particles');
    await page.getByRole('slider', { name: 'Replay time' }).focus();
    await page.keyboard.press(']');
    await expect
      .poll(
        () =>
          page
            .getByTestId('map-canvas')
            .evaluateAll((all) => all.map((c) => Number(c.getAttribute('data-particle-count')))),
        {
          timeout: 30_000,
        },
      )
      .toEqual([expect.any(Number), expect.any(Number)]);
    await expect
      .poll(
        async () =>
          Math.min(
            ...(await page
              .getByTestId('map-canvas')
              .evaluateAll((all) => all.map((c) => Number(c.getAttribute('data-particle-count'))))),
          ),
        { timeout: 30_000 },
      )
      .toBeGreaterThan(0);
    await saveScreenshot(page, 'workspace-compare');
    await table.scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'workspace-compare-table');
  }, 400_000);
});
