import { once } from 'node:events';
import { createReadStream } from 'node:fs';
import { rm, stat } from 'node:fs/promises';
import { pipeline } from 'node:stream/promises';
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { casebookExportQuerySchema } from '../../shared/schemas/casebook-archive';
import type { AppDeps } from '../deps';
import { AppError } from '../errors';
import { requireRole } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { exportCasebook } from '../services/casebook-export';
import { importCasebook } from '../services/casebook-import';
import { storagePaths } from '../storage';

/** A casebook archive holds every attachment, so it may be much larger than one upload. */
export const ARCHIVE_LIMIT_BYTES = 500 * 1024 * 1024;

function archiveUpload(deps: AppDeps): RequestHandler {
  const upload = multer({ dest: storagePaths(deps.config).incomingDir, limits: { fileSize: ARCHIVE_LIMIT_BYTES, files: 1, fields: 5 } }).single('file');
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError('too_large', `Casebook archives are limited to ${ARCHIVE_LIMIT_BYTES / 1024 / 1024} MB`));
        return next(new AppError('invalid_input', `Upload refused: ${err.message}`));
      }
      if (err) return next(err);
      if (!req.file) return next(new AppError('invalid_input', 'Send the archive in a multipart field named "file"'));
      next();
    });
}

/** Admins move the casebook in and out: `GET /export` (zip), `POST /import` (multipart `file`). */
export function casebookRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/export', async (req, res) => {
    const filters = parseInput(casebookExportQuerySchema, req.query, 'The export filters');
    const out = await exportCasebook(deps, req.user!, filters);
    try {
      res.setHeader('Content-Type', 'application/zip');
      res.setHeader('Content-Disposition', `attachment; filename="${out.filename}"`);
      res.setHeader('Content-Length', String((await stat(out.file)).size));
      res.setHeader('X-Casebook-Cases', String(out.cases));
      res.setHeader('Cache-Control', 'no-store');
      // from disk a chunk at a time, at the pace the client reads; the name goes as soon as it is open
      const zip = createReadStream(out.file);
      await once(zip, 'open');
      await rm(out.file, { force: true });
      await pipeline(zip, res).catch((err: unknown) => {
        // a client that goes away mid-download is no error of ours
        if (!res.headersSent) throw err;
      });
    } finally {
      await rm(out.file, { force: true });
    }
  });

  r.post('/import', archiveUpload(deps), async (req, res) => {
    const file = req.file!;
    try {
      const dryRun = /^(1|true|yes)$/i.test(String(req.query.dryRun ?? ''));
      const report = await importCasebook(deps, req.user!, file.path, { dryRun });
      res.json({ report });
    } finally {
      await rm(file.path, { force: true });
    }
  });

  return r;
}
