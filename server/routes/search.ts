import { Router } from 'express';
import { searchQuerySchema } from '../../shared/schemas/search';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { openCaseSearch, type CaseSearch } from '../search/case-search';
import { visibleCaseRow } from '../services/cases';
import { idParam } from './cases';

const opening = new WeakMap<AppDeps, Promise<CaseSearch>>();

/** The app's search index; opened on first use when the caller did not build one into `deps`. */
export function searchOf(deps: AppDeps): Promise<CaseSearch> {
  if (deps.search) return Promise.resolve(deps.search);
  let open = opening.get(deps);
  if (!open) {
    open = openCaseSearch(deps.db, { dataDir: deps.config.dataDir }).then((s) => (deps.search = s));
    opening.set(deps, open);
  }
  return open;
}

/** `GET /api/search?q=&cause=&tag=&status=&page=&pageSize=` */
export function searchRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  r.get('/', async (req, res) => {
    const query = parseInput(searchQuerySchema, req.query, 'The search');
    res.json(await (await searchOf(deps)).search(req.user!, query));
  });
  return r;
}

/** `GET /api/cases/:id/similar`: 404 when the caller may not see the case itself. */
export function similarCaseRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  r.get('/:id/similar', async (req, res) => {
    const id = parseInput(idParam, req.params.id, 'The case id');
    await visibleCaseRow(deps.db, req.user!, id);
    res.json(await (await searchOf(deps)).similar(req.user!, id));
  });
  return r;
}
