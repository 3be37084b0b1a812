// Entry: fonts and styles ship with the app (nothing loads from the internet). This entry is
// kept small: it rewrites mailed path links, sends the run page's early requests (early.ts)
// and then loads the app (boot.tsx, React and the router), so those requests go out before
// the browser spends its time on the app's code. KaTeX's styles come with the catalogue's chunk.
import './path-links.js';
import { earlyRequestsSent } from './early.js';
import '@fontsource-variable/atkinson-hyperlegible-next/wght.css';
import '@fontsource-variable/atkinson-hyperlegible-mono/wght.css';
import './styles.css';

void earlyRequestsSent.then(() => import('./boot.js'));
