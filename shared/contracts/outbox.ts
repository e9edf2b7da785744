import { z } from 'zod';

export const ZOutboxQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});
export type TOutboxQuery = z.input<typeof ZOutboxQuery>;

export const ZOutboxMessage = z.object({
  id: z.number().int(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  receivedAt: z.string(),
});
export const ZOutboxList = z.object({
  items: z.array(ZOutboxMessage),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type TOutboxList = z.infer<typeof ZOutboxList>;
