import { LocalTime } from '@web/components/local-time';
import { Pagination } from '@web/components/pagination';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { MailOpen } from 'lucide-react';
import { useState } from 'react';
import { useOutbox } from '../api/get-outbox';
import { MailReader } from './mail-reader';

const PANEL = 'rounded-lg border border-canvas-line bg-canvas-raised p-5 shadow-sm';

/** Mail the local fake SMTP server caught, newest first, with a reader beside the list. */
export function OutboxView() {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(20);
  const [openId, setOpenId] = useState<number>();
  const outbox = useOutbox(page, pageSize);
  if (outbox.isError)
    return (
      <ErrorState error={outbox.error} title="Could not load the outbox" onRetry={() => outbox.refetch()} />
    );
  if (!outbox.data) return <SkeletonBar className="w-96" />;
  if (outbox.data.total === 0)
    return (
      <div className={PANEL}>
        <EmptyState icon={MailOpen} title="No mail captured yet">
          Notifications sent by Driftcase appear here when the local fake mail server is in use.
        </EmptyState>
      </div>
    );
  const open = outbox.data.items.find((m) => m.id === openId);
  return (
    <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-5">
      <section aria-label="Captured mail" className={`${PANEL} space-y-3`}>
        <table className="w-full table-fixed text-sm">
          <caption className="sr-only">Captured mail, newest first</caption>
          <thead className="text-left text-xs text-ink-muted uppercase">
            <tr>
              <th className="w-40 py-1">Received</th>
              <th className="w-56">To</th>
              <th>Subject</th>
            </tr>
          </thead>
          <tbody>
            {outbox.data.items.map((message) => (
              <tr
                key={message.id}
                className={`border-t border-canvas-line ${message.id === openId ? 'bg-accent-soft' : ''}`}
              >
                <td className="py-2 pr-3">
                  <LocalTime iso={message.receivedAt} />
                </td>
                <td className="truncate pr-3" title={message.to.join(', ')}>
                  {message.to.join(', ')}
                </td>
                <td>
                  <button
                    type="button"
                    className="text-left text-accent hover:underline"
                    aria-pressed={message.id === openId}
                    onClick={() => setOpenId(message.id)}
                  >
                    {message.subject}
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <Pagination
          page={page}
          pageSize={pageSize}
          total={outbox.data.total}
          itemLabel="messages"
          onPageChange={setPage}
          onPageSizeChange={(size) => {
            setPageSize(size);
            setPage(1);
          }}
        />
      </section>
      <section aria-label="Message" className={PANEL}>
        {open ? (
          <MailReader message={open} />
        ) : (
          <p className="text-sm text-ink-muted">Choose a message to read it.</p>
        )}
      </section>
    </div>
  );
}
