// Answers to GET requests made before the app's own code has run (web/src/early.ts), handed
// to the first api() call for the same address (client.ts). Each answer is taken once and
// only while fresh, so a later request never gets an old one.

/** What api() needs of a response: its status and its body as text. */
export interface Answer {
  status: number;
  statusText: string;
  text: string;
}

/** An early answer not taken within this time is dropped (the app asks again). */
const FRESH_MS = 10_000;

const answers = new Map<string, { at: number; answer: Promise<Answer> }>();

export function readAnswer(res: Response): Promise<Answer> {
  return res.status === 204 ? Promise.resolve({ status: 204, statusText: res.statusText, text: '' }) : res.text().then((text) => ({ status: res.status, statusText: res.statusText, text }));
}

/** GET `url` now; the app's first request for it takes the answer. */
export function askEarly(url: string): Promise<Answer> {
  const answer = fetch(url, { headers: { Accept: 'application/json' }, credentials: 'same-origin' }).then(readAnswer);
  answer.catch(() => undefined); // a failure reaches the api() call that takes it, not the console
  answers.set(url, { at: performance.now(), answer });
  return answer;
}

/** The early answer for `url`, once (undefined: none, or too old). */
export function takeEarly(url: string): Promise<Answer> | undefined {
  const early = answers.get(url);
  if (!early) return undefined;
  answers.delete(url);
  return performance.now() - early.at < FRESH_MS ? early.answer : undefined;
}
