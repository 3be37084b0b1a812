// API tokens for CI (`filmsweep push`): create one (its secret is shown once) and revoke.
import { useMemo, useState, type FormEvent } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { useCreateToken, useRevokeToken, useTokens, type ApiToken } from '../api/tokens.js';
import { DataTable } from '../components/DataTable.js';
import { ErrorNote, Loading } from '../components/States.js';
import { formatTime } from '../lib/format.js';

const col = createColumnHelper<ApiToken>();

export function TokensPage() {
  const tokens = useTokens();
  const create = useCreateToken();
  const revoke = useRevokeToken();
  const [name, setName] = useState('');
  const [copied, setCopied] = useState(false);

  const columns = useMemo(
    () => [
      col.accessor('name', { header: 'Name' }),
      col.accessor('created_at', { header: 'Created', cell: (c) => formatTime(c.getValue()) }),
      col.accessor('last_used_at', { header: 'Last used', cell: (c) => formatTime(c.getValue()) }),
      col.display({
        id: 'revoke',
        header: '',
        cell: (c) => (
          <button type="button" className="btn btn-small btn-danger" disabled={revoke.isPending} onClick={() => { if (window.confirm(`Revoke the token “${c.row.original.name}”? Anything using it stops working.`)) revoke.mutate(c.row.original.id); }}>
            Revoke
          </button>
        ),
      }),
    ],
    [revoke.isPending],
  );

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setCopied(false);
    create.mutate({ name }, { onSuccess: () => setName('') });
  };

  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold">API tokens</h1>
      <p className="max-w-3xl text-sm text-ink-700">
        A token lets CI push runs to this server without a password: <code className="rounded bg-ink-50 px-1">filmsweep push RUN --server URL --token TOKEN</code>. It acts with your role; revoke it when it is no longer needed.
      </p>
      <section className="card max-w-3xl" aria-labelledby="new-token-heading">
        <h2 id="new-token-heading" className="card-title">New token</h2>
        <form onSubmit={submit} className="flex flex-wrap items-end gap-2" aria-label="New token">
          <div className="min-w-48 flex-1">
            <label htmlFor="token-name" className="field-label">What it is for</label>
            <input id="token-name" required maxLength={100} className="input" value={name} onChange={(e) => setName(e.target.value)} placeholder="e.g. CI on main" />
          </div>
          <button type="submit" className="btn btn-primary" disabled={create.isPending}>Create token</button>
        </form>
        {create.isError && <div className="mt-2"><ErrorNote error={create.error} title="No token made" /></div>}
        {create.isSuccess && (
          <div role="status" className="mt-3 space-y-2 rounded-md border border-copper-500/40 bg-copper-100 p-3 text-sm">
            <p className="font-semibold text-copper-700">Copy the token “{create.data.name}” now: it is shown only this once.</p>
            <div className="flex items-center gap-2">
              <code className="flex-1 break-all rounded bg-white px-2 py-1 font-mono text-xs" data-testid="new-token">{create.data.token}</code>
              <button type="button" className="btn btn-small" onClick={() => void navigator.clipboard?.writeText(create.data.token).then(() => setCopied(true))}>
                {copied ? 'Copied' : 'Copy'}
              </button>
            </div>
          </div>
        )}
      </section>
      <section className="card max-w-3xl" aria-labelledby="tokens-heading">
        <h2 id="tokens-heading" className="card-title">Your tokens</h2>
        {revoke.isError && <div className="mb-2"><ErrorNote error={revoke.error} /></div>}
        {tokens.isPending ? <Loading what="Loading your tokens" /> : tokens.isError ? <ErrorNote error={tokens.error} title="Your tokens could not be listed" /> : <DataTable label="API tokens" columns={columns} data={tokens.data.tokens} empty="No tokens yet. Make one above for CI." />}
      </section>
    </div>
  );
}
