import { randomUUID } from 'node:crypto';
import { EventEmitter } from 'node:events';
import fs from 'node:fs';
import path from 'node:path';
import { desc, eq, inArray } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Bundle, Manifest } from '../../../../shared/bundle/types';
import {
  LIVE_REPLAY_STATUSES,
  type TReplay,
  type TStartReplayRequest,
  ZStartReplayRequest,
} from '../../../../shared/contracts/replays';
import { type ReplaySettings, resolveReplaySettings } from '../../../../shared/engine/settings';
import { AppError } from '../../../../shared/errors';
import { REPLAY_STATUS_LABELS } from '../../../../shared/human-labels';
import type { Database } from '../../db/client';
import { bundles, replays, users } from '../../db/schema';
import { readCauses, readSafety, replayDir } from '../../replays/replay-files';
import type { ReplayEvent, ReplayPool } from '../../replays/replay-pool';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { EvidenceStore } from '../evidence/evidence-store';
import { assertCaseMember, assertMemberOfCaseOf } from '../membership/case-access';
import { createReplayRebuilder } from './rebuild-replay-files';
import { toReplay } from './replay-mapper';
import { createStepCache } from './step-cache';

export interface ReplaysServiceOptions {
  db: Database;
  audit: AuditService;
  evidence: EvidenceStore;
  derivedDir: string;
  pool: ReplayPool;
  logger: Logger;
  maxUnpackedBytes: number;
  /** Replays one user may have queued or running at once (MAX_RUNNING_REPLAYS_PER_USER). */
  maxRunningPerUser?: number;
  /** Parsed bundle by id, from the bundles service's cache (used to answer single steps). */
  loadBundle: (bundleId: string) => Promise<Bundle>;
}

interface LiveReplay {
  /** Whose cap the replay counts against; null for the system's own work (the demo seed). */
  userId: string | null;
  progress: { step: number; steps: number } | null;
  controller: AbortController;
}

/** Server-sent to progress subscribers. */
export type ReplayNotice =
  | { type: 'progress'; step: number; steps: number }
  | { type: 'finished'; replay: TReplay };

const SEE_REPLAYS = 'see its replays';

