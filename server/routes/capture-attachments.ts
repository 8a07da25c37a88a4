import { Router } from 'express';
import { captureAttachmentPatchSchema } from '../../shared/schemas/capture-attachment';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { updateCaptureAttachment } from '../services/capture-attachments';
import { idParam } from './cases';

/** `PATCH /api/attachments/:id/capture` `{channel?, role?}` → `{attachment}`. */
export function captureAttachmentRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  r.patch('/:id/capture', async (req, res) => {
    const id = parseInput(idParam, req.params.id, 'The attachment id');
    const patch = parseInput(captureAttachmentPatchSchema, req.body, 'The capture change');
    res.json({ attachment: await updateCaptureAttachment(deps, req.user!, id, patch) });
  });
  return r;
}
