import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { saveScreenshot } from './browser';

/**
 * Opens the workspace's replay list. Setting `open` (not clicking the summary) cannot close a
 * list the page opened itself between a check and a click, which a slow machine makes likely.
 */
export async function openReplaysList(page: Page) {
  const details = page.locator('details').filter({ hasText: 'Replays (' });
  await details.waitFor();
  await details.evaluate((element) => {
    (element as HTMLDetailsElement).open = true;
  });
}

/** Starts a replay from the workspace's launcher and waits until the workspace shows it. */
export async function startReplayAndWait(page: Page, label: string, edit?: (page: Page) => Promise<void>) {
  const launcher = page.getByRole('form', { name: 'Start a replay' });
  await openReplaysList(page);
  await launcher.getByLabel('Label').fill(label);
  await edit?.(page);
  await launcher.getByRole('button', { name: 'Start replay' }).click();
  const row = page.getByTestId('replay-row').filter({ hasText: label });
  try {
    await expect
      .poll(
        () =>
          row
            .first()
            .getAttribute('data-status', { timeout: 1000 })
            .catch(() => null),
        { timeout: 150_000, interval: 500 },
      )
      .toBe('done');
  } catch (error) {
    await saveScreenshot(page, 'workspace-replay-failed');
    throw error;
  }
}
