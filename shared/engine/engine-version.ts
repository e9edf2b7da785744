/**
 * What a digest depends on besides the inputs: the engine's numbers and the digest's byte layout.
 *
 * DIGEST_LAYOUT is written into the digested bytes ("driftcase-replay-digest/<layout>\n"), and is
 * bumped on purpose whenever the numbers the engine produces change, so a digest recorded by an
 * older engine is recognised as such instead of looking like tampering. History:
 *   1  engine 1.x: host Math.exp/log/sin/cos/atan2 (digests depend on the JavaScript engine),
 *      Box–Muller motion noise, a log per detection.
 *   2  engine 2.0.0: the engine's own elementary functions (shared/engine/numerics), ziggurat
 *      motion noise, exact-gated indexed landmark association, one log per particle and step for
 *      the detections. Same digest on every JavaScript engine.
 * tests/samples/digests.json holds the golden digests of the committed samples for the current
 * layout; updating it goes with a bump here and a line above saying why.
 */
export const ENGINE_VERSION = '2.0.0';
export const DIGEST_LAYOUT = 2;

/** Recorded with every replay and archive: which engine, which layout, and where it ran. */
export interface EngineStamp {
  engine: string;
  digestLayout: number;
  /** Free text from the host, e.g. "node 20.20.2 (V8 11.3.244.8)" or a browser's user agent. */
  runtime: string;
}

export function engineStamp(runtime: string): EngineStamp {
  return { engine: ENGINE_VERSION, digestLayout: DIGEST_LAYOUT, runtime };
}
