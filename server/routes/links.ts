// Links in e-mails point at the web app: `<base>/invite/<token>`, `<base>/reset/<token>`,
// `<base>/runs/<id>`. The base is the configured public URL (`serve --public-url`), else
// the address the server itself listens on, read from the connection's local end. Never
// from a request header (Host, X-Forwarded-Host …): those are the caller's to choose, and
// a reset link sent to a host of the caller's choosing hands them the victim's token.
import type { Request } from 'express';
import { isIPv6 } from 'node:net';
import type { AppContext } from '../context.js';

/** A public URL as `--public-url` takes it: http(s), no query or fragment; returned without a trailing slash. */
export function parsePublicUrl(raw: string): string {
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    throw new Error(`--public-url: '${raw}' is not a URL; expected e.g. https://filmsweep.example.org`);
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') throw new Error(`--public-url: expected an http:// or https:// URL, got ${url.protocol}`);
  if (url.search || url.hash || url.username || url.password) throw new Error('--public-url: give the base address only (no query, fragment or credentials)');
  return url.toString().replace(/\/+$/, '');
}

/** `http://host:port` of an address and port, with IPv6 in brackets and IPv4-mapped IPv6 unwrapped. */
export function originOf(address: string, port: number): string {
  const host = address.replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/, '$1');
  return `http://${isIPv6(host) ? `[${host}]` : host}:${port}`;
}

export function linkBase(ctx: AppContext, req: Request): string {
  if (ctx.options.publicUrl) return ctx.options.publicUrl;
  // The address this connection reached: the server's own (listening) address.
  return originOf(req.socket.localAddress ?? '127.0.0.1', req.socket.localPort ?? 0);
}
