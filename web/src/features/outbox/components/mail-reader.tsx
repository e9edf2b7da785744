import type { TOutboxList } from '@shared/contracts/outbox';
import { Button } from '@web/components/button';
import { LocalTime } from '@web/components/local-time';
import { useState } from 'react';

type Message = TOutboxList['items'][number];

/**
 * One captured mail. The HTML part is shown only inside an iframe with an empty `sandbox`, which
 * runs no script, submits no form and cannot reach this page; the text part is plain text.
 */
export function MailReader({ message }: { message: Message }) {
  const [view, setView] = useState<'text' | 'html'>('text');
  return (
    <article aria-labelledby="mail-subject" className="space-y-3">
      <h2 id="mail-subject" className="text-base font-bold">
        {message.subject}
      </h2>
      <dl className="grid grid-cols-[4rem_minmax(0,1fr)] gap-x-3 text-sm">
        <dt className="text-ink-muted">From</dt>
        <dd className="break-all">{message.from}</dd>
        <dt className="text-ink-muted">To</dt>
        <dd className="break-all">{message.to.join(', ')}</dd>
        <dt className="text-ink-muted">Received</dt>
        <dd>
          <LocalTime iso={message.receivedAt} />
        </dd>
      </dl>
      {message.html && (
        <fieldset className="flex gap-1">
          <legend className="sr-only">Show the message as</legend>
          <Button
            size="sm"
            variant={view === 'text' ? 'primary' : 'secondary'}
            aria-pressed={view === 'text'}
            onClick={() => setView('text')}
          >
            Plain text
          </Button>
          <Button
            size="sm"
            variant={view === 'html' ? 'primary' : 'secondary'}
            aria-pressed={view === 'html'}
            onClick={() => setView('html')}
          >
            Formatted (sandboxed)
          </Button>
        </fieldset>
      )}
      {view === 'html' && message.html ? (
        <iframe
          title={`Message: ${message.subject}`}
          sandbox=""
          srcDoc={message.html}
          className="h-96 w-full rounded-md border border-canvas-line bg-white"
        />
      ) : (
        <pre className="max-h-96 overflow-auto rounded-md bg-canvas-sunk p-3 text-sm whitespace-pre-wrap">
          {message.text}
        </pre>
      )}
    </article>
  );
}
