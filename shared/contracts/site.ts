import { z } from 'zod';

/** `GET /api/site`: installation settings every screen needs before it shows a time. */
export const ZSiteSettings = z.object({
  /** IANA zone (`Europe/Berlin`, `UTC`) in which screens, mails and report.html show times. */
  timeZone: z.string(),
});
export type TSiteSettings = z.infer<typeof ZSiteSettings>;
