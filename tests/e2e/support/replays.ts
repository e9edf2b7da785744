import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { saveScreenshot } from './browser';

/** Starts a replay from the workspace's launcher and waits until the workspace shows it. */
export async function startReplayAndWait(page: Page, label: string, edit?: (page: Page) => Promise<void>) {
  const launcher = page.getByRole('form', { name: 'Start a replay' });
  const details = page.locator('details').filter({ hasText: 'Replays (' });
  await details.waitFor();
  if ((await details.getAttribute('open')) === null) await details.locator('summary').click();
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
