import { z } from 'zod';

/**
 * `GET /api/cases/:id/recordings/progress/:progressId`: where a recording upload stands after its
 * bytes arrived. `fraction` is the share of the current phase done (0..1).
 */
export const RECORDING_PROGRESS_PHASES = [
  'storing',
  'reading',
  'writing',
  'checking',
  'done',
  'failed',
] as const;

export const ZRecordingProgress = z.object({
  phase: z.enum(RECORDING_PROGRESS_PHASES),
  fraction: z.number().min(0).max(1),
});
export type TRecordingProgress = z.infer<typeof ZRecordingProgress>;

/** What each phase is called on the case page. */
export const RECORDING_PROGRESS_WORDS: Record<TRecordingProgress['phase'], string> = {
  storing: 'Keeping the originals as evidence',
  reading: 'Reading the recording',
  writing: 'Writing the bundle’s tables',
  checking: 'Checking the bundle',
  done: 'Done',
  failed: 'Stopped',
};
