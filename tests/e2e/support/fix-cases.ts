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

/**
 * A fresh invented case taken to "Signed off" over the API: the investigator creates it, adds
 * every reviewer and engineer offered, submits findings, and the reviewer signs them.
 */
export async function signedCaseOverApi(investigator: Page, reviewer: Page): Promise<string> {
  const headers = await csrfHeaders(investigator);
  const created = await investigator.request.post('/api/cases', {
    headers,
    data: {
      title: `Next step check ${Date.now() % 100_000}`,
      site: 'Harbourline Cold Store, Dock Hall B',
      robotId: 'AMR-04',
      incidentTime: '2026-11-24T07:30:00Z',
      severity: 'low',
    },
  });
  expect(created.status()).toBe(201);
  const caseId = (await created.json()).id as string;
  const candidates = (await (await investigator.request.get(`/api/cases/${caseId}/member-candidates`)).json())
    .items as { userId: string; role: string }[];
  for (const person of candidates.filter((c) => c.role === 'reviewer' || c.role === 'engineer')) {
    const added = await investigator.request.post(`/api/cases/${caseId}/members`, {
      headers,
      data: { userId: person.userId },
    });
    expect(added.status()).toBe(201);
  }
  const saved = await investigator.request.put(`/api/cases/${caseId}/findings`, {
    headers,
    data: {
      summary: 'AMR-04 stopped short of a pallet left in the cross aisle; nobody was near.',
      incidentClass: 'near_miss',
      rootCause: { category: 'environment', text: 'A pallet was left in the cross aisle overnight.' },
      contributingFactors: [],
      evidence: [],
      correctiveActions: [
        {
          description: 'Clear the cross aisle at shift end',
          owner: 'Dock Hall B lead',
          dueDate: '2026-12-20',
        },
      ],
    },
  });
  expect(saved.status()).toBe(200);
  const submitted = await investigator.request.post(`/api/cases/${caseId}/findings/submit`, { headers });
  expect(submitted.status()).toBe(201);
  const version = (await submitted.json()).version as number;
  const signed = await reviewer.request.post(`/api/cases/${caseId}/findings/versions/${version}/signoff`, {
    headers: await csrfHeaders(reviewer),
    data: { acknowledgeCaution: true },
  });
  expect(signed.status()).toBe(201);
  return caseId;
}
