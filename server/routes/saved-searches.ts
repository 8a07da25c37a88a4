import { Router } from 'express';
import { savedSearchInputSchema } from '../../shared/schemas/saved-searches';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { removeSavedSearch, saveSearch, savedSearchesOf } from '../services/saved-searches';
import { idParam } from './cases';

/** The signed-in user's saved searches, under /api/profile/saved-searches. */
export function savedSearchRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  r.get('/', async (req, res) => {
    res.json({ savedSearches: await savedSearchesOf(deps, req.user!) });
  });
  r.post('/', async (req, res) => {
    res.status(201).json({ savedSearch: await saveSearch(deps, req.user!, parseInput(savedSearchInputSchema, req.body, 'The saved search')) });
  });
  r.delete('/:id', async (req, res) => {
    await removeSavedSearch(deps, req.user!, parseInput(idParam, req.params.id, 'The saved search id'));
    res.status(204).end();
  });
  return r;
}
