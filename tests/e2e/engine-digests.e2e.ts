/**
 * The same engine in Debian's Chromium (another build of V8, with its own Math.*): every sample
 * under every golden setting must replay to the digests Node recorded in tests/samples/digests.json.
 * The engine is bundled with esbuild (iife, browser platform) and added to a blank page.
 */
import { build } from 'esbuild';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GOLDEN_SETTINGS, readGoldenDigests, readSampleFiles, sampleFolders } from '../samples/golden-cases';
import { launchBrowser } from './support/browser';

let browser: Browser;
let page: Page;

beforeAll(async () => {
  const bundled = await build({
    entryPoints: [new URL('./support/engine-in-page.ts', import.meta.url).pathname],
    bundle: true,
    format: 'iife',
    platform: 'browser',
    write: false,
    logLevel: 'silent',
  });
  browser = await launchBrowser();
  page = await browser.newPage();
  await page.setContent('<!doctype html><title>engine</title>');
  await page.addScriptTag({ content: bundled.outputFiles[0].text });
});

afterAll(async () => {
  await browser?.close();
});

describe('replay digests in Chromium', () => {
  const golden = readGoldenDigests();

  it('runs the engine of the same version and digest layout', async () => {
    const info = await page.evaluate(() => {
      const engine = (globalThis as unknown as { driftcaseEngine: { version: string; digestLayout: number } })
        .driftcaseEngine;
      return { engine: engine.version, layout: engine.digestLayout, agent: navigator.userAgent };
    });
    expect(info.layout).toBe(golden.digestLayout);
    expect(info.agent).toMatch(/Chrome\//);
  });

  for (const folder of sampleFolders()) {
    it(`${folder}: Chromium gives the Node digests`, async () => {
      const files = readSampleFiles(folder);
      const digests = await page.evaluate(
        ({ files, settings }) => {
          const engine = (
            globalThis as unknown as {
              driftcaseEngine: { replayDigest(f: unknown, o: unknown): string };
            }
          ).driftcaseEngine;
          return Object.fromEntries(
            Object.entries(settings).map(([name, o]) => [name, engine.replayDigest(files, o)]),
          );
        },
        { files, settings: GOLDEN_SETTINGS },
      );
      expect(digests).toEqual(golden.samples[folder]);
    });
  }
});
