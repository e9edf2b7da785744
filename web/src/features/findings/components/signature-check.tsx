import type { TSignatureStatus } from '@shared/contracts/findings';
import { Alert } from '@web/components/alert';
import { LocalTime } from '@web/components/local-time';
import { BadgeCheck } from 'lucide-react';

/** The server's fresh check of the detached signature; a broken one is an alarm, not a footnote. */
export function SignatureCheck({ signature }: { signature: TSignatureStatus | null }) {
  if (!signature) return <p className="text-sm text-ink-muted">Not signed.</p>;
  if (!signature.valid)
    return (
      <Alert title="Signature does not verify">
        The signed text no longer matches its signature, or the key is unknown
        {signature.error ? `: ${signature.error}` : '.'} Treat this version as altered and report it.
      </Alert>
    );
  return (
    <div
      role="status"
      className="flex gap-2 rounded-md border border-state-ok/40 bg-state-ok/5 px-3 py-2 text-sm"
    >
      <BadgeCheck aria-hidden className="mt-0.5 size-4 shrink-0 text-state-ok" />
      <div>
        <p className="font-bold text-state-ok">Signature valid</p>
        <p>
          Signed by {signature.signedBy ?? 'unknown'}
          {signature.signedAt && (
            <>
              {' '}
              on <LocalTime iso={signature.signedAt} />
            </>
          )}
        </p>
        <p className="text-xs text-ink-muted">
          Key id <code>{signature.kid}</code>, checked against the published key set just now.
        </p>
      </div>
    </div>
  );
}
