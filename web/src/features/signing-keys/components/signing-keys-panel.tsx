import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { ConfirmDialog } from '@web/components/confirm-dialog';
import { LocalTime } from '@web/components/local-time';
import { Panel } from '@web/components/panel';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { RotateCw } from 'lucide-react';
import { useState } from 'react';
import { useKeyThumbprints } from '../api/get-key-thumbprints';
import { useRotateSigningKey } from '../api/rotate-signing-key';

/**
 * The signing key's RFC 7638 thumbprint, which the site publishes out of band so that anyone
 * checking an archive can anchor its signatures, and the retired keys that still verify old ones.
 */
export function SigningKeysPanel() {
  const thumbprints = useKeyThumbprints();
  const rotate = useRotateSigningKey();
  const [isConfirming, setIsConfirming] = useState(false);
  const [notice, setNotice] = useState<string>();

  const confirmRotation = () =>
    rotate.mutate(undefined, {
      onSuccess: (next) => {
        setIsConfirming(false);
        setNotice(
          `A new key signs from now on. Publish its thumbprint ${next.current.thumbprint} where your site publishes it.`,
        );
      },
    });

  return (
    <Panel id="signing-keys-title" title="Signing key">
      <p className="text-sm text-ink-muted">
        Evidence archives and sign-offs are signed with this key. Compare the thumbprint (RFC 7638, SHA-256 of
        the public key) with the one your site publishes; a verifier trusts signatures only against it.
      </p>
      <div aria-live="polite" className="mt-3 empty:hidden">
        {notice && <Alert tone="info">{notice}</Alert>}
      </div>
      {thumbprints.isError ? (
        <ErrorState
          error={thumbprints.error}
          title="Could not load the signing keys"
          onRetry={() => thumbprints.refetch()}
        />
      ) : !thumbprints.data ? (
        <div aria-busy className="mt-3 space-y-2">
          <SkeletonBar className="w-full" />
          <SkeletonBar className="w-2/3" />
        </div>
      ) : (
        <>
          <dl className="mt-3 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-ink-muted">Current thumbprint</dt>
            <dd className="break-all font-mono" data-testid="current-thumbprint">
              {thumbprints.data.current.thumbprint}
            </dd>
            <dt className="text-ink-muted">Key id</dt>
            <dd className="break-all font-mono">{thumbprints.data.current.kid}</dd>
            <dt className="text-ink-muted">Algorithm</dt>
            <dd>{thumbprints.data.current.alg}</dd>
          </dl>
          <h3 className="mt-5 text-sm font-bold">Retired keys, still trusted for the archives they signed</h3>
          {thumbprints.data.retired.length === 0 ? (
            <p className="mt-1 text-sm text-ink-muted">None: the key has never been rotated.</p>
          ) : (
            <table className="mt-2 w-full text-left text-sm">
              <thead className="text-ink-muted">
                <tr>
                  <th className="py-1 pr-3 font-normal">Thumbprint</th>
                  <th className="py-1 pr-3 font-normal">Key id</th>
                  <th className="py-1 font-normal">Retired</th>
                </tr>
              </thead>
              <tbody>
                {thumbprints.data.retired.map((key) => (
                  <tr key={key.kid} className="border-t border-canvas-line">
                    <td className="break-all py-1 pr-3 font-mono">{key.thumbprint}</td>
                    <td className="break-all py-1 pr-3 font-mono">{key.kid}</td>
                    <td className="py-1">{key.retiredAt ? <LocalTime iso={key.retiredAt} /> : '—'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          <Button
            className="mt-5"
            icon={RotateCw}
            onClick={() => {
              rotate.reset();
              setIsConfirming(true);
            }}
          >
            Rotate signing key
          </Button>
        </>
      )}
      <ConfirmDialog
        isOpen={isConfirming}
        title="Rotate the signing key?"
        confirmLabel="Rotate signing key"
        isBusy={rotate.isPending}
        errorMessage={rotate.isError ? rotate.error.message : undefined}
        onConfirm={confirmRotation}
        onCancel={() => setIsConfirming(false)}
      >
        <p>
          A new key signs every archive and sign-off from now on. The current key is retired, not deleted: its
          public half stays published with the server's keys, so archives it signed stay verifiable.
        </p>
        <p className="mt-2">
          Publish the new thumbprint where your site publishes it, so that people checking new archives can
          trust them. The rotation is recorded in the audit trail.
        </p>
      </ConfirmDialog>
    </Panel>
  );
}
