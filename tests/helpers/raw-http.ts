// Requests with headers that fetch() will not send as given (Host) or bodies sent in
// pieces, straight through node:http.
import { request } from 'node:http';

export interface RawResponse {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  text: string;
}

export function rawRequest(url: string, options: { method?: string; headers?: Record<string, string>; body?: string }): Promise<RawResponse> {
  return new Promise((resolve, reject) => {
    const req = request(url, { method: options.method ?? 'GET', headers: options.headers }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (b: Buffer) => parts.push(b));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, text: Buffer.concat(parts).toString('utf8') }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end(options.body);
  });
}

/**
 * Declares a body of `declaredBytes` but sends only `sentBytes` of it, and resolves with
 * the response as soon as one arrives (or with undefined after `waitMs`): a server that
 * answers before reading the body answers here; one that waits for the body never does.
 */
export function partialBodyRequest(
  url: string,
  options: { headers: Record<string, string>; declaredBytes: number; sentBytes: number; waitMs: number },
): Promise<{ status: number; text: string; ms: number } | undefined> {
  return new Promise((resolve) => {
    const t0 = performance.now();
    let settled = false;
    const finish = (value: { status: number; text: string; ms: number } | undefined) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      req.destroy();
      resolve(value);
    };
    const req = request(url, { method: 'POST', headers: { ...options.headers, 'content-length': String(options.declaredBytes) } }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (b: Buffer) => parts.push(b));
      res.on('end', () => finish({ status: res.statusCode ?? 0, text: Buffer.concat(parts).toString('utf8'), ms: performance.now() - t0 }));
      res.on('error', () => finish(undefined));
    });
    req.on('error', () => finish(undefined));
    const timer = setTimeout(() => finish(undefined), options.waitMs);
    req.write('{"rows": [' + ' '.repeat(Math.max(0, options.sentBytes - 10)));
  });
}
