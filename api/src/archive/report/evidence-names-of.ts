import { ZBookmark } from '../../../../shared/contracts/bookmarks';
import { ZSavedQuery } from '../../../../shared/contracts/saved-queries';
import { type EvidenceNames, toEvidenceNames } from '../../../../shared/evidence-names';
import type { CaseEvidence } from '../collect-case-evidence';

/** The names of everything the archive holds that a finding can cite (see shared/evidence-names.ts). */
export function evidenceNamesOf(evidence: CaseEvidence): EvidenceNames {
  const bookmarks = (evidence.workspace?.bookmarks ?? []).flatMap((raw) => {
    const parsed = ZBookmark.safeParse(raw);
    return parsed.success ? [parsed.data] : [];
  });
  const queries = (evidence.workspace?.savedQueries ?? []).flatMap((raw) => {
    const parsed = ZSavedQuery.safeParse(raw);
    return parsed.success ? [parsed.data] : [];
  });
  return toEvidenceNames({
    replays: evidence.replays.map(({ replay }) => replay),
    bookmarks,
    queries,
    bundles: evidence.bundles.map(({ record }) => record),
    figures: evidence.figures.map(({ figure }) => figure),
  });
}
