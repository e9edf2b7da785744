import type { Role } from '@shared/roles';
import { useQuery } from '@tanstack/react-query';
import { Button } from '@web/components/button';
import { caseReplaysQueryOptions } from '@web/components/case-replays-query';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { Wrench } from 'lucide-react';
import { useState } from 'react';
import { useFixes } from '../api/get-fixes';
import { FixCard } from './fix-card';
import { LinkFixForm } from './link-fix-form';
import type { RenderReplayLauncher } from './start-replay-panel';

const PANEL = 'rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm';
const VERIFIER_ROLES: readonly Role[] = ['investigator', 'reviewer'];

/** Fixes linked to the case; engineers link new ones, investigators and reviewers verify them. */
export function FixesView({
  caseId,
  role,
  renderReplayLauncher,
}: {
  caseId: string;
  role: Role;
  renderReplayLauncher: RenderReplayLauncher;
}) {
  const fixes = useFixes(caseId);
  const replays = useQuery(caseReplaysQueryOptions(caseId));
  const [isLinking, setIsLinking] = useState(false);
  const isEngineer = role === 'engineer';

  return (
    <div className="space-y-5">
      {isEngineer &&
        (isLinking ? (
          <section aria-labelledby="link-fix" className={PANEL}>
            <h2 id="link-fix" className="mb-3 text-base font-bold">
              Link a fix
            </h2>
            <LinkFixForm
              caseId={caseId}
              replays={replays.data}
              renderReplayLauncher={renderReplayLauncher}
              onLinked={() => setIsLinking(false)}
            />
          </section>
        ) : (
          <Button variant="primary" icon={Wrench} onClick={() => setIsLinking(true)}>
            Link a fix
          </Button>
        ))}
      {fixes.isError ? (
        <ErrorState error={fixes.error} title="Could not load the fixes" onRetry={() => fixes.refetch()} />
      ) : !fixes.data ? (
        <SkeletonBar className="w-64" />
      ) : fixes.data.items.length === 0 ? (
        <div className={PANEL}>
          <EmptyState icon={Wrench} title="No fix linked yet">
            An engineer links the change that removes the cause, with a replay that shows it gone.
          </EmptyState>
        </div>
      ) : (
        fixes.data.items.map((fix) => (
          <FixCard
            key={fix.id}
            caseId={caseId}
            fix={fix}
            replays={replays.data}
            canVerify={VERIFIER_ROLES.includes(role)}
          />
        ))
      )}
    </div>
  );
}
