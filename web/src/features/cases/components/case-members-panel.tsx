import { ROLE_LABELS } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Panel } from '@web/components/panel';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { UserMinus } from 'lucide-react';
import { useChangeCaseMembers } from '../api/change-case-members';
import { useCaseMembers } from '../api/get-case-members';
import { AddMemberForm } from './add-member-form';

/**
 * Who works on the case. Everyone sees the list, so a person who is not on the case knows whom
 * to ask; the case's creator and admins add and remove people here.
 */
export function CaseMembersPanel({ caseId }: { caseId: string }) {
  const members = useCaseMembers(caseId);
  const change = useChangeCaseMembers(caseId);
  const data = members.data;

  return (
    <Panel id="case-members" title="People on this case" className="mb-5">
      {members.isError && (
        <ErrorState
          error={members.error}
          title="Could not load who works on this case"
          onRetry={() => members.refetch()}
        />
      )}
      {members.isPending && (
        <div aria-busy className="space-y-2">
          <SkeletonBar className="w-64" />
          <SkeletonBar className="w-48" />
        </div>
      )}
      {data && (
        <>
          {!data.canWork && (
            <Alert tone="info" className="mb-3">
              You are not on this case. You can see that it exists and who works on it; to see its evidence
              and findings, ask its creator or an administrator to add you.
            </Alert>
          )}
          {data.items.length <= 1 && (
            <p className="mb-2 text-sm text-ink-muted">No one besides its creator works on this case yet.</p>
          )}
          <ul className="divide-y divide-canvas-line">
            {data.items.map((member) => (
              <li key={member.userId} className="flex items-center gap-3 py-2 text-sm">
                <span className="font-bold text-ink">{member.name}</span>
                <span className="text-ink-muted">{ROLE_LABELS[member.role]}</span>
                {member.isCreator && <span className="text-xs text-ink-muted">opened the case</span>}
                {data.canManage && !member.isCreator && (
                  <Button
                    size="sm"
                    variant="ghost"
                    icon={UserMinus}
                    className="ml-auto"
                    aria-label={`Remove ${member.name} from this case`}
                    title={`Remove ${member.name} from this case`}
                    isBusy={change.isPending && change.variables?.userId === member.userId}
                    onClick={() => change.mutate({ userId: member.userId, add: false })}
                  >
                    Remove
                  </Button>
                )}
              </li>
            ))}
          </ul>
          {change.isError && change.variables?.add === false && (
            <Alert className="mt-3">{change.error.message}</Alert>
          )}
          {data.canManage && <AddMemberForm caseId={caseId} />}
        </>
      )}
    </Panel>
  );
}
