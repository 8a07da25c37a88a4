import { Router } from 'express';
import { tagSchema } from '../../shared/schemas/case';
import { tagMergeSchema, tagRenameSchema, tagRetireSchema, tagSynonymsSchema } from '../../shared/schemas/tags';
import { unwatchTag, watchTag } from '../db/repositories/watches';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { listTags, mergeTag, renameTag, setTagRetired, setTagSynonyms } from '../services/tags';

export function tagRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  const tag = (raw: unknown) => parseInput(tagSchema, raw, 'The tag');

  r.get('/', async (req, res) => {
    res.json({ tags: await listTags(deps, req.user!) });
  });
  r.post('/:tag/rename', async (req, res) => {
    await renameTag(deps, req.user!, tag(req.params.tag), parseInput(tagRenameSchema, req.body, 'The rename').to);
    res.json({ tags: await listTags(deps, req.user!) });
  });
  r.post('/:tag/merge', async (req, res) => {
    await mergeTag(deps, req.user!, tag(req.params.tag), parseInput(tagMergeSchema, req.body, 'The merge').into);
    res.json({ tags: await listTags(deps, req.user!) });
  });
  r.put('/:tag/synonyms', async (req, res) => {
    await setTagSynonyms(deps, req.user!, tag(req.params.tag), parseInput(tagSynonymsSchema, req.body, 'The synonyms').synonyms);
    res.json({ tags: await listTags(deps, req.user!) });
  });
  r.post('/:tag/retire', async (req, res) => {
    await setTagRetired(deps, req.user!, tag(req.params.tag), parseInput(tagRetireSchema, req.body, 'The request').retired);
    res.json({ tags: await listTags(deps, req.user!) });
  });
  r.post('/:tag/watch', async (req, res) => {
    await watchTag(deps.db, req.user!.id, tag(req.params.tag));
    res.json({ watching: true });
  });
  r.delete('/:tag/watch', async (req, res) => {
    await unwatchTag(deps.db, req.user!.id, tag(req.params.tag));
    res.json({ watching: false });
  });
  return r;
}
