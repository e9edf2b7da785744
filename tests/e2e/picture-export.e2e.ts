import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { csrfHeaders } from './support/api-session';
import { DESKTOP, SCREENSHOT_DIR, saveScreenshot, useBrowser } from './support/browser';
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

  it('exports the map and the timeline at the cursor as SVG and PNG, each labelled with replay, digest and step, and cites a saved one in the findings', async () => {
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
    // Its scale bar says what the on-screen one says (a picture of a map needs its scale).
    const scaleMetres = await page.getByTestId('scale-bar').getAttribute('data-metres');
    expect(mapText).toContain(`>${scaleMetres} m</text>`);

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

    // Saved to the case as a figure, then cited in the findings: shown by its caption with its picture.
    await page.getByRole('button', { name: 'Save map to case' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: /Saved to the case as a figure \(SHA-256 [0-9a-f]{12}…\)/ })
      .waitFor();
    const bundleId = new URL(page.url()).pathname.split('/')[2];
    const { caseId } = await (await page.request.get(`/api/bundles/${bundleId}`)).json();
    const figures = (await (await page.request.get(`/api/cases/${caseId}/figures`)).json()).items;
    const figure = figures.find((f: { caption: string }) => f.caption === `Map · ${caption}`);
    expect(figure).toMatchObject({ mediaType: 'image/png', replayId, step: 7 });
    const stored = await page.request.get(`/api/figures/${figure.id}/file`);
    // SHA-256 of the served bytes by Node's own hash (FIPS 180-4), not the server's record.
    expect(
      createHash('sha256')
        .update(await stored.body())
        .digest('hex'),
    ).toBe(figure.sha256);

    // The exported SVGs are plain pictures by the server's own check, so they can be saved too.
    for (const svg of [mapSvg, timelineSvg]) {
      const saved = await page.request.post(`/api/cases/${caseId}/figures`, {
        headers: await csrfHeaders(page),
        multipart: {
          caption: `SVG ${svg.name}`,
          figure: { name: svg.name, mimeType: 'image/svg+xml', buffer: svg.bytes },
        },
      });
      expect([saved.status(), svg.name]).toEqual([201, svg.name]);
    }

    await page.goto(`/cases/${caseId}/findings`);
    await page.getByRole('heading', { name: 'Findings', exact: true }).waitFor();
    await page.getByLabel('Cite a').selectOption('figure');
    await page.getByLabel('Figure', { exact: true }).selectOption(figure.id);
    await page.getByRole('button', { name: 'Add evidence' }).click();
    const citation = page.getByTestId('evidence-citation').filter({ hasText: `Map · ${caption}` });
    await citation.getByRole('link', { name: `Map · ${caption}` }).waitFor();
    const thumbnail = citation.getByTestId('figure-thumbnail');
    await expect
      .poll(() => thumbnail.evaluate((img) => (img as HTMLImageElement).naturalWidth), { timeout: 10_000 })
      .toBe(pngSize(mapPng.bytes).width);
    await saveScreenshot(page, 'findings-cited-figure');
    expect(mapPng.bytes.subarray(0, 8)).toEqual(PNG_SIGNATURE);
    expect(pngSize(mapPng.bytes).width).toBe(2 * Number(/width="(\d+)"/.exec(mapText)?.[1]));
  });
});
