import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { attachmentFile } from '../services/attachments';
import { idParam } from './cases';

/** An ASCII fallback name for old clients and the exact UTF-8 name (RFC 6266 with RFC 8187 `filename*`). */
export function contentDisposition(type: 'inline' | 'attachment', name: string): string {
  const ascii = name.replace(/[^\w.-]/g, '_');
  const utf8 = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${type}; filename="${ascii}"; filename*=UTF-8''${utf8}`;
}

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
      res.setHeader('Content-Disposition', contentDisposition(f.kind === 'screenshot' ? 'inline' : 'attachment', f.originalName));
      res.sendFile(f.path, { headers: { 'Content-Type': f.contentType } }, (err) => err && next(err));
    });
  }
  return r;
}
