// Whether this browser holds a session, remembered beside the (HttpOnly, unreadable)
// cookie: a browser that never signed in, or signed out, does not ask the server, so the
// sign-in page loads without a 401 in the console. A session that expired while the hint
// says "signed in" costs one 401, after which the hint is gone. A cookie without the hint
// (a browser that signed in before the hint existed) leads to the sign-in page once.
// Its own module: the early requests (web/src/early.ts) read it before the app loads.
const HINT = 'filmsweep.signed-in';

/** Whether this browser says it holds a session (pages may ask for their data before the session answers). */
export function signedInHint(): boolean {
  try {
    return localStorage.getItem(HINT) === '1';
  } catch {
    return true; // storage blocked: ask the server
  }
}

export function remember(signedIn: boolean) {
  try {
    if (signedIn) localStorage.setItem(HINT, '1');
    else localStorage.removeItem(HINT);
  } catch {
    // storage blocked: the probe runs every time instead
  }
}
