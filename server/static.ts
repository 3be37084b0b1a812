// The built web app (vite build → dist/web): its files, and index.html for every other
// GET outside /api so the app's own routes survive a reload.
import { existsSync } from 'node:fs';
import { basename, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Router } from 'express';

/** dist/web, whether this module runs from dist/server/ or from the sources. */
export function defaultWebDir(): string {
  const above = fileURLToPath(new URL('..', import.meta.url));
  return basename(above.replace(/[\\/]+$/, '')) === 'dist' ? join(above, 'web') : join(above, 'dist', 'web');
}

export function webApp(dir: string): Router | undefined {
  const index = join(dir, 'index.html');
  if (!existsSync(index)) return undefined;
  const r = express.Router();
  r.use(express.static(dir, { index: false, maxAge: '1h' }));
  r.use((req, res, next) => {
    if (req.method !== 'GET' || req.path.startsWith('/api/') || req.path === '/api') return next();
    res.sendFile(index, { headers: { 'Cache-Control': 'no-cache' } });
  });
  return r;
}
