import { SEVERITIES, ZCreateCaseRequest, ZRfc3339 } from '@shared/contracts/cases';
import { isLocalDateTimeInput, localInputToRfc3339 } from '@web/lib/date-time';
import { z } from 'zod';

/**
 * The shared create-case schema, adapted to what a browser form holds: the incident time arrives as
 * local wall-clock text from `datetime-local` and leaves as RFC 3339 with the browser's offset.
 */
export const ZCreateCaseForm = ZCreateCaseRequest.extend({
  incidentTime: z
    .string()
    .refine(isLocalDateTimeInput, 'Enter the date and time of the incident')
    .transform(localInputToRfc3339)
    .pipe(ZRfc3339),
  severity: z.enum(SEVERITIES, { message: 'Choose a severity' }),
});

export type TCreateCaseFormInput = z.input<typeof ZCreateCaseForm>;
export type TCreateCaseFormOutput = z.output<typeof ZCreateCaseForm>;

export const CREATE_CASE_FIELDS = [
  'title',
  'site',
  'robotId',
  'incidentTime',
  'severity',
  'summary',
] as const;
