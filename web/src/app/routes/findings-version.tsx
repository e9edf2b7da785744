import { paths } from '@web/config/paths';
import { useMe } from '@web/features/auth/api/get-me';
import { FindingsVersionView } from '@web/features/findings/components/findings-version-view';
import { ReviewActions } from '@web/features/review/components/review-actions';
import { GitCompare } from 'lucide-react';
import { Link, useParams } from 'react-router-dom';
import { CaseWorkHeader } from './case-work-header';

/** A frozen version; reviewers get their sign and request-changes actions beside the signature check. */
export function FindingsVersionRoute() {
  const { caseId = '', version = '' } = useParams();
  const number = Number(version);
  const role = useMe().data?.user.role;
  return (
    <>
      <CaseWorkHeader
        caseId={caseId}
        title={`Findings version ${version}`}
        actions={
          <>
            <Link
              className="text-sm font-bold text-accent hover:underline"
              to={paths.caseFindings.href(caseId)}
            >
              All versions
            </Link>
            {number > 1 && (
              <Link
                className="inline-flex items-center gap-1 text-sm font-bold text-accent hover:underline"
                to={paths.caseFindingsDiff.href(caseId, number - 1, number)}
              >
                <GitCompare aria-hidden className="size-4" /> Changes from version {number - 1}
              </Link>
            )}
          </>
        }
      />
      <FindingsVersionView
        caseId={caseId}
        version={number}
        renderActions={(loaded) =>
          role === 'reviewer' && (
            <ReviewActions
              caseId={caseId}
              version={loaded.version}
              caution={loaded.safetyCaution}
              isAwaitingReview={loaded.state === 'submitted'}
            />
          )
        }
      />
    </>
  );
}
