import type { TFindingsVersion } from '@shared/contracts/findings';
import { REVIEW_WORDS } from '@shared/review-words';
import { LocalTime } from '@web/components/local-time';
import { SafetyCautionNote } from '@web/components/safety-caution-note';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { isApiError } from '@web/lib/api-client';
import { FileQuestion } from 'lucide-react';
import type { ReactNode } from 'react';
import { useFindingsVersion } from '../api/get-findings-version';
import { FindingsContent } from './findings-content';
import { VersionStateLabel } from './findings-versions-list';
import { SignatureCheck } from './signature-check';

const PANEL = 'rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm';

function Reviews({ version }: { version: TFindingsVersion }) {
  if (version.reviews.length === 0) return <p className="text-sm text-ink-muted">No review yet.</p>;
  return (
    <ul className="space-y-2 text-sm">
      {version.reviews.map((review) => (
        <li key={`${review.kind}-${review.at}`}>
          <p>
            <span className="font-bold">
              {review.kind === 'signoff' ? 'Signed off' : REVIEW_WORDS.returnedStatus}
            </span>{' '}
            by {review.reviewer.name}, <LocalTime iso={review.at} />
          </p>
          {review.comment && <p className="whitespace-pre-line text-ink-muted italic">“{review.comment}”</p>}
        </li>
      ))}
    </ul>
  );
}

/**
 * One frozen version with its signature check and reviews. `renderActions` lets the page add the
 * reviewer's buttons without this feature knowing about review.
 */
export function FindingsVersionView({
  caseId,
  version,
  renderActions,
}: {
  caseId: string;
  version: number;
  renderActions?: (loaded: TFindingsVersion) => ReactNode;
}) {
  const query = useFindingsVersion(caseId, version);
  if (query.isError) {
    if (isApiError(query.error) && query.error.status === 404)
      return <EmptyState icon={FileQuestion} title={`There is no version ${version}`} />;
    return (
      <ErrorState error={query.error} title="Could not load this version" onRetry={() => query.refetch()} />
    );
  }
  const loaded = query.data;
  if (!loaded)
    return (
      <div aria-busy className={`${PANEL} space-y-2`}>
        <SkeletonBar className="w-64" />
        <SkeletonBar className="w-96" />
      </div>
    );
  return (
    <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-5">
      <section aria-labelledby="version-content" className={PANEL}>
        <div className="flex items-center justify-between gap-3">
          <h2 id="version-content" className="text-base font-bold">
            Version {loaded.version}
          </h2>
          <VersionStateLabel state={loaded.state} />
        </div>
        <p className="text-xs text-ink-muted">
          By {loaded.author.name}, submitted <LocalTime iso={loaded.submittedAt} /> · SHA-256{' '}
          <code className="break-all">{loaded.sha256}</code>
        </p>
        <FindingsContent caseId={caseId} content={loaded.content} />
      </section>
      <div className="space-y-5">
        <section aria-labelledby="version-signature" className={`${PANEL} space-y-3`}>
          <h2 id="version-signature" className="text-base font-bold">
            Sign-off
          </h2>
          <SignatureCheck signature={loaded.signature} />
          <SafetyCautionNote text={loaded.safetyCaution} />
          {renderActions?.(loaded)}
        </section>
        <section aria-labelledby="version-reviews" className={PANEL}>
          <h2 id="version-reviews" className="mb-2 text-base font-bold">
            Reviews
          </h2>
          <Reviews version={loaded} />
        </section>
      </div>
    </div>
  );
}
