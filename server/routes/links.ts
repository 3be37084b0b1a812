// Links in e-mails point at the web app: `<base>/invite/<token>` and `<base>/reset/<token>`.
import type { Request } from 'express';
import type { AppContext } from '../context.js';

export function linkBase(ctx: AppContext, req: Request): string {
  return (ctx.options.publicUrl ?? `${req.protocol}://${req.get('host')}`).replace(/\/+$/, '');
}
