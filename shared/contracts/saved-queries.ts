import { z } from 'zod';
import { safeText, ZSafeJsonValue } from './safe-text';

/** Rows of a saved query kept with it for display; the whole result when it is this short. */
export const SAVED_QUERY_PREVIEW_ROWS = 50;

/** A normalised result cell (see shared/query-result-hash.ts). */
const ZQueryCell = ZSafeJsonValue;

/** Body of `POST /api/cases/:id/queries`. */
export const ZCreateSavedQueryRequest = z
  .strictObject({
    bundleId: z.uuid('bundleId must be a bundle id (UUID)'),
    title: safeText().trim().min(1, 'Give the query a title').max(200),
    sql: safeText().trim().min(1, 'The SQL text is empty').max(20000),
    resultSha256: z.string().regex(/^[0-9a-f]{64}$/, 'Use a SHA-256 as 64 lowercase hex digits'),
    rowCount: z.number().int().nonnegative('rowCount must be 0 or more'),
    columns: z.array(safeText().max(300)).min(1, 'A result has at least one column').max(500),
    /** The first rows of the result, one array of cells per row, at most 50. */
    preview: z
      .array(z.array(ZQueryCell))
      .max(SAVED_QUERY_PREVIEW_ROWS, `Send at most ${SAVED_QUERY_PREVIEW_ROWS} preview rows`)
      .optional(),
  })
  .superRefine((body, ctx) => {
    if (!body.preview) return;
    if (body.preview.length > body.rowCount) {
      ctx.addIssue({
        code: 'custom',
        path: ['preview'],
        message: `The preview has ${body.preview.length} rows but rowCount is ${body.rowCount}`,
      });
    }
    body.preview.forEach((row, index) => {
      if (row.length !== body.columns.length) {
        ctx.addIssue({
          code: 'custom',
          path: ['preview', index],
          message: `Row ${index} has ${row.length} cells; the result has ${body.columns.length} columns`,
        });
      }
    });
  });
export type TCreateSavedQueryRequest = z.infer<typeof ZCreateSavedQueryRequest>;

export const ZSavedQuery = z.object({
  id: z.string(),
  caseId: z.string(),
  bundleId: z.string(),
  title: z.string(),
  sql: z.string(),
  resultSha256: z.string(),
  rowCount: z.number().int(),
  columns: z.array(z.string()),
  preview: z.array(z.array(z.unknown())).nullable(),
  /** True when the preview is the whole result and the server recomputed the hash from it. */
  isHashCheckedByServer: z.boolean(),
  author: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
});
export type TSavedQuery = z.infer<typeof ZSavedQuery>;

export const ZSavedQueryList = z.object({ items: z.array(ZSavedQuery) });
export type TSavedQueryList = z.infer<typeof ZSavedQueryList>;
