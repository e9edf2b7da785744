import { CASE_STATUS_LABELS } from '@shared/contracts/cases';
import { ROLE_LABELS, type Role } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { CaseStatusBadge } from '@web/components/status-badge';
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

/** State, who acts next, the moves this person may make, and the history for those who may read it. */
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
  const nextRoles = state.nextActor.roles.map((r) => ROLE_LABELS[r as Role] ?? r).join(' or ');
  const isMyTurn = state.nextActor.roles.includes(role);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <CaseStatusBadge status={state.status} />
        <p className="flex items-center gap-1.5 text-sm">
          <UserRoundCheck aria-hidden className="size-4 text-ink-muted" />
          <span className="text-ink-muted">Next:</span>
          <span className="font-bold">{nextRoles || 'nobody'}</span>
          <span>— {state.nextActor.action}</span>
          {isMyTurn && (
            <span className="rounded bg-accent-soft px-1.5 text-xs font-bold text-accent-strong">you</span>
          )}
        </p>
      </div>
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
              Move to {CASE_STATUS_LABELS[move.to]}
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
