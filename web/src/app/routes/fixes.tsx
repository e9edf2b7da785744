import { useMe } from '@web/features/auth/api/get-me';
import { FixesView } from '@web/features/fixes/components/fixes-view';
import { useParams } from 'react-router-dom';
import { CaseWorkHeader } from './case-work-header';
import { VerificationReplayLauncher } from './verification-replay-launcher';

export function FixesRoute() {
  const { caseId = '' } = useParams();
  const role = useMe().data?.user.role;
  return (
    <>
      <CaseWorkHeader caseId={caseId} title="Fixes" />
      {role && (
        <FixesView
          caseId={caseId}
          role={role}
          renderReplayLauncher={(bundleId, onStarted) => (
            <VerificationReplayLauncher bundleId={bundleId} onStarted={onStarted} />
          )}
        />
      )}
    </>
  );
}
