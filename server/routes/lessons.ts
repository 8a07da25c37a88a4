import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { checklistOrderSchema } from '../../shared/schemas/lessons';
import { listLessons, pinLesson, reorderChecklist } from '../services/lessons';
import { idParam } from './cases';

export function lessonRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  r.get('/', async (req, res) => {
    const { q } = parseInput(z.object({ q: z.string().trim().max(200).optional() }), req.query, 'The lesson search');
    res.json(await listLessons(deps, q || undefined, req.user!));
  });
  r.post('/:caseId/pin', async (req, res) => {
    const { pinned } = parseInput(z.object({ pinned: z.boolean({ error: 'pinned must be true or false' }) }), req.body, 'The request');
    await pinLesson(deps, req.user!, parseInput(idParam, req.params.caseId, 'The case id'), pinned);
    res.json(await listLessons(deps, undefined, req.user!));
  });
  r.put('/checklist', async (req, res) => {
    const { caseIds } = parseInput(checklistOrderSchema, req.body, 'The checklist order');
    await reorderChecklist(deps, req.user!, caseIds);
    res.json(await listLessons(deps, undefined, req.user!));
  });
  return r;
}
