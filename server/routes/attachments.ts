import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { attachmentFile } from '../services/attachments';
import { idParam } from './cases';

/** Attachment bytes, only to callers who may see the case; the type is ours, never the uploader's. */
export function attachmentRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  for (const variant of ['file', 'thumbnail'] as const) {
    r.get(`/:id/${variant}`, async (req, res, next) => {
      const f = await attachmentFile(deps, req.user!, parseInput(idParam, req.params.id, 'The attachment id'), variant);
      res.setHeader('Content-Type', f.contentType);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('Cache-Control', 'private, max-age=3600');
      // screenshots show in the page; captures download rather than render as text
      res.setHeader('Content-Disposition', `${f.kind === 'screenshot' ? 'inline' : 'attachment'}; filename="${f.originalName.replace(/[^\w.-]/g, '_')}"`);
      res.sendFile(f.path, { headers: { 'Content-Type': f.contentType } }, (err) => err && next(err));
    });
  }
  return r;
}
