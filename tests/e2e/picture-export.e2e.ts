import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DESKTOP, SCREENSHOT_DIR, useBrowser } from './support/browser';
import { openCaseFromList } from './support/open-case';
import { startReplayAndWait } from './support/replays';
import { signInAs } from './support/sign-in';

/** Presses an export button and returns the downloaded file's name and bytes. */
async function download(page: Page, buttonName: string) {
  const [file] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: buttonName }).click(),
  ]);
  const at = await file.path();
  return { name: file.suggestedFilename(), bytes: fs.readFileSync(at) };
}

/** Width and height from a PNG's IHDR chunk (PNG specification, section 11.2.2: bytes 16-23). */
function pngSize(bytes: Buffer) {
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}
/** The eight signature bytes every PNG file starts with (PNG specification, section 5.2). */
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

describe('pictures for the file', () => {
  const browser = useBrowser();

  it('exports the map and the timeline at the cursor as SVG and PNG, each labelled with replay, digest and step', async () => {
    const page = await browser.open({ viewport: DESKTOP });
    await signInAs(page, 'investigator');
    await openCaseFromList(page, /leaking defrost drain/i);
    await page.getByRole('link', { name: 'Open workspace' }).first().click();
    const label = `Pictures ${Date.now() % 100_000}`;
    await startReplayAndWait(page, label);
    const scrubber = page.getByRole('slider', { name: 'Replay time' });
    await scrubber.waitFor({ timeout: 60_000 });
    await scrubber.focus();
    for (let i = 0; i < 7; i++) await page.keyboard.press('ArrowRight');
    const step = await scrubber.getAttribute('aria-valuenow');
    expect(step).toBe('7');
    const canvas = page.getByTestId('map-canvas');
    await expect.poll(() => canvas.getAttribute('data-drawn-step'), { timeout: 20_000 }).toBe(step);

    const replayId = new URL(page.url()).searchParams.get('replay');
    const replay = await (await page.request.get(`/api/replays/${replayId}`)).json();
    const series = await (await page.request.get(`/api/replays/${replayId}/series`)).json();
    const time = (series.columns.t[7] as number).toFixed(2);
    // The caption names the replay, the first 12 digits of its digest and the moment (issue #12, point 8).
    const caption = `${label} · digest ${replay.digest.slice(0, 12)}… · step 7 · ${time} s`;

    const mapSvg = await download(page, 'Export the map as SVG');
    expect(mapSvg.name).toBe(`map-${replayId?.slice(0, 8)}-step-7.svg`);
    const mapText = mapSvg.bytes.toString('utf8');
    expect(mapText).toContain(`Map · ${caption}`);
    expect(mapText).toContain('href="data:image/png;base64,');

    const timelineSvg = await download(page, 'Export the timeline as SVG');
    expect(timelineSvg.name).toBe(`timeline-${replayId?.slice(0, 8)}-step-7.svg`);
    const timelineText = timelineSvg.bytes.toString('utf8');
    expect(timelineText).toContain(`Timeline · ${caption}`);
    // Standalone: styles inline, no class names that need the app's stylesheet (common practice).
    expect(timelineText).not.toMatch(/\sclass="/);
    // The replay belief's colour (docs design notes: #0072B2) is in the drawn tracks.
    expect(timelineText).toMatch(/stroke="#0072B2"/i);
    // The file opens as a picture in the browser, at the size it declares.
    const opened = await page.evaluate(async (text) => {
      const image = new Image();
      image.src = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }));
      await image.decode();
      return { width: image.naturalWidth, height: image.naturalHeight };
    }, timelineText);
    expect(opened.width).toBeGreaterThan(400);

    const timelinePng = await download(page, 'Export the timeline as PNG');
    expect(timelinePng.name).toBe(`timeline-${replayId?.slice(0, 8)}-step-7.png`);
    expect(timelinePng.bytes.subarray(0, 8)).toEqual(PNG_SIGNATURE);
    // Drawn at twice the SVG's size, so it stays sharp in print.
    expect(pngSize(timelinePng.bytes)).toEqual({ width: opened.width * 2, height: opened.height * 2 });

    const mapPng = await download(page, 'Export the map as PNG');
    // Kept beside the screenshots, for a person to look at.
    fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
    fs.writeFileSync(path.join(SCREENSHOT_DIR, 'picture-timeline.png'), timelinePng.bytes);
    fs.writeFileSync(path.join(SCREENSHOT_DIR, 'picture-map.png'), mapPng.bytes);
    expect(mapPng.bytes.subarray(0, 8)).toEqual(PNG_SIGNATURE);
    expect(pngSize(mapPng.bytes).width).toBe(2 * Number(/width="(\d+)"/.exec(mapText)?.[1]));
  });
});
