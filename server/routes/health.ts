// `GET /api/health` (public): answers at once while the process serves requests, for a
// reverse proxy's or a monitor's health check. Says nothing about the data or the users.
import { Router } from 'express';
import { z } from '#zod';
import { parse } from '../middleware/validate.js';

export function healthRouter(): Router {
  const r = Router();
  r.get('/', (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    res.json({ status: 'ok' });
  });
  return r;
}
