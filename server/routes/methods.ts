// The catalogue as data: the `filmsweep methods --json` shape.
import { Router } from 'express';
import { z } from '#zod';
import { describeMethod, methods } from '../../shared/physics/catalogue.js';
import { configurations, describeConfiguration } from '../../shared/physics/configurations.js';
import { parse } from '../middleware/validate.js';

export function methodsRouter(): Router {
  const r = Router();
  r.get('/', (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    res.json({ configurations: configurations.map(describeConfiguration), methods: methods.map(describeMethod) });
  });
  return r;
}
