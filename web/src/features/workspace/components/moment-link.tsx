import { Button } from '@web/components/button';
import { paths } from '@web/config/paths';
import { Check, Link2 } from 'lucide-react';
import { useState } from 'react';

export interface MomentLinkProps {
  bundleId: string;
  replayId: string;
  /** Cursor time, s since the recording's start. */
  time: number;
}

/**
 * A link that opens this workspace at this replay and moment, to paste into a message or a
 * finding. The address is also shown in a read-only field, since a browser may refuse the
 * clipboard (no permission, plain http).
 */
export function MomentLink({ bundleId, replayId, time }: MomentLinkProps) {
  const href = `${window.location.origin}${paths.workspace.href(bundleId, replayId, time)}`;
  // Remembers which address the last copy was for, so moving the cursor clears "copied".
  const [outcome, setOutcome] = useState<{ href: string; isCopied: boolean } | null>(null);
  const copied = outcome?.href !== href ? null : outcome.isCopied ? 'yes' : 'no';
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(href);
      setOutcome({ href, isCopied: true });
    } catch {
      setOutcome({ href, isCopied: false });
    }
  };
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5">
      <Button size="sm" icon={copied === 'yes' ? Check : Link2} onClick={copy}>
        {copied === 'yes' ? 'Link copied' : 'Copy link to this moment'}
      </Button>
      <input
        readOnly
        aria-label="Link to this moment"
        value={href}
        onFocus={(event) => event.currentTarget.select()}
        className="w-56 rounded border border-canvas-line bg-canvas-sunk px-1.5 py-0.5 text-xs text-ink-muted"
      />
      {copied === 'no' && (
        <span className="text-xs text-ink-muted">The browser refused the clipboard: copy the field.</span>
      )}
    </span>
  );
}
