import { Router } from 'express';
import { changePasswordSchema, profileSchema } from '../../shared/schemas/auth';
import type { AppDeps } from '../deps';
import { requireAuth } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { changePassword, renameUser } from '../services/auth';

export function profileRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth);

  r.patch('/', async (req, res, next) => {
    const { name } = parseInput(profileSchema, req.body, 'The profile');
    const user = await renameUser(deps, req.user!.id, name);
    // keep the session's copy in step with the database
    req.login(user, { session: true, keepSessionInfo: true }, (err) => (err ? next(err) : res.json({ user })));
  });

  r.post('/password', async (req, res) => {
    await changePassword(deps, req.user!.id, parseInput(changePasswordSchema, req.body, 'The password change'), req.sessionID);
    res.json({ ok: true });
  });

  return r;
}
