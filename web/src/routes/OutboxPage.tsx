// The local mail outbox (development mode): what the server would have mailed.
import { useState } from 'react';
import { ApiError } from '../api/client.js';
import { useOutbox } from '../api/outbox.js';
import { Empty, ErrorNote, Loading } from '../components/States.js';
import { formatTime } from '../lib/format.js';

/** Links in a mail body, so invitation and reset links can be followed from here. */
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/\S+|\/#\/\S+)/g);
  return <>{parts.map((p, i) => (i % 2 ? <a key={i} className="link" href={p}>{p}</a> : p))}</>;
}

export function OutboxPage() {
  const outbox = useOutbox();
  const [open, setOpen] = useState<number | null>(null);
  if (outbox.isPending) return <Loading what="Loading the outbox" />;
  if (outbox.isError) {
    if (outbox.error instanceof ApiError && outbox.error.status === 404) return <Empty>The outbox exists only when the server runs in development mode (serve --dev).</Empty>;
    return <ErrorNote error={outbox.error} title="The outbox could not be loaded" />;
  }
  const messages = outbox.data.messages;
  const shown = messages.find((m) => m.id === open) ?? messages[0];
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h1 className="text-2xl font-semibold">Outbox</h1>
        <p className="text-sm text-ink-600">development mode: mail is kept here instead of being sent</p>
        <button type="button" className="btn btn-small ml-auto" onClick={() => void outbox.refetch()}>Refresh</button>
      </div>
      {messages.length === 0 ? (
        <Empty>No mail yet. Invitations, password resets and “run finished” notes appear here.</Empty>
      ) : (
        <div className="grid grid-cols-1 gap-5 lg:grid-cols-[26rem_minmax(0,1fr)]">
          <ul className="card divide-y divide-ink-50 p-0" aria-label="Messages">
            {messages.map((m) => (
              <li key={m.id}>
                <button type="button" onClick={() => setOpen(m.id)} aria-current={shown?.id === m.id || undefined} className={`block w-full px-4 py-2.5 text-left hover:bg-ink-50 ${shown?.id === m.id ? 'bg-ink-50' : ''}`}>
                  <span className="block text-sm font-medium">{m.subject}</span>
                  <span className="block text-xs text-ink-600">to {m.to} · {formatTime(m.created_at)}</span>
                </button>
              </li>
            ))}
          </ul>
          {shown && (
            <article className="card min-w-0" aria-label="Message">
              <h2 className="text-base font-semibold">{shown.subject}</h2>
              <p className="mb-3 text-xs text-ink-600">to {shown.to} · {formatTime(shown.created_at)}</p>
              <pre className="whitespace-pre-wrap font-sans text-sm" data-testid="mail-text"><Linkified text={shown.text} /></pre>
            </article>
          )}
        </div>
      )}
    </div>
  );
}
