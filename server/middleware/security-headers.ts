// Security headers on every response (API, web app, errors), set with helmet. The
// Content-Security-Policy allows scripts only from this origin (no inline script, no
// eval), so a string that slips into an HTML sink cannot run code:
// - script-src 'self', object-src 'none', base-uri 'none', frame-ancestors 'none',
//   form-action 'self'; everything else falls back to default-src 'self'.
// - style attributes are allowed ('unsafe-inline' in style-src-attr only): ECharts writes
//   its tooltips and SVG with style attributes and KaTeX its layout. Style sheets and
//   <style> elements still come only from 'self'.
// - images and fonts from 'self' and data: URLs (the favicon is `data:,`; charts exported
//   as PNG are data: URLs); blob: images for the same export path.
// No upgrade-insecure-requests and no Strict-Transport-Security: the server usually
// listens on plain HTTP on 127.0.0.1, and HTTPS is the reverse proxy's job (README,
// Security), which is also where HSTS belongs.
import helmet from 'helmet';

export const CSP_DIRECTIVES = {
  'default-src': ["'self'"],
  'script-src': ["'self'"],
  'script-src-attr': ["'none'"],
  'style-src': ["'self'"],
  'style-src-attr': ["'unsafe-inline'"],
  'img-src': ["'self'", 'data:', 'blob:'],
  'font-src': ["'self'", 'data:'],
  'connect-src': ["'self'"],
  'object-src': ["'none'"],
  'base-uri': ["'none'"],
  'frame-ancestors': ["'none'"],
  'form-action': ["'self'"],
} as const;

export function securityHeaders() {
  return helmet({
    contentSecurityPolicy: { useDefaults: false, directives: CSP_DIRECTIVES as unknown as Record<string, string[]> },
    strictTransportSecurity: false,
    // The existing policy: the app's own pages may send the referrer to the API, nobody else.
    referrerPolicy: { policy: 'same-origin' },
    xFrameOptions: { action: 'deny' },
  });
}
