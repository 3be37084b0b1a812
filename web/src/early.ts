// Runs before the app's own code (index.html lists it first). Opened straight at a run page
// (a link, a reload) by a browser that says it is signed in, that page's data is asked for
// now, while the browser still parses and runs the app (a fifth of a second on a busy
// machine); the app's requests for the same addresses take these answers (api/early.ts).
// The starting chart is asked for as soon as the run and its axis facts are in.
import { askEarly } from './api/early.js';
import { CATALOGUE_URL, chartAxesUrl, chartUrl, resultsUrl, runUrl, SESSION_URL } from './api/run-urls.js';
import { signedInHint } from './api/session-hint.js';
import { defaultChartQuery } from './lib/chart-defaults.js';
import { defaultResultQuery } from './lib/result-query.js';

/**
 * Settles once the starting chart has been asked for (or there is none to ask for), at most
 * WAIT_MS after this module ran: main.tsx loads the app only then, since the app's code
 * keeps the browser busy for a while and the chart request would otherwise wait behind it.
 */
export let earlyRequestsSent: Promise<void> = Promise.resolve();
const WAIT_MS = 300;

const opened = /^#\/runs\/([1-9]\d{0,15})$/.exec(window.location.hash);
if (opened && signedInHint()) {
  const id = Number(opened[1]);
  void askEarly(SESSION_URL);
  const run = askEarly(runUrl(id));
  const axes = askEarly(chartAxesUrl(id));
  void askEarly(resultsUrl(id, defaultResultQuery));
  void askEarly(CATALOGUE_URL);
  const chartAsked = Promise.all([run, axes])
    .then(([r, a]) => {
      if (r.status !== 200 || a.status !== 200) return;
      const query = defaultChartQuery(JSON.parse(r.text), JSON.parse(a.text));
      if (query) void askEarly(chartUrl(id, query));
    })
    .catch(() => undefined); // the app asks again and shows what went wrong
  earlyRequestsSent = Promise.race([chartAsked, new Promise<void>((r) => setTimeout(r, WAIT_MS))]);
}