export function createReplaysService({
  db,
  audit,
  evidence,
  derivedDir,
  pool,
  logger,
  maxUnpackedBytes,
  maxRunningPerUser = 3,
  loadBundle,
}: ReplaysServiceOptions) {
  const live = new Map<string, LiveReplay>();
  /** Starts between the cap check and `live.set`, so two simultaneous requests cannot both pass. */
  const starting = new Map<string, number>();
  const runningOf = (userId: string) =>
    (starting.get(userId) ?? 0) + [...live.values()].filter((replay) => replay.userId === userId).length;
  const notices = new EventEmitter();
  notices.setMaxListeners(100);
  const steps = createStepCache(loadBundle);
  const rebuilder = createReplayRebuilder({ derivedDir, pool, maxUnpackedBytes });

  const selectReplays = () =>
    db
      .select({ row: replays, caseId: bundles.caseId, authorName: users.name })
      .from(replays)
      .innerJoin(bundles, eq(bundles.id, replays.bundleId))
      .innerJoin(users, eq(users.id, replays.createdBy));

  async function loadReplay(id: string): Promise<TReplay> {
    const [found] = await selectReplays().where(eq(replays.id, id));
    if (!found) throw new AppError('not_found', `No replay with id ${id}.`);
    return toReplay(found.row, { ...found, progress: live.get(id)?.progress ?? null });
  }

  const assertMemberOfReplayCase = (id: string, actor: Actor) =>
    assertMemberOfCaseOf(db, 'replay', id, actor, SEE_REPLAYS);

  async function getReplay(id: string, actor: Actor): Promise<TReplay> {
    await assertMemberOfReplayCase(id, actor);
    return loadReplay(id);
  }

  /** One replay with its separation and stopping analysis and its probable causes (read from the result files). */
  async function getReplayWithSafety(id: string, actor: Actor): Promise<TReplay> {
    const replay = await getReplay(id, actor);
    if (replay.status !== 'done') return { ...replay, safety: null, causes: null };
    const { dir } = await requireResultFiles(id, actor);
    return { ...replay, safety: readSafety(dir), causes: readCauses(dir) };
  }

  async function listBundleReplays(bundleId: string, actor: Actor): Promise<TReplay[]> {
    await assertMemberOfCaseOf(db, 'bundle', bundleId, actor, SEE_REPLAYS);
    return readBundleReplays(bundleId);
  }

  /** Every replay of a bundle, unchecked: for the archive export, which checks membership once. */
  async function readBundleReplays(bundleId: string): Promise<TReplay[]> {
    const rows = await selectReplays().where(eq(replays.bundleId, bundleId)).orderBy(desc(replays.createdAt));
    return rows.map((found) =>
      toReplay(found.row, { ...found, progress: live.get(found.row.id)?.progress ?? null }),
    );
  }

  /** A replay that was running when the server stopped is marked failed, never shown as done. */
  async function failInterruptedReplays(): Promise<number> {
    const interrupted = await db
      .update(replays)
      .set({
        status: 'failed',
        error: 'Interrupted by a server restart; start it again.',
        finishedAt: new Date(),
      })
      .where(inArray(replays.status, [...LIVE_REPLAY_STATUSES]))
      .returning({ id: replays.id });
    return interrupted.length;
  }

  async function finish(id: string, values: Partial<typeof replays.$inferInsert>) {
    await db
      .update(replays)
      .set({ ...values, finishedAt: new Date() })
      .where(eq(replays.id, id));
    live.delete(id);
    notices.emit(id, { type: 'finished', replay: await loadReplay(id) } satisfies ReplayNotice);
  }

  async function execute(
    id: string,
    bundleId: string,
    zipPath: string,
    overrides: TReplay['overrides'],
    settings: ReplaySettings,
  ) {
    const state = live.get(id)!;
    const outDir = replayDir(derivedDir, id);
    const onEvent = (event: ReplayEvent) => {
      if (event.type === 'started') {
        // Drizzle builders run only when awaited or then-ed.
        db.update(replays)
          .set({ status: 'running', settings: event.settings })
          .where(eq(replays.id, id))
          .then(undefined, (error: unknown) =>
            logger.error({ err: error, replayId: id }, 'could not mark replay running'),
          );
      } else {
        state.progress = { step: event.step, steps: event.steps };
        notices.emit(id, event satisfies ReplayNotice);
      }
    };
    try {
      const result = await pool.run(
        { bundlePath: zipPath, overrides, settings, outDir, maxUnpackedBytes },
        state.controller.signal,
        onEvent,
      );
      await finish(id, {
        status: 'done',
        settings: result.settings,
        digest: result.digest,
        engine: result.engine ?? null,
        steps: result.steps,
        elapsedMs: result.elapsedMs,
        metrics: result.metrics,
        flags: result.flags,
      });
      steps.warm(id, bundleId, outDir);
    } catch (error) {
      const isCancelled = state.controller.signal.aborted;
      if (!isCancelled) logger.error({ err: error, replayId: id }, 'replay failed');
      fs.rmSync(outDir, { recursive: true, force: true });
      await finish(id, {
        status: isCancelled ? 'cancelled' : 'failed',
        error: isCancelled ? 'Cancelled.' : error instanceof Error ? error.message : String(error),
      });
    }
  }

  /** `capped: false` is for start-up's own demo replays; every request from a person is capped. */
  async function startReplay(
    bundleId: string,
    request: TStartReplayRequest,
    actor: Actor,
    { capped = true }: { capped?: boolean } = {},
  ): Promise<TReplay> {
    const body = ZStartReplayRequest.parse(request);
    const [bundle] = await db.select().from(bundles).where(eq(bundles.id, bundleId));
    if (!bundle) throw new AppError('not_found', `No bundle with id ${bundleId}.`);
    await assertCaseMember(db, bundle.caseId, actor, 'replay its evidence');
    if (bundle.status !== 'valid' || !bundle.manifest) {
      throw new AppError(
        'conflict',
        'This bundle did not pass validation, so it cannot be replayed. Fix the listed problems and upload it again.',
      );
    }
    const resolved = resolveReplaySettings(bundle.manifest as Manifest, body.overrides);
    if (!resolved.ok) {
      throw new AppError(
        'validation_failed',
        `Invalid replay settings: ${resolved.issues.map((i) => `${i.field}: ${i.message}`).join('; ')}`,
        resolved.issues.map((i) => ({ path: `overrides.${i.field}`, message: i.message })),
      );
    }
    if (capped && runningOf(actor.id) >= maxRunningPerUser) {
      throw new AppError(
        'too_many_requests',
        `You already have ${maxRunningPerUser} replays queued or running, the most one person may run at once. Wait for one to finish, or cancel one, then start this one again.`,
        { limit: maxRunningPerUser },
      );
    }
    starting.set(actor.id, (starting.get(actor.id) ?? 0) + 1);
    const id = randomUUID();
    try {
      await insertReplay(id, bundleId, bundle.caseId, body, resolved.settings, actor);
      // Start-up's own replays must not use up the demo person's cap before they start any.
      live.set(id, { userId: capped ? actor.id : null, progress: null, controller: new AbortController() });
    } finally {
      const left = (starting.get(actor.id) ?? 1) - 1;
      if (left > 0) starting.set(actor.id, left);
      else starting.delete(actor.id);
    }
    void execute(id, bundleId, evidence.pathFor(bundle.sha256), body.overrides, resolved.settings);
    return loadReplay(id);
  }

  async function insertReplay(
    id: string,
    bundleId: string,
    caseId: string,
    body: ReturnType<typeof ZStartReplayRequest.parse>,
    settings: ReplaySettings,
    actor: Actor,
  ) {
    await db.transaction(async (tx) => {
      await tx.insert(replays).values({
        id,
        bundleId,
        label: body.label ?? '',
        status: 'queued',
        overrides: body.overrides,
        settings,
        createdBy: actor.id,
      });
      await audit.append(tx, {
        actor,
        action: 'replay.start',
        targetType: 'replay',
        targetId: id,
        caseId,
        details: { bundleId },
        payload: { bundleId, label: body.label ?? '', overrides: body.overrides },
      });
    });
  }

  /** Cancels a live replay; the request is audited before the run is stopped, never after. */
  async function cancelReplay(id: string, actor: Actor): Promise<TReplay> {
    await assertMemberOfCaseOf(db, 'replay', id, actor, 'cancel its replays');
    const replay = await loadReplay(id);
    const state = live.get(id);
    if (!state)
      throw new AppError(
        'conflict',
        `Replay ${id} is ${REPLAY_STATUS_LABELS[replay.status].toLowerCase()}; only a waiting or running replay can be cancelled.`,
      );
    await audit.appendAlone({
      actor,
      action: 'replay.delete',
      targetType: 'replay',
      targetId: id,
      caseId: replay.caseId,
    });
    state.controller.abort();
    return { ...replay, status: 'cancelled' };
  }

  /** Calls `listener` with progress and the final state; returns the unsubscribe function. */
  function subscribe(id: string, listener: (notice: ReplayNotice) => void): () => void {
    notices.on(id, listener);
    return () => notices.off(id, listener);
  }

  /** A done replay and its result folder, rebuilt from the original bundle if files are missing. */
  async function resultFilesOf(replay: TReplay): Promise<{ replay: TReplay; dir: string }> {
    if (replay.status !== 'done')
      throw new AppError(
        'conflict',
        `Replay ${replay.id} is ${REPLAY_STATUS_LABELS[replay.status].toLowerCase()}, not finished.`,
      );
    const [bundle] = await db
      .select({ sha256: bundles.sha256 })
      .from(bundles)
      .where(eq(bundles.id, replay.bundleId));
    if (!bundle) throw new AppError('not_found', `No bundle with id ${replay.bundleId}.`);
    const dir = await rebuilder.ensureFiles({
      id: replay.id,
      bundlePath: evidence.pathFor(bundle.sha256),
      overrides: replay.overrides,
      digest: replay.digest,
    });
    return { replay, dir };
  }

  const requireResultFiles = async (id: string, actor: Actor) => resultFilesOf(await getReplay(id, actor));

  async function seriesFile(id: string, actor: Actor): Promise<string> {
    return path.join((await requireResultFiles(id, actor)).dir, 'series.json');
  }

  async function stepAt(id: string, step: number, actor: Actor) {
    const { replay, dir } = await requireResultFiles(id, actor);
    if (step >= (replay.steps ?? 0)) {
      throw new AppError(
        'not_found',
        `Replay ${id} has steps 0 to ${(replay.steps ?? 1) - 1}; step ${step} does not exist.`,
      );
    }
    return steps.stepAt(id, replay.bundleId, dir, step);
  }

  /** A finished replay's result folder, unchecked: for the archive export, which checks membership once. */
  async function resultDir(id: string): Promise<string> {
    return (await resultFilesOf(await loadReplay(id))).dir;
  }

  /** The probable causes of a finished replay, for checking a finding that cites one; null when it has none. */
  async function causesOf(id: string) {
    return readCauses(await resultDir(id));
  }

  async function disagreementFile(id: string, actor: Actor): Promise<string> {
    return path.join((await requireResultFiles(id, actor)).dir, 'disagreement.bin');
  }

  return {
    startReplay,
    getReplay,
    getReplayWithSafety,
    listBundleReplays,
    readBundleReplays,
    cancelReplay,
    subscribe,
    seriesFile,
    stepAt,
    disagreementFile,
    resultDir,
    causesOf,
    failInterruptedReplays,
    isLive: (id: string) => live.has(id),
  };
}

export type ReplaysService = ReturnType<typeof createReplaysService>;
