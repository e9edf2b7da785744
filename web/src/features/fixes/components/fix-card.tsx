import type { TFix } from '@shared/contracts/fixes';
import { judgeFixOutcome, pickOriginalReplay } from '@shared/fixes/fix-outcome';
import { REPLAY_STATUS_LABELS } from '@shared/human-labels';
import { Button } from '@web/components/button';
import type { CaseReplays } from '@web/components/case-replays-query';
import { LocalTime } from '@web/components/local-time';
import { BadgeCheck, CircleDashed, ExternalLink } from 'lucide-react';
import { useState } from 'react';
import { ReplayComparison } from './replay-comparison';
import { VerifyFixDialog } from './verify-fix-dialog';

function VerificationReplay({ fix, replays }: { fix: TFix; replays?: CaseReplays }) {
  if (!fix.verificationReplayId)
    return <p className="text-sm text-ink-muted">No verification replay linked.</p>;
  const verification = replays?.replays.find((r) => r.id === fix.verificationReplayId);
  if (!verification) return <p className="text-sm text-ink-muted">Loading the verification replay…</p>;
  if (verification.status !== 'done')
    return (
      <p className="text-sm text-ink-muted" aria-live="polite">
        Verification replay: {REPLAY_STATUS_LABELS[verification.status].toLowerCase()}
        {verification.progress && ` (${verification.progress.step} / ${verification.progress.steps} steps)`}…
      </p>
    );
  return (
    <ReplayComparison
      original={pickOriginalReplay(replays?.replays ?? [], verification)}
      verification={verification}
    />
  );
}

/** One linked fix: where it lives, what changed, how it was checked, and whether someone verified it. */
export function FixCard({
  caseId,
  fix,
  canVerify,
  replays,
}: {
  caseId: string;
  fix: TFix;
  canVerify: boolean;
  replays?: CaseReplays;
}) {
  const [isVerifying, setIsVerifying] = useState(false);
  const all = replays?.replays ?? [];
  const verification = all.find((r) => r.id === fix.verificationReplayId);
  const original = verification && pickOriginalReplay(all, verification);
  return (
    <article
      aria-label={`Fix: ${fix.description}`}
      className="rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm"
    >
      <div className="flex items-start justify-between gap-4">
        <div className="min-w-0">
          <h3 className="font-bold">{fix.description}</h3>
          <p className="text-xs text-ink-muted">
            Linked by {fix.linkedBy.name}, <LocalTime iso={fix.linkedAt} />
          </p>
        </div>
        {fix.verifiedAt ? (
          <span className="inline-flex items-center gap-1 text-sm font-bold text-state-ok">
            <BadgeCheck aria-hidden className="size-4" /> Verified by {fix.verifiedBy?.name}
          </span>
        ) : (
          <span className="inline-flex items-center gap-1 text-sm font-bold text-state-warn">
            <CircleDashed aria-hidden className="size-4" /> Not verified
          </span>
        )}
      </div>
      <dl className="mt-3 grid grid-cols-[10rem_minmax(0,1fr)] gap-x-4 gap-y-1 text-sm">
        {fix.url && (
          <>
            <dt className="text-ink-muted">Change request</dt>
            <dd>
              <a
                className="inline-flex items-center gap-1 break-all text-accent hover:underline"
                href={fix.url}
                target="_blank"
                rel="noreferrer noopener"
              >
                {fix.url} <ExternalLink aria-hidden className="size-3.5" />
              </a>
            </dd>
          </>
        )}
        {fix.commitId && (
          <>
            <dt className="text-ink-muted">Commit</dt>
            <dd>
              <code>{fix.commitId}</code>
            </dd>
          </>
        )}
        {fix.softwareVersion && (
          <>
            <dt className="text-ink-muted">Software version</dt>
            <dd>{fix.softwareVersion}</dd>
          </>
        )}
        {fix.changedSettings && (
          <>
            <dt className="text-ink-muted">Changed settings</dt>
            <dd>
              <pre className="whitespace-pre-wrap break-all text-xs">{fix.changedSettings}</pre>
            </dd>
          </>
        )}
      </dl>
      <h4 className="mt-4 mb-1 text-xs font-bold tracking-wide text-ink-muted uppercase">
        Original and verification replay
      </h4>
      <VerificationReplay fix={fix} replays={replays} />
      {fix.verifiedAt && (
        <div className="mt-4 border-t border-canvas-line pt-3 text-sm">
          <p className="text-xs text-ink-muted">
            Verified by {fix.verifiedBy?.name}, <LocalTime iso={fix.verifiedAt} />
            {fix.isVerifiedWithoutImprovement && ', confirmed although the replay showed no improvement'}
          </p>
          {fix.verificationComment && <p className="mt-1 whitespace-pre-wrap">{fix.verificationComment}</p>}
        </div>
      )}
      {canVerify && !fix.verifiedAt && (
        <div className="mt-4 border-t border-canvas-line pt-3">
          <Button variant="primary" icon={BadgeCheck} onClick={() => setIsVerifying(true)}>
            Mark verified
          </Button>
          {isVerifying && (
            <VerifyFixDialog
              caseId={caseId}
              fixId={fix.id}
              outcome={judgeFixOutcome(original, verification)}
              onClose={() => setIsVerifying(false)}
            />
          )}
        </div>
      )}
    </article>
  );
}
