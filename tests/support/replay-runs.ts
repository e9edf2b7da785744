import type { Express } from 'express';
import request from 'supertest';
import { isReplayLive, type TReplay, type TStartReplayRequest } from '../../shared/contracts/replays';

/** Polls `GET /api/replays/:id` until the replay is no longer queued or running. */
export async function waitForReplay(
  app: Express,
  token: string,
  replayId: string,
  intervalMs = 50,
): Promise<TReplay> {
  for (;;) {
    const res = await request(app)
      .get(`/api/replays/${replayId}`)
      .set('Authorization', `Bearer ${token}`)
      .expect(200);
    if (!isReplayLive(res.body.status)) return res.body as TReplay;
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
}

/** Starts a replay of a bundle over the API and waits for it to end (done, failed or cancelled). */
export async function replayToEnd(
  app: Express,
  token: string,
  bundleId: string,
  body: TStartReplayRequest = {},
): Promise<TReplay> {
  const started = await request(app)
    .post(`/api/bundles/${bundleId}/replays`)
    .set('Authorization', `Bearer ${token}`)
    .send(body)
    .expect(202);
  return waitForReplay(app, token, started.body.id);
}
