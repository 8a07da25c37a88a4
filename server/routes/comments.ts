import { Router } from 'express';
import { z } from 'zod';
import { commentInputSchema } from '../../shared/schemas/case';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { editComment, removeComment, setCommentHidden } from '../services/comments';
import { idParam } from './cases';

const hideSchema = z.object({ hidden: z.boolean({ error: 'hidden must be true or false' }) });

export function commentRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  const id = (raw: unknown) => parseInput(idParam, raw, 'The comment id');

  r.patch('/:id', async (req, res) => {
    const { body } = parseInput(commentInputSchema, req.body, 'The comment');
    res.json({ comment: await editComment(deps, req.user!, id(req.params.id), body) });
  });

  r.delete('/:id', async (req, res) => {
    await removeComment(deps, req.user!, id(req.params.id));
    res.status(204).end();
  });

  r.post('/:id/hide', async (req, res) => {
    const { hidden } = parseInput(hideSchema, req.body, 'The request');
    res.json({ comment: await setCommentHidden(deps, req.user!, id(req.params.id), hidden) });
  });

  return r;
}
