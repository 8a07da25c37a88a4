import { Router } from 'express';
import { backupFileName, backupRefusal, writeBackup } from '../backup/backup';
import type { AppDeps } from '../deps';
import { AppError } from '../errors';
import { requireRole } from '../middleware/require-auth';

/**
 * `GET /api/admin/backup`: the whole installation (database, uploads, session secret) as one
 * zip, taken online. Not the casebook export: this one restores everything, for this team only.
 */
export function backupRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (req, res) => {
    const refusal = backupRefusal(deps.db);
    if (refusal) throw new AppError('conflict', refusal);
    res.setHeader('Content-Type', 'application/zip');
    res.setHeader('Content-Disposition', `attachment; filename="${backupFileName()}"`);
    res.setHeader('Cache-Control', 'no-store');
    try {
      await writeBackup(deps.db, { dataDir: deps.config.dataDir, uploadsDir: deps.config.uploadsDir }, res);
    } catch (err) {
      // the headers are gone already: cut the download so it cannot pass for a whole backup
      req.log.error({ err }, 'backup failed');
      res.destroy(err as Error);
    }
  });
  return r;
}
