// Preloaded into a benchmarked process (`node --import …/peak-rss.js`): when the process
// exits, writes its peak resident set size in bytes (all threads) to the file named by
// $FILMSWEEP_PEAK_RSS_FILE.
import { writeFileSync } from 'node:fs';

const file = process.env.FILMSWEEP_PEAK_RSS_FILE;
process.on('exit', () => {
  if (file) writeFileSync(file, String(process.resourceUsage().maxRSS * 1024));
});
