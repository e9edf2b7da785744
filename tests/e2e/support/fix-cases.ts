import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { csrfHeaders, waitForReplay } from './api-session';

/** The seeded moved-rack case (invented site "Harbourline Cold Store"): its map is out of date. */
export const MOVED_RACK_CASE = 'Contact with rack row B after the overnight re-layout';

export async function findCase(page: Page, title: string): Promise<{ caseId: string; bundleId: string }> {
  const found = (await (await page.request.get(`/api/cases?q=${encodeURIComponent(title)}`)).json()) as {
    items: { id: string; title: string }[];
  };
  const caseId = found.items.find((item) => item.title === title)?.id;
  if (!caseId) throw new Error(`e2e: the demo case "${title}" is not seeded`);
  const bundles = (await (await page.request.get(`/api/cases/${caseId}/bundles`)).json()) as {
    items: { id: string }[];
  };
  return { caseId, bundleId: bundles.items[0]?.id ?? '' };
}

/** Starts a replay over the API as the signed-in person and waits until it is done. */
export async function replayOverApi(
  page: Page,
  bundleId: string,
  body: { label: string; overrides?: Record<string, unknown> },
): Promise<string> {
  const started = await page.request.post(`/api/bundles/${bundleId}/replays`, {
    headers: await csrfHeaders(page),
    data: body,
  });
  expect(started.status()).toBe(202);
  const { id } = (await started.json()) as { id: string };
  await waitForReplay(page, id);
  return id;
}

/** Links a fix over the API as the signed-in engineer; returns its description for finding its card. */
export async function linkFixOverApi(
  page: Page,
  caseId: string,
  fix: { description: string; verificationReplayId?: string },
): Promise<string> {
  const linked = await page.request.post(`/api/cases/${caseId}/fixes`, {
    headers: await csrfHeaders(page),
    data: { url: 'https://tracker.harbourline.example/CR-2240', ...fix },
  });
  expect(linked.status()).toBe(201);
  return fix.description;
}
