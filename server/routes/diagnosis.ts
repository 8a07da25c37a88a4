import { Router } from 'express';
import { diagnose } from '../../shared/diagnosis/ranker';
import { diagnosisInputSchema } from '../../shared/schemas/diagnosis';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';

/** The engine on its own: the same shared code the browser runs, recomputed here for API callers. */
export function diagnosisRoutes() {
  const r = Router();
  r.use(requireAuth);
  r.post('/', (req, res) => {
    res.json(diagnose(parseInput(diagnosisInputSchema, req.body, 'The diagnosis request')));
  });
  return r;
}
