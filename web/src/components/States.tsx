// Loading, empty and error states, the same everywhere.
import type { ReactNode } from 'react';
import { ApiError } from '../api/client.js';

export function Loading({ what = 'Loading' }: { what?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-2 py-6 text-sm text-ink-600">
      <span className="h-3 w-3 animate-spin rounded-full border-2 border-ink-200 border-t-ember-500" aria-hidden />
      {what}…
    </div>
  );
}

export function Empty({ children }: { children: ReactNode }) {
  return <div role="status" className="rounded-[3px] border border-dashed border-ink-200 px-4 py-6 text-center text-sm text-ink-600">{children}</div>;
}

export function errorText(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 403) return `Not allowed: ${error.message}`;
    if (error.status === 404) return `Not found: ${error.message}`;
    return error.message;
  }
  if (error instanceof Error) return error.message;
  return String(error);
}

export function ErrorNote({ error, title = 'Something went wrong' }: { error: unknown; title?: string }) {
  return (
    <div role="alert" className="rounded-[3px] border-l-[3px] border-brick-700 bg-brick-100 px-3 py-2 text-sm text-brick-700">
      <strong className="font-semibold">{title}.</strong> {errorText(error)}
    </div>
  );
}

export function Notice({ children }: { children: ReactNode }) {
  return <div role="status" className="rounded-[3px] border-l-[3px] border-moss-700 bg-moss-100 px-3 py-2 text-sm text-moss-700">{children}</div>;
}

/** An address that names nothing (/runs/-1, /runs/abc): said at once, nothing asked of the API. */
export function BadAddress({ what }: { what: string }) {
  return (
    <div role="alert" className="rounded-[3px] border-l-[3px] border-brick-700 bg-brick-100 px-3 py-2 text-sm text-brick-700">
      <strong className="font-semibold">Not found.</strong> This address names no {what}: {what} numbers are whole numbers from 1.
    </div>
  );
}
