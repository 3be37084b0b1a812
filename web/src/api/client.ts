// One fetch wrapper for the whole dashboard: JSON in and out, the API's error shape
// turned into ApiError, and the session's CSRF token on every state-changing request.
import { readAnswer, takeEarly } from './early.js';

/** The API's error body: `{"error": {"message", "details"?}}` with the HTTP status. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let csrfToken: string | null = null;

/** Set from GET/POST /api/session; cleared on sign-out. */
export function setCsrfToken(token: string | null) {
  csrfToken = token;
}

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** A plain object is sent as JSON; FormData as multipart. */
  body?: unknown;
  signal?: AbortSignal;
}

export async function api<T>(url: string, options: RequestOptions = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  let body: BodyInit | undefined;
  if (options.body instanceof FormData) body = options.body;
  else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.body);
  }
  if (UNSAFE.has(method) && csrfToken) headers['X-CSRF-Token'] = csrfToken;
  // A GET the page asked for before the app loaded (early.ts) is answered from there.
  const early = method === 'GET' && body === undefined ? takeEarly(url) : undefined;
  const res = await (early ?? fetch(url, { method, headers, body, credentials: 'same-origin', signal: options.signal }).then(readAnswer));
  if (res.status === 204) return undefined as T;
  const { text } = res;
  const ok = res.status >= 200 && res.status < 300;
  let data: unknown = undefined;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      if (!ok) throw new ApiError(res.status, `${res.status} ${res.statusText}`);
      throw new ApiError(res.status, 'the server sent something that is not JSON');
    }
  }
  if (!ok) {
    const err = (data as { error?: { message?: string; details?: unknown } } | undefined)?.error;
    throw new ApiError(res.status, err?.message ?? `${res.status} ${res.statusText}`, err?.details);
  }
  return data as T;
}

/** A query string from defined values; arrays become repeated keys. */
export function qs(params: Record<string, string | number | undefined | null | readonly string[]>): string {
  const sp = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) {
    if (v === undefined || v === null || v === '') continue;
    if (Array.isArray(v)) for (const item of v) sp.append(k, item);
    else sp.set(k, String(v));
  }
  const s = sp.toString();
  return s ? `?${s}` : '';
}
