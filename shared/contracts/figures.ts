import { z } from 'zod';
import { safeText } from './safe-text';

/** Only pictures a browser shows without running anything: PNG, and SVG checked for active content. */
export const FIGURE_MEDIA_TYPES = ['image/png', 'image/svg+xml'] as const;
export type TFigureMediaType = (typeof FIGURE_MEDIA_TYPES)[number];

/** A map or timeline picture is well under 1 MB; 10 MB leaves room without inviting misuse. */
export const MAX_FIGURE_BYTES = 10 * 1024 * 1024;

/** The text fields sent beside the file in POST /cases/:id/figures (multipart form fields). */
export const ZFigureFields = z.strictObject({
  caption: safeText()
    .trim()
    .min(1, 'Give the figure a caption (which replay, digest and step it shows)')
    .max(300),
  replayId: z.uuid('Replay id must be a UUID').optional(),
  step: z.coerce.number().int('Step must be a whole number').min(0, 'Step must be 0 or more').optional(),
});
export type TFigureFields = z.infer<typeof ZFigureFields>;

export const ZFigure = z.object({
  id: z.string(),
  caseId: z.string(),
  sha256: z.string(),
  sizeBytes: z.number(),
  mediaType: z.enum(FIGURE_MEDIA_TYPES),
  fileName: z.string(),
  caption: z.string(),
  replayId: z.string().nullable(),
  step: z.number().nullable(),
  uploadedBy: z.object({ id: z.string(), name: z.string() }),
  uploadedAt: z.string(),
});
export type TFigure = z.infer<typeof ZFigure>;

export const ZStoreFigureResponse = z.object({ figure: ZFigure, duplicate: z.boolean() });
export const ZFigureList = z.object({ items: z.array(ZFigure) });
