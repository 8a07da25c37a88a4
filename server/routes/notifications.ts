import { Router } from 'express';
import { NOTIFICATION_KINDS, notificationPrefsSchema } from '../../shared/schemas/review';
import { prefsOf, setPref } from '../db/repositories/notification-prefs';
import { watchesOfUser } from '../db/repositories/watches';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';

/** The signed-in user's mail preferences (each kind: instant, digest or off) and watches. */
export function notificationRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);
  const current = async (userId: number) => {
    const stored = await prefsOf(deps.db, userId);
    return Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, stored[k] ?? (k === 'lessons' ? 'digest' : 'instant')]));
  };
  r.get('/notifications', async (req, res) => {
    res.json({ prefs: await current(req.user!.id) });
  });
  r.put('/notifications', async (req, res) => {
    const prefs = parseInput(notificationPrefsSchema, req.body?.prefs, 'The preferences');
    for (const [kind, mode] of Object.entries(prefs)) await setPref(deps.db, req.user!.id, kind, mode!);
    res.json({ prefs: await current(req.user!.id) });
  });
  r.get('/watches', async (req, res) => {
    const rows = await watchesOfUser(deps.db, req.user!.id);
    res.json({ cases: rows.filter((w) => w.case_id).map((w) => w.case_id), tags: rows.filter((w) => w.tag).map((w) => w.tag) });
  });
  return r;
}
