// Every error becomes `{"error": {"message", "details"?}}` with its status: our
// HttpError; bad input from the physics, study and store layers (400, study diagnostics
// in details); multer's and the body parser's limits (413); a full password-hashing queue
// (503, Retry-After); anything else is a 500 whose detail goes to the log, not to the
// caller. A request refused before its body was read gets `Connection: close`, so the
// client stops sending it rather than the server reading it only to throw it away.
import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { PasswordHashingBusyError } from '../../shared/db/password-hashing.js';
import { FluidRangeError } from '../../shared/physics/fluids/types.js';
import { InputError } from '../../shared/physics/types.js';
import { StudyError } from '../../shared/study/errors.js';
import { UnitError } from '../../shared/study/units.js';
import { HttpError } from '../http-error.js';

export function errorBody(message: string, details?: unknown) {
  return { error: details === undefined ? { message } : { message, details } };
}

export function handleErrors(log: (e: unknown) => void) {
  return (err: unknown, req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(err);
    if (!req.complete) res.setHeader('Connection', 'close');
    const send = (status: number, message: string, details?: unknown) => res.status(status).json(errorBody(message, details));
    if (err instanceof HttpError) return send(err.status, err.message, err.details);
    if (err instanceof PasswordHashingBusyError) {
      res.setHeader('Retry-After', '5');
      return send(503, err.message);
    }
    if (err instanceof StudyError) return send(400, 'invalid study file (nothing was run)', { diagnostics: err.diagnostics });
    if (err instanceof InputError || err instanceof UnitError || err instanceof FluidRangeError) return send(400, err.message);
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE' || err.code === 'LIMIT_FIELD_VALUE') return send(413, `upload too large: ${err.message}`);
      return send(400, `upload: ${err.message}`);
    }
    const status = (err as { status?: unknown; type?: unknown }).status;
    const type = (err as { type?: unknown }).type;
    if (type === 'entity.too.large') return send(413, 'request body too large');
    if (type === 'entity.parse.failed') return send(400, 'request body is not valid JSON');
    if (typeof status === 'number' && status >= 400 && status < 500) return send(status, (err as Error).message);
    log(err);
    return send(500, 'internal error');
  };
}
