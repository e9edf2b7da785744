import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import type { Page } from 'playwright-core';

/** The CSRF header a signed-in page must send with a write made through `page.request`. */
export async function csrfHeaders(page: Page): Promise<Record<string, string>> {
  const csrf = (await page.context().cookies()).find((c) => c.name === CSRF_COOKIE)?.value ?? '';
  return { [CSRF_HEADER]: csrf };
}

/** Polls a replay until it has finished; throws when it fails or takes longer than `timeoutMs`. */
export async function waitForReplay(page: Page, replayId: string, timeoutMs = 240_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const replay = (await (await page.request.get(`/api/replays/${replayId}`)).json()) as {
      status: string;
      error?: string;
      steps: number | null;
    };
    if (replay.status === 'done') return replay;
    if (replay.status === 'failed' || replay.status === 'cancelled')
      throw new Error(`replay ${replayId} ended ${replay.status}: ${replay.error ?? ''}`);
    await page.waitForTimeout(1000);
  }
  throw new Error(`replay ${replayId} did not finish within ${timeoutMs / 1000} s`);
}
