// The dashboard's build: Vite with `web/` as its root, output in dist/web (served by
// `filmsweep serve`). In development `/api` is proxied to a local `filmsweep serve`.
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const root = fileURLToPath(new URL('.', import.meta.url));

/** Server-only code that must never reach the browser bundle (DESIGN.md section 4). */
export const FORBIDDEN_IN_WEB = [path.join(root, 'shared', 'db'), path.join(root, 'shared', 'runner'), path.join(root, 'server')];

/** Fails the build when any module under a forbidden folder, or a Node built-in, is imported. */
function serverCodeGuard(): Plugin {
  return {
    name: 'filmsweep-server-code-guard',
    enforce: 'pre',
    async resolveId(source, importer) {
      if (!importer) return null;
      if (source.startsWith('node:')) {
        this.error(`${importer} imports the Node built-in '${source}'; the dashboard must stay browser-safe`);
      }
      const resolved = await this.resolve(source, importer, { skipSelf: true });
      const id = resolved?.id.split('?')[0];
      if (id && FORBIDDEN_IN_WEB.some((dir) => id.startsWith(dir + path.sep))) {
        this.error(`${importer} imports ${path.relative(root, id)}; shared/db, shared/runner and server/ are server-only`);
      }
      return resolved;
    },
  };
}

export default defineConfig({
  root: path.join(root, 'web'),
  plugins: [serverCodeGuard(), react(), tailwindcss()],
  build: {
    outDir: path.join(root, 'dist', 'web'),
    emptyOutDir: true,
    chunkSizeWarningLimit: 1500,
  },
  server: {
    port: 5173,
    proxy: { '/api': { target: 'http://127.0.0.1:4173', changeOrigin: false } },
  },
});
