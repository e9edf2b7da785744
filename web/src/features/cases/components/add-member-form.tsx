import { MEMBER_ROLES, type TMemberRole } from '@shared/contracts/case-members';
import { ROLE_LABELS } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { FormField } from '@web/components/form-field';
import { SelectInput } from '@web/components/inputs';
import { UserPlus } from 'lucide-react';
import { useState } from 'react';
import { useChangeCaseMembers } from '../api/change-case-members';
import { useMemberCandidates } from '../api/get-member-candidates';

/** Pick a part on the case, then a person of that role who is not yet on it. */
export function AddMemberForm({ caseId }: { caseId: string }) {
  const candidates = useMemberCandidates(caseId, true);
  const change = useChangeCaseMembers(caseId);
  const [role, setRole] = useState<TMemberRole>('reviewer');
  const [userId, setUserId] = useState('');
  const ofRole = (candidates.data ?? []).filter((person) => person.role === role);
  const chosen = ofRole.some((person) => person.userId === userId) ? userId : (ofRole[0]?.userId ?? '');

  return (
    <form
      aria-label="Add a person to this case"
      className="mt-4 border-t border-canvas-line pt-3"
      onSubmit={(event) => {
        event.preventDefault();
        if (chosen) change.mutate({ userId: chosen, add: true }, { onSuccess: () => setUserId('') });
      }}
    >
      <div className="grid grid-cols-[minmax(0,1fr)_minmax(0,2fr)_auto] items-end gap-3">
        <FormField label="Part on the case">
          {(control) => (
            <SelectInput {...control} value={role} onChange={(e) => setRole(e.target.value as TMemberRole)}>
              {MEMBER_ROLES.map((option) => (
                <option key={option} value={option}>
                  {ROLE_LABELS[option]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
        <FormField label="Person">
          {(control) => (
            <SelectInput
              {...control}
              value={chosen}
              onChange={(e) => setUserId(e.target.value)}
              disabled={candidates.isPending || ofRole.length === 0}
            >
              {candidates.isPending && <option value="">Loading people…</option>}
              {!candidates.isPending && ofRole.length === 0 && (
                <option value="">Everyone with this role is already on the case</option>
              )}
              {ofRole.map((person) => (
                <option key={person.userId} value={person.userId}>
                  {person.name}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
        <Button type="submit" icon={UserPlus} disabled={!chosen} isBusy={change.isPending}>
          Add to case
        </Button>
      </div>
      {candidates.isError && (
        <Alert className="mt-3">Could not load the people to pick from: {candidates.error.message}</Alert>
      )}
      {change.isError && <Alert className="mt-3">{change.error.message}</Alert>}
    </form>
  );
}
