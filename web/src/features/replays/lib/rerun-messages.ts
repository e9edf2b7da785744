/** Messages between the re-run worker and the page. */
export interface RerunRequest {
  zip: ArrayBuffer;
  /** The settings the server ran with (exact), else the overrides to resolve against the manifest. */
  settings: Record<string, unknown> | null;
  overrides: Record<string, unknown>;
}

export type RerunMessage =
  | { type: 'progress'; step: number; steps: number }
  | { type: 'done'; digest: string; steps: number; engine: string; digestLayout: number; runtime: string }
  | { type: 'error'; message: string };
