#!/usr/bin/env node
// Entry point: the TypeScript sources are compiled to dist/ by `npm run build`,
// which npm runs as `prepare` on install, so worker threads load plain JS too.
import '../dist/cli/index.js';
