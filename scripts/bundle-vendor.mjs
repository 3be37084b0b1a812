// Kysely and zod as one file each, for the compiled CLI and server (dist/vendor/).
//
// Node 20 loads an ES module package file by file: resolve, read, compile, link each of
// Kysely's 263 files and zod's 95 before `filmsweep run` can open the database or check
// a study. The same code bundled into one file loads in a fraction of that (measured
// here, `await import()` in a new process: kysely 88 → 12 ms, zod 48 → 24 ms), which is
// most of a run's start-up beyond Node's own. The sources import `#kysely` and `#zod`;
// package.json "imports" sends Node to these files and everything else (TypeScript's
// types, Vite's browser build, Vitest's aliases) to the packages themselves, so there is
// one copy of each at run time and the versions are those of package-lock.json.
import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { build } from 'rolldown';

const root = fileURLToPath(new URL('..', import.meta.url));
const VENDORED = ['kysely', 'zod'];

mkdirSync(`${root}dist/vendor`, { recursive: true });
for (const name of VENDORED) {
  await build({
    input: name,
    cwd: root,
    platform: 'node',
    logLevel: 'warn',
    output: { file: `${root}dist/vendor/${name}.js`, format: 'esm', sourcemap: false },
  });
}
