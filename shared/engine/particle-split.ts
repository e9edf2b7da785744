/**
 * Splitting one replay's per-particle stages (motion, heading cos/sin, scan and detection
 * weighting) across threads that share the particle arrays (SharedArrayBuffers). The numbers of a
 * particle depend only on its own state and counter-keyed random draws, so any split gives the
 * digest of a single thread.
 *
 * Work stealing, so nobody ever waits for a thread that has not joined: each step is cut into
 * chunks; the coordinating thread publishes the step and claims chunks like every helper does; a
 * helper that joins late (a pool thread busy elsewhere) simply starts with the next chunk it can
 * claim. A claim is a compare-and-swap on a ticket = epoch * 2^16 + next chunk, and the step's
 * parameters sit in a slot tagged with the epoch (two slots, by parity), so a helper that slept
 * through a step can never run a stale chunk. The host calls `finishSplit` when the replay ends
 * for any reason (also when the coordinator's thread died), which releases every helper.
 *
 * Pure: Atomics and SharedArrayBuffer are part of the language; threads are the host's business.
 */
import type { StepWorkspace } from './advance-step';
import { createRangeScratch, type RangeScratch, runParticleStages, type StageBuffers } from './filter-step';
import type { ParticleState } from './particle-state';
import { createRandomScratch } from './random';
import type { ReplayContext } from './replay-context';

/** Shared buffers of one split replay: pass them to every helper (postMessage shares them). */
export interface SplitBuffers {
  control: SharedArrayBuffer;
  /** x, y, theta twice (resampling swaps the sets), then cos theta, sin theta, log-likelihood. */
  arrays: SharedArrayBuffer[];
}

const WAKE = 0;
const TICKET = 1;
const DONE = 2;
const FINISHED = 3;
/** Two parameter slots (by epoch parity): tag, step, count, buffer set, chunks. */
const SLOT = 4;
const SLOT_WORDS = 5;
const CONTROL_WORDS = SLOT + 2 * SLOT_WORDS;
const ARRAYS = 9;
const EPOCH_SHIFT = 16;
const EPOCH_MASK = 0x7fff;
/** Particles per chunk: small enough to balance two or four threads, large enough to amortise a claim. */
export const SPLIT_CHUNK = 256;
/** A helper that holds a chunk this long is presumed dead (a step takes milliseconds). */
const STALL_MS = 120_000;
/** Helpers re-check the finished flag at least this often (ms). */
const HELPER_POLL_MS = 500;

export function createSplitBuffers(capacity: number): SplitBuffers {
  return {
    control: new SharedArrayBuffer(4 * CONTROL_WORDS),
    arrays: Array.from({ length: ARRAYS }, () => new SharedArrayBuffer(8 * Math.max(1, capacity))),
  };
}

/** Ends the split: every helper returns from `serveSplit` (idempotent; safe from any thread). */
export function finishSplit(buffers: SplitBuffers): void {
  const control = new Int32Array(buffers.control);
  Atomics.store(control, FINISHED, 1);
  Atomics.add(control, WAKE, 1);
  Atomics.notify(control, WAKE);
}

function stageBuffers(arrays: Float64Array[]): StageBuffers {
  return { cosTheta: arrays[6], sinTheta: arrays[7], logLikelihood: arrays[8] };
}

/** Runs chunk `chunk` of the step in `slot` over the shared arrays; returns the measurement count. */
function runChunk(
  context: ReplayContext,
  control: Int32Array,
  slot: number,
  chunk: number,
  arrays: Float64Array[],
  view: ParticleState,
  scratch: RangeScratch,
): number {
  const step = control[slot + 1];
  const count = control[slot + 2];
  const set = 3 * control[slot + 3];
  view.x = arrays[set];
  view.y = arrays[set + 1];
  view.theta = arrays[set + 2];
  const from = chunk * SPLIT_CHUNK;
  const range = [from, Math.min(count, from + SPLIT_CHUNK)] as const;
  return runParticleStages(context, view, step, range, stageBuffers(arrays), scratch);
}

/**
 * Claims the next chunk of the current epoch: the chunk index, or -1 when there is none (the
 * step's chunks are all taken, or its parameters are not published yet). `slotOut[0]` gets the slot.
 */
