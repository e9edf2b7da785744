import { type EngineStamp, engineStamp } from '../../../shared/engine/engine-version';

/** This process's JavaScript runtime, as recorded with replays and archives. */
export function nodeRuntime(): string {
  return `node ${process.version} (V8 ${process.versions.v8})`;
}

/** Engine version, digest layout and this runtime. */
export function nodeEngineStamp(): EngineStamp {
  return engineStamp(nodeRuntime());
}
