// zod at the door of every route: params, query and body are parsed before use; a
// failure is a 400 whose details are the zod issues.
import type { z } from '#zod';
import { HttpError } from '../http-error.js';

export function parse<S extends z.ZodType>(schema: S, value: unknown, where: 'body' | 'query' | 'params' | 'field'): z.infer<S> {
  const r = schema.safeParse(value);
  if (!r.success) {
    const first = r.error.issues[0];
    const at = first?.path.length ? ` (${where}.${first.path.join('.')})` : ` (${where})`;
    throw new HttpError(400, `invalid request: ${first?.message ?? 'bad value'}${at}`, r.error.issues);
  }
  return r.data;
}
