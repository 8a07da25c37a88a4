import { rm } from 'node:fs/promises';
import { Router } from 'express';
import { channelField } from '../captures/analyze-file';
import { captureWorkers } from '../captures/capture-pool';
import type { AppDeps } from '../deps';
import { AppError } from '../errors';
import { requireAuth } from '../middleware/require-auth';
import { singleUpload } from '../middleware/upload';

/**
 * Measures a capture without storing it (the Diagnose screen and the case form's "fill from
 * capture"). Optional multipart field `channel`: 1-based among the signal columns, or a name.
 */
export function captureRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  r.post('/analyze', singleUpload(deps.config), async (req, res) => {
    try {
      const field = channelField((req.body as Record<string, unknown> | undefined)?.channel);
      if ('error' in field) throw new AppError('invalid_input', field.error, [{ path: 'channel', message: field.error }]);
      const result = await captureWorkers.analyze(req.file!.path, field);
      if (!result.ok) throw new AppError('invalid_input', `The capture cannot be read: ${result.message}`);
      res.json(result.analysis);
    } finally {
      await rm(req.file!.path, { force: true });
    }
  });
  return r;
}
