import type { Role } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { FormField } from '@web/components/form-field';
import { TextArea } from '@web/components/inputs';
import { LocalTime } from '@web/components/local-time';
import { Lock, LockOpen } from 'lucide-react';
import { useState } from 'react';
import { useChangeHold } from '../api/change-hold';
import { useHold } from '../api/get-hold';

function HoldDialog({ caseId, place, onClose }: { caseId: string; place: boolean; onClose: () => void }) {
  const change = useChangeHold(caseId);
  const [reason, setReason] = useState('');
  const isTooShort = place && reason.trim().length < 3;
  return (
    <Dialog
      isOpen
      title={place ? 'Place a legal hold' : 'Lift the legal hold'}
      description={
        place
          ? 'While held, nothing of this case can be deleted and its findings cannot be edited.'
          : 'Lifting the hold allows edits and deletions again. The hold stays in the history.'
      }
      onClose={onClose}
    >
      <form
        onSubmit={(event) => {
          event.preventDefault();
          if (!isTooShort) change.mutate({ place, reason: reason.trim() }, { onSuccess: onClose });
        }}
      >
        <FormField
          label="Reason"
          isOptional={!place}
          hint={place ? 'At least 3 characters; shown on the case while held.' : undefined}
        >
          {(control) => <TextArea {...control} value={reason} onChange={(e) => setReason(e.target.value)} />}
        </FormField>
        {change.isError && <Alert className="mt-3">{change.error.message}</Alert>}
        <div className="mt-4 flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button
            type="submit"
            variant={place ? 'danger' : 'primary'}
            disabled={isTooShort}
            isBusy={change.isPending}
          >
            {place ? 'Place hold' : 'Lift hold'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

/** A banner while the case is held, for everyone; place and lift controls for legal. */
export function CaseHoldPanel({ caseId, role }: { caseId: string; role: Role }) {
  const hold = useHold(caseId);
  const [dialog, setDialog] = useState<'place' | 'lift' | null>(null);
  const active = hold.data?.active ?? null;
  const isLegal = role === 'legal';
  if (!active && !isLegal) return null;
  return (
    <div className="mb-5 space-y-2">
      {active && (
        <div
          role="status"
          className="flex items-start gap-2 rounded-md border border-state-bad/40 bg-state-bad/5 px-3 py-2 text-sm"
        >
          <Lock aria-hidden className="mt-0.5 size-4 shrink-0 text-state-bad" />
          <div className="flex-1">
            <p className="font-bold text-state-bad">
              Legal hold: nothing of this case may be deleted or edited
            </p>
            <p className="text-ink">{active.reason}</p>
            <p className="text-xs text-ink-muted">
              Placed <LocalTime iso={active.placedAt} />
            </p>
          </div>
          {isLegal && (
            <Button size="sm" icon={LockOpen} onClick={() => setDialog('lift')}>
              Lift hold
            </Button>
          )}
        </div>
      )}
      {!active && isLegal && (
        <Button size="sm" icon={Lock} onClick={() => setDialog('place')} disabled={hold.isPending}>
          Place legal hold
        </Button>
      )}
      {hold.isError && <Alert>Could not load the hold state: {hold.error.message}</Alert>}
      {dialog && <HoldDialog caseId={caseId} place={dialog === 'place'} onClose={() => setDialog(null)} />}
    </div>
  );
}
