// `node --import ./tests/helpers/import-trace.mjs …`: writes every module the process
// loads to the file named by $FILMSWEEP_IMPORT_TRACE, one a line: ES modules as they are
// resolved (loader hooks), CommonJS ones (also those loaded through createRequire) from
// the require cache when the process exits.
import { appendFileSync } from 'node:fs';
import { createRequire, register } from 'node:module';
import { pathToFileURL } from 'node:url';

const file = process.env.FILMSWEEP_IMPORT_TRACE;
register('./import-trace-hooks.mjs', import.meta.url, { data: { file } });
const cache = createRequire(import.meta.url).cache;
process.on('exit', () => {
  if (file) appendFileSync(file, Object.keys(cache).map((p) => `${pathToFileURL(p).href}\n`).join(''));
});