function claimChunk(control: Int32Array, slotOut: Int32Array): number {
  for (;;) {
    const ticket = Atomics.load(control, TICKET);
    const epoch = ticket >>> EPOCH_SHIFT;
    const chunk = ticket & 0xffff;
    const slot = SLOT + SLOT_WORDS * (epoch & 1);
    if (Atomics.load(control, slot) !== epoch) return -1;
    if (chunk >= Atomics.load(control, slot + 4)) return -1;
    if (Atomics.compareExchange(control, TICKET, ticket, ticket + 1) === ticket) {
      slotOut[0] = slot;
      return chunk;
    }
  }
}

/**
 * Wires a replay's state and workspace to the shared buffers and makes this thread the
 * coordinator; use as `ReplayOptions.adopt`. Helpers run `serveSplit` on the same buffers.
 */
export function adoptSplit(
  context: ReplayContext,
  buffers: SplitBuffers,
): (state: ParticleState, workspace: StepWorkspace) => void {
  return (state, workspace) => {
    if (buffers.arrays[0].byteLength < 8 * context.capacity)
      throw new RangeError("split buffers are smaller than the replay's particle capacity");
    const arrays = buffers.arrays.map((buffer) => new Float64Array(buffer));
    const control = new Int32Array(buffers.control);
    for (const [k, name] of (['x', 'y', 'theta'] as const).entries()) {
      arrays[k].set(state[name].subarray(0, arrays[k].length));
      state[name] = arrays[k];
    }
    [workspace.spareX, workspace.spareY, workspace.spareTheta] = arrays.slice(3, 6);
    const outputs = stageBuffers(arrays);
    workspace.cosTheta = outputs.cosTheta;
    workspace.sinTheta = outputs.sinTheta;
    workspace.stepLogLikelihood = outputs.logLikelihood;
    const view: ParticleState = { ...state };
    const slotOut = new Int32Array(1);
    let epoch = 0;
    workspace.particleStages = (step, count) => {
      epoch = (epoch % EPOCH_MASK) + 1;
      const slot = SLOT + SLOT_WORDS * (epoch & 1);
      const chunks = Math.ceil(count / SPLIT_CHUNK);
      Atomics.store(control, slot + 1, step);
      Atomics.store(control, slot + 2, count);
      Atomics.store(control, slot + 3, state.x === arrays[0] ? 0 : 1);
      Atomics.store(control, slot + 4, chunks);
      Atomics.store(control, slot, epoch);
      Atomics.store(control, DONE, 0);
      Atomics.store(control, TICKET, epoch << EPOCH_SHIFT);
      Atomics.add(control, WAKE, 1);
      Atomics.notify(control, WAKE);
      for (let chunk = claimChunk(control, slotOut); chunk >= 0; chunk = claimChunk(control, slotOut)) {
        runChunk(context, control, slotOut[0], chunk, arrays, view, workspace.range);
        Atomics.add(control, DONE, 1);
      }
      for (let done = Atomics.load(control, DONE); done < chunks; done = Atomics.load(control, DONE)) {
        if (
          Atomics.wait(control, DONE, done, STALL_MS) === 'timed-out' &&
          Atomics.load(control, DONE) === done
        )
          throw new Error(`a replay thread stopped during step ${step}`);
      }
      // The measurement count is the same for every particle: an empty range gives it cheaply.
      return runParticleStages(context, state, step, [0, 0], outputs, workspace.range);
    };
  };
}

/** Helper side: runs chunks of the coordinator's steps until `finishSplit`; returns how many it ran. */
export function serveSplit(context: ReplayContext, buffers: SplitBuffers): number {
  const arrays = buffers.arrays.map((buffer) => new Float64Array(buffer));
  const control = new Int32Array(buffers.control);
  const scratch = createRangeScratch(context, createRandomScratch());
  const view: ParticleState = {
    step: -1,
    count: 0,
    x: arrays[0],
    y: arrays[1],
    theta: arrays[2],
    logWeight: new Float64Array(0),
    logSlow: Number.NEGATIVE_INFINITY,
    logFast: Number.NEGATIVE_INFINITY,
  };
  const slotOut = new Int32Array(1);
  let ran = 0;
  for (;;) {
    const wake = Atomics.load(control, WAKE);
    if (Atomics.load(control, FINISHED) === 1) return ran;
    const chunk = claimChunk(control, slotOut);
    if (chunk < 0) {
      Atomics.wait(control, WAKE, wake, HELPER_POLL_MS);
      continue;
    }
    runChunk(context, control, slotOut[0], chunk, arrays, view, scratch);
    ran++;
    Atomics.add(control, DONE, 1);
    Atomics.notify(control, DONE);
  }
}
