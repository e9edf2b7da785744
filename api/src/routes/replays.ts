import { z } from 'zod';
import { parseEmptyBody } from '../../../shared/contracts/empty-body';
import { ZStartReplayRequest } from '../../../shared/contracts/replays';
import { NEES_BOUND_95 } from '../../../shared/engine/trajectory-error';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import { sendStoredFile } from '../http/send-stored-file';
import type { ReplayNotice, ReplaysService } from '../services/replays/replays-service';

const ZId = z.object({ id: z.uuid('Id must be a UUID') });
const ZStepParams = ZId.extend({
  k: z.coerce
    .number({ message: 'Step must be a whole number' })
    .int('Step must be a whole number')
    .min(0, 'Step must be 0 or more'),
});

/** Seconds between SSE comments that keep proxies from closing an idle progress stream. */
const KEEP_ALIVE_MS = 15_000;

export function replayRoutes(replays: ReplaysService): RouteSpec[] {
  return [
    {
      method: 'post',
      path: '/bundles/:id/replays',
      access: ['investigator', 'engineer'],
      audit: { action: 'replay.start' },
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        const replay = await replays.startReplay(id, ZStartReplayRequest.parse(req.body ?? {}), req.user);
        res.status(202).location(`/api/replays/${replay.id}`).json(replay);
      },
    },
    {
      method: 'get',
      path: '/bundles/:id/replays',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        res.json({ items: await replays.listBundleReplays(id, req.user) });
      },
    },
    {
      method: 'get',
      path: '/replays/:id',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        res.json(await replays.getReplayWithSafety(id, req.user));
      },
    },
    {
      method: 'delete',
      path: '/replays/:id',
      access: ['investigator', 'engineer'],
      audit: { action: 'replay.delete' },
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        parseEmptyBody(req.body);
        res.status(202).json(await replays.cancelReplay(id, req.user));
      },
    },
    {
      method: 'get',
      path: '/replays/:id/progress',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        const replay = await replays.getReplay(id, req.user);
        res.writeHead(200, {
          'Content-Type': 'text/event-stream',
          'Cache-Control': 'no-cache, no-transform',
          Connection: 'keep-alive',
          'X-Accel-Buffering': 'no',
        });
        const send = (event: string, data: unknown) =>
          res.write(`event: ${event}\ndata: ${JSON.stringify(data)}\n\n`);
        if (!replays.isLive(id)) {
          send('finished', replay);
          res.end();
          return;
        }
        if (replay.progress) send('progress', replay.progress);
        const keepAlive = setInterval(() => res.write(': keep-alive\n\n'), KEEP_ALIVE_MS);
        const unsubscribe = replays.subscribe(id, (notice: ReplayNotice) => {
          if (notice.type === 'progress') send('progress', { step: notice.step, steps: notice.steps });
          else {
            send('finished', notice.replay);
            stop();
          }
        });
        const stop = () => {
          clearInterval(keepAlive);
          unsubscribe();
          res.end();
        };
        req.on('close', stop);
      },
    },
    {
      method: 'get',
      path: '/replays/:id/series',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        const replay = await replays.getReplay(id, req.user);
        const file = await replays.seriesFile(id, req.user);
        const threshold =
          (replay.settings as { resampling?: { threshold?: number } })?.resampling?.threshold ?? null;
        const meta = { steps: replay.steps, neesBound: NEES_BOUND_95, resamplingThreshold: threshold };
        // The columns file is sent as stored, wrapped without re-parsing it.
        await sendStoredFile(res, file, {
          what: `the series of replay ${id}`,
          headers: {
            'Content-Type': 'application/json; charset=utf-8',
            'Cache-Control': 'private, max-age=86400, immutable',
          },
          prefix: `${JSON.stringify(meta).slice(0, -1)},"columns":`,
          suffix: '}',
        });
      },
    },
    {
      method: 'get',
      path: '/replays/:id/steps/:k',
      access: ROLES,
      handler: async (req, res) => {
        const { id, k } = ZStepParams.parse(req.params);
        res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
        res.json(await replays.stepAt(id, k, req.user));
      },
    },
    {
      method: 'get',
      path: '/replays/:id/disagreement',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZId.parse(req.params);
        await sendStoredFile(res, await replays.disagreementFile(id, req.user), {
          what: `the map disagreement of replay ${id}`,
          headers: { 'Content-Type': 'application/octet-stream' },
        });
      },
    },
  ];
}
