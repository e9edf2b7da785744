import {
  CAUSE_CATEGORIES,
  INCIDENT_CLASSES,
  type TEvidenceItem,
  type TFindingsDraft,
  ZCause,
  ZFindingsContent,
} from '@shared/contracts/findings';
import { z } from 'zod';

/** The shared findings schema with messages for the two pickers a person may leave unset. */
export const ZFindingsForm = ZFindingsContent.extend({
  incidentClass: z.enum(INCIDENT_CLASSES, 'Pick the incident class'),
  rootCause: ZCause.extend({ category: z.enum(CAUSE_CATEGORIES, 'Pick a category') }),
});

type CauseCategory = (typeof CAUSE_CATEGORIES)[number] | '';

/** What the form holds: like the findings, but pickers may still be empty (''). */
export interface FindingsFormValues {
  summary: string;
  incidentClass: (typeof INCIDENT_CLASSES)[number] | '';
  rootCause: { category: CauseCategory; text: string };
  contributingFactors: { category: CauseCategory; text: string }[];
  evidence: TEvidenceItem[];
  correctiveActions: { description: string; owner: string; dueDate: string }[];
}

/** Form values from a saved draft (or none), filling what is missing; copies, so editing never alters the draft. */
export function formValuesFromDraft(draft: TFindingsDraft | null | undefined): FindingsFormValues {
  return {
    summary: draft?.summary ?? '',
    incidentClass: draft?.incidentClass ?? '',
    rootCause: { category: '', text: '', ...draft?.rootCause },
    contributingFactors: (draft?.contributingFactors ?? []).map((f) => ({ ...f })),
    evidence: (draft?.evidence ?? []).map((e) => ({ ...e })),
    correctiveActions: (draft?.correctiveActions ?? []).map((a) => ({ ...a })),
  };
}

/**
 * The draft to save: fields still empty are left out rather than sent blank, since the server
 * checks every field it receives and a half-written draft is allowed to be incomplete.
 */
export function draftFromFormValues(values: FindingsFormValues): TFindingsDraft {
  const draft: TFindingsDraft = {
    contributingFactors: values.contributingFactors.filter(
      (f): f is { category: (typeof CAUSE_CATEGORIES)[number]; text: string } =>
        f.category !== '' || f.text.trim() !== '',
    ),
    evidence: values.evidence,
    correctiveActions: values.correctiveActions.filter(
      (a) => a.description.trim() !== '' || a.owner.trim() !== '' || a.dueDate !== '',
    ),
  };
  if (values.summary.trim() !== '') draft.summary = values.summary;
  if (values.incidentClass !== '') draft.incidentClass = values.incidentClass;
  const { category, text } = values.rootCause;
  if (category !== '' || text.trim() !== '') draft.rootCause = { category: category as never, text };
  return draft;
}
