import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ReplayPool } from '../../api/src/replays/replay-pool';
import { makeBundleFiles, makeTempDir, writeBundleZip } from '../support/bundle-fixtures';
import { waitForReplay } from '../support/replay-runs';
import { createTestApp, type TestApp } from '../support/test-app';

// A pool whose runs stay "running" until the test cancels them, so the cap is tested without
// depending on how fast a real replay is on this machine.
const heldPool = {
  run: (_job: unknown, signal: AbortSignal) =>
    new Promise((_resolve, reject) => signal.addEventListener('abort', () => reject(new Error('aborted')))),
  close: async () => {},
} as unknown as ReplayPool;

let t: TestApp;
let bundleId: string;
const as = async (role: 'investigator' | 'engineer') => ({
  Authorization: `Bearer ${await t.tokenFor(role)}`,
});
const start = async (role: 'investigator' | 'engineer' = 'investigator') =>
  request(t.app)
    .post(`/api/bundles/${bundleId}/replays`)
    .set(await as(role))
    .send({});

beforeAll(async () => {
  t = await createTestApp(
    { DATA_DIR: await makeTempDir('driftcase-cap-'), MAX_RUNNING_REPLAYS_PER_USER: '2' },
    { replayPool: heldPool },
  );
  const headers = await as('investigator');
  const cases = await request(t.app).get('/api/cases').set(headers);
  const zip = await writeBundleZip(path.join(await makeTempDir(), 'cap.zip'), makeBundleFiles({ steps: 20 }));
  const uploaded = await request(t.app)
    .post(`/api/cases/${cases.body.items[0].id}/bundles`)
    .set(headers)
    .attach('bundle', zip)
    .expect(201);
  bundleId = uploaded.body.bundle.id;
});
afterAll(() => t.close());

describe('MAX_RUNNING_REPLAYS_PER_USER', () => {
  it('refuses a third running replay of one person with 429 and a plain message', async () => {
    const first = await start();
    const second = await start();
    expect([first.status, second.status]).toEqual([202, 202]);
    const third = await start();
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe('too_many_requests');
    expect(third.body.error.message).toMatch(/already have 2 replays queued or running/);
    // Another person has their own allowance.
    expect((await start('engineer')).status).toBe(202);
    // Cancelling one frees a place.
    await request(t.app)
      .delete(`/api/replays/${first.body.id}`)
      .set(await as('investigator'))
      .expect(202);
    await waitForReplay(t.app, await t.tokenFor('investigator'), first.body.id);
    expect((await start()).status).toBe(202);
  });

  it('counts simultaneous requests: of five sent at once, at most the cap are accepted', async () => {
    const tokens = await as('engineer');
    const statuses = await Promise.all(
      Array.from({ length: 5 }, () =>
        request(t.app)
          .post(`/api/bundles/${bundleId}/replays`)
          .set(tokens)
          .send({})
          .then((res) => res.status),
      ),
    );
    // The engineer already runs one from the test above.
    expect(statuses.filter((status) => status === 202)).toHaveLength(1);
    expect(statuses.filter((status) => status === 429)).toHaveLength(4);
  });
});

describe('the system’s own replays', () => {
  it('do not use up a person’s allowance: the demo seed’s replays leave that person free to start one', async () => {
    const headers = await as('engineer');
    const engineer = (await request(t.app).get('/api/auth/me').set(headers)).body.user;
    const actor = { id: engineer.id, email: engineer.email, role: 'engineer' as const };
    // A clean start: nothing of the tests above still running.
    const listed = await request(t.app).get(`/api/bundles/${bundleId}/replays`).set(headers);
    for (const replay of listed.body.items as { id: string; status: string }[]) {
      if (replay.status !== 'queued' && replay.status !== 'running') continue;
      await request(t.app).delete(`/api/replays/${replay.id}`).set(headers);
      await waitForReplay(t.app, await t.tokenFor('engineer'), replay.id);
    }
    // Started as the seed starts them (api/src/seed/seed-demo.ts): more than the cap, in one person's name.
    const system = [];
    for (let i = 0; i < 3; i++)
      system.push(
        await t.app.locals.services.replays.startReplay(bundleId, { label: `seed ${i}` }, actor, {
          capped: false,
        }),
      );
    // Both of the engineer's own places are still free; a third is refused as before.
    expect((await start('engineer')).status).toBe(202);
    expect((await start('engineer')).status).toBe(202);
    expect((await start('engineer')).status).toBe(429);
    for (const replay of system) await request(t.app).delete(`/api/replays/${replay.id}`).set(headers);
  });
});
