import type { QueryClient } from '@tanstack/react-query';
import { Panel } from '@web/components/panel';
import { CaseArchivesPanel } from '@web/features/archives/components/case-archives-panel';
import { useMe } from '@web/features/auth/api/get-me';
import { CaseBundlesList } from '@web/features/bundles/components/case-bundles-list';
import { RecordingUploadPanel } from '@web/features/bundles/components/recording-upload-panel';
import { caseQueryOptions } from '@web/features/cases/api/get-case';
import { CaseDetailView } from '@web/features/cases/components/case-detail-view';
import { CaseHoldPanel } from '@web/features/holds/components/case-hold-panel';
import { CaseWorkSection } from '@web/features/lifecycle/components/case-work-section';
import { type LoaderFunctionArgs, useParams } from 'react-router-dom';

/** Starts the request during navigation; the page shows its own loading and error states. */
export const caseDetailLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.caseId) void queryClient.prefetchQuery(caseQueryOptions(params.caseId));
    return null;
  };

/** The case page: the case frame with the bundles, case-work and archive panels of their features. */
export function CaseDetailRoute() {
  const { caseId = '' } = useParams();
  const role = useMe().data?.user.role;
  return (
    <CaseDetailView
      caseId={caseId}
      banner={role && <CaseHoldPanel caseId={caseId} role={role} />}
      evidence={
        <div className="space-y-5">
          <Panel id="case-bundles" title="Bundles and replays">
            <CaseBundlesList caseId={caseId} canUpload={role === 'investigator'} />
          </Panel>
          {role === 'investigator' && (
            <Panel id="case-recording" title="Robot recording">
              <RecordingUploadPanel caseId={caseId} />
            </Panel>
          )}
        </div>
      }
      sections={
        role && (
          <div className="space-y-5">
            <Panel id="case-work" title="Case work">
              <CaseWorkSection caseId={caseId} role={role} />
            </Panel>
            {role === 'legal' && (
              <Panel id="case-archive" title="Evidence archive">
                <CaseArchivesPanel caseId={caseId} />
              </Panel>
            )}
          </div>
        )
      }
    />
  );
}
