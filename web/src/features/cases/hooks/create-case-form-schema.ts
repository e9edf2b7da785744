import { SEVERITIES, ZCreateCaseRequest, ZRfc3339 } from '@shared/contracts/cases';
import { siteWallClockToRfc3339 } from '@shared/site-time';
import { z } from 'zod';

/**
 * The shared create-case schema, adapted to what a browser form holds: the incident time arrives as
 * wall-clock text from `datetime-local`, read in the site's time zone (the zone every screen shows
 * times in), and leaves as RFC 3339 with that zone's offset at that moment.
 */
export function createCaseFormSchema(siteTimeZone: string) {
  return ZCreateCaseRequest.extend({
    incidentTime: z
      .string()
      .refine(
        (value) => siteWallClockToRfc3339(value, siteTimeZone) !== undefined,
        'Enter the date and time of the incident',
      )
      .transform((value) => siteWallClockToRfc3339(value, siteTimeZone) ?? value)
      .pipe(ZRfc3339),
    severity: z.enum(SEVERITIES, { message: 'Choose a severity' }),
  });
}

type CreateCaseFormSchema = ReturnType<typeof createCaseFormSchema>;
export type TCreateCaseFormInput = z.input<CreateCaseFormSchema>;
export type TCreateCaseFormOutput = z.output<CreateCaseFormSchema>;

export const CREATE_CASE_FIELDS = [
  'title',
  'site',
  'robotId',
  'incidentTime',
  'severity',
  'summary',
] as const;
