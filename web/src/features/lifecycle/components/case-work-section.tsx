import type { CaseEvent } from '@shared/case-lifecycle';
import { CASE_EVENT_LABELS } from '@shared/human-labels';
import type { Role } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { ArrowRight, ClipboardList, FileSignature, ScrollText, UserRoundCheck, Wrench } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useLifecycle } from '../api/get-lifecycle';
import { useTransitionCase } from '../api/transition-case';
import { CaseHistory } from './case-history';

/** Roles the server lets read a case's audit trail (GET /cases/:id/audit). */
export const AUDIT_READER_ROLES: readonly Role[] = ['reviewer', 'legal', 'admin'];

const LINK =
  'inline-flex items-center gap-1.5 rounded-md px-2 py-1 text-sm font-bold text-accent hover:bg-canvas-sunk';

function CaseWorkLinks({ caseId, role }: { caseId: string; role: Role }) {
  return (
    <nav aria-label="Case work" className="flex flex-wrap gap-1">
      <Link className={LINK} to={paths.caseFindings.href(caseId)}>
        <ClipboardList aria-hidden className="size-4" /> Findings and review
      </Link>
      <Link className={LINK} to={paths.caseFixes.href(caseId)}>
        <Wrench aria-hidden className="size-4" /> Fixes
      </Link>
      {AUDIT_READER_ROLES.includes(role) && (
        <Link className={LINK} to={paths.caseAudit.href(caseId)}>
          <ScrollText aria-hidden className="size-4" /> Audit trail
        </Link>
      )}
    </nav>
  );
}

/**
 * Whether it is this person's move, the moves they may make, and the history for those who may
 * read it; where the case stands and who holds it is the case path above.
 */
export function CaseWorkSection({ caseId, role }: { caseId: string; role: Role }) {
  const lifecycle = useLifecycle(caseId);
  const transition = useTransitionCase(caseId);
  const [comment, setComment] = useState('');

  if (lifecycle.isError)
    return (
      <ErrorState
        error={lifecycle.error}
        title="Could not load the case state"
        onRetry={() => lifecycle.refetch()}
      />
    );
  const state = lifecycle.data;
  if (!state)
    return (
      <div aria-busy className="space-y-2">
        <SkeletonBar className="w-40" />
        <SkeletonBar className="w-64" />
      </div>
    );

  // Only plain status moves are buttons; submitting, returning and signing happen on the findings pages.
  const moves = state.transitions.filter((t) => t.isDirect && t.roles.includes(role));

  return (
    <div className="space-y-4">
      {state.yourMove && (
        <p className="flex items-center gap-1.5 rounded-md bg-accent-soft px-3 py-2 text-sm text-accent-strong">
          <UserRoundCheck aria-hidden className="size-4" />
          <span className="font-bold">Your move:</span> {state.yourMove}.
        </p>
      )}
      <CaseWorkLinks caseId={caseId} role={role} />
      {moves.length > 0 && (
        <div className="flex flex-wrap items-end gap-2">
          <FormField label="Comment for the history" isOptional className="min-w-56 flex-1">
            {(control) => (
              <TextInput {...control} value={comment} onChange={(e) => setComment(e.target.value)} />
            )}
          </FormField>
          {moves.map((move) => (
            <Button
              key={move.to}
              icon={move.event === 'close' ? FileSignature : ArrowRight}
              title={`Because of ${move.cause}`}
              isBusy={transition.isPending && transition.variables?.to === move.to}
              onClick={() =>
                transition.mutate(
                  { to: move.to, comment: comment.trim() || undefined },
                  { onSuccess: () => setComment('') },
                )
              }
            >
              {CASE_EVENT_LABELS[move.event as CaseEvent] ?? move.event}
            </Button>
          ))}
        </div>
      )}
      {transition.isError && <Alert>{transition.error.message}</Alert>}
      {AUDIT_READER_ROLES.includes(role) ? (
        <div>
          <h3 className="mb-2 text-xs font-bold tracking-wide text-ink-muted uppercase">History</h3>
          <CaseHistory caseId={caseId} />
        </div>
      ) : (
        <p className="text-xs text-ink-muted">
          The full history is in the audit trail, open to safety reviewers, legal and administrators.
        </p>
      )}
    </div>
  );
}
