import { Router } from 'express';
import { z } from 'zod';
import { caseReferencesQuerySchema } from '../../shared/cases/case-references';
import { caseCreateSchema, caseListQuerySchema, casePatchSchema, commentInputSchema } from '../../shared/schemas/case';
import { reviewInputSchema } from '../../shared/schemas/review';
import type { AppDeps } from '../deps';
import { createRateLimits } from '../middleware/rate-limits';
import { requireAuth } from '../middleware/require-auth';
import { singleUpload } from '../middleware/upload';
import { parseInput } from '../middleware/validate';
import { addAttachment, removeAttachment } from '../services/attachments';
import { authorsFor, createCase, deleteCase, listCasesFor, loadCase, submitCase, updateCase } from '../services/cases';
import { visibleCasesByIds } from '../services/case-references';
import { addComment, commentsOf } from '../services/comments';
import { diffRevisions, revisionsOf } from '../services/revisions';
import { historyOf } from '../services/history';
import { reviewCase } from '../services/review';
import { storagePaths } from '../storage';
import { unwatchCase, watchCase } from '../db/repositories/watches';
import { visibleCaseRow } from '../services/cases';

export const idParam = z.coerce.number({ error: 'The id must be a number' }).int().positive('The id must be a positive number');

export function caseRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  const id = (raw: unknown) => parseInput(idParam, raw, 'The case id');

  r.get('/', async (req, res) => {
    const query = parseInput(caseListQuerySchema, req.query, 'The case filter');
    res.json({ ...(await listCasesFor(deps, req.user!, query)), page: query.page, pageSize: query.pageSize });
  });

  r.get('/authors', async (req, res) => {
    res.json({ authors: await authorsFor(deps, req.user!) });
  });

  // the cases a draft names as #123, those the reader may open: the editor's preview links them
  r.get('/references', async (req, res) => {
    const { ids } = parseInput(caseReferencesQuerySchema, req.query, 'The case numbers');
    res.json({ references: await visibleCasesByIds(deps.db, req.user!, ids) });
  });

  r.post('/', async (req, res) => {
    res.status(201).json({ case: await createCase(deps, req.user!, parseInput(caseCreateSchema, req.body, 'The case')) });
  });

  r.get('/:id', async (req, res) => {
    res.json({ case: await loadCase(deps.db, req.user!, id(req.params.id)) });
  });

  r.patch('/:id', async (req, res) => {
    const caseId = id(req.params.id);
    res.json({ case: await updateCase(deps, req.user!, caseId, parseInput(casePatchSchema, req.body, 'The change'), { requireBase: true }) });
  });

  r.delete('/:id', async (req, res) => {
    const files = await deleteCase(deps, req.user!, id(req.params.id));
    const storage = storagePaths(deps.config);
    await Promise.all(files.map((f) => storage.remove(f)));
    res.status(204).end();
  });

  r.post('/:id/submit', async (req, res) => {
    res.json({ case: await submitCase(deps, req.user!, id(req.params.id)) });
  });

  r.post('/:id/attachments', singleUpload(deps.config), async (req, res) => {
    const f = req.file!;
    const attachment = await addAttachment(deps, req.user!, id(req.params.id), { path: f.path, originalName: f.originalname, sizeBytes: f.size });
    res.status(201).json({ attachment });
  });

  r.delete('/:id/attachments/:attachmentId', async (req, res) => {
    await removeAttachment(deps, req.user!, id(req.params.id), parseInput(idParam, req.params.attachmentId, 'The attachment id'));
    res.status(204).end();
  });

  r.post('/:id/review', async (req, res) => {
    const caseId = id(req.params.id);
    res.json({ case: await reviewCase(deps, req.user!, caseId, parseInput(reviewInputSchema, req.body, 'The review')) });
  });

  r.post('/:id/watch', async (req, res) => {
    const caseId = id(req.params.id);
    await visibleCaseRow(deps.db, req.user!, caseId);
    await watchCase(deps.db, req.user!.id, caseId);
    res.json({ watching: true });
  });

  r.delete('/:id/watch', async (req, res) => {
    await unwatchCase(deps.db, req.user!.id, id(req.params.id));
    res.json({ watching: false });
  });

  r.get('/:id/history', async (req, res) => {
    res.json({ history: await historyOf(deps, req.user!, id(req.params.id)) });
  });

  r.get('/:id/revisions', async (req, res) => {
    res.json({ revisions: await revisionsOf(deps, req.user!, id(req.params.id)) });
  });

  r.get('/:id/revisions/diff', async (req, res) => {
    const q = parseInput(z.object({ from: idParam, to: idParam }), req.query, 'The revision numbers');
    res.json({ diff: await diffRevisions(deps, req.user!, id(req.params.id), q.from, q.to) });
  });

  r.get('/:id/comments', async (req, res) => {
    res.json({ comments: await commentsOf(deps, req.user!, id(req.params.id)) });
  });

  r.post('/:id/comments', createRateLimits().comments, async (req, res) => {
    const { body } = parseInput(commentInputSchema, req.body, 'The comment');
    res.status(201).json({ comment: await addComment(deps, req.user!, id(req.params.id), body) });
  });

  return r;
}
