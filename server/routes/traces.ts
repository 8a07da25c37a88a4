import { Router } from 'express';
import { traceQuerySchema } from '../../shared/schemas/trace';
import { createPlotStores } from '../captures/plot-stores';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { attachmentTrace } from '../services/traces';
import { idParam } from './cases';

/**
 * `GET /api/attachments/:id/trace?columns=&fromS=&toS=`: a capture decimated for a plot of
 * `columns` pixels, so the browser never downloads the whole CSV to draw it. Zoom and pan
 * re-queries read the capture's compact binary samples on disk, never the CSV.
 */
export function traceRoutes(deps: AppDeps) {
  const r = Router();
  const plots = createPlotStores();
  r.use(requireAuth);
  r.get('/:id/trace', async (req, res) => {
    const id = parseInput(idParam, req.params.id, 'The attachment id');
    const query = parseInput(traceQuerySchema, req.query, 'The trace query');
    res.json(await attachmentTrace(deps, plots, req.user!, id, query));
  });
  return r;
}
