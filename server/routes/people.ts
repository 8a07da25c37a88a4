import { Router } from 'express';
import { inviteSchema, updatePersonSchema } from '../../shared/schemas/auth';
import type { AppDeps } from '../deps';
import { createRateLimits } from '../middleware/rate-limits';
import { requireRole } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { invitePerson, listPeople, updatePerson } from '../services/people';
import { idParam } from './cases';

export function peopleRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async (_req, res) => {
    res.json(await listPeople(deps));
  });

  r.post('/invitations', createRateLimits().invitations, async (req, res) => {
    const invitation = await invitePerson(deps, req.user!, parseInput(inviteSchema, req.body, 'The invitation'));
    res.status(201).json({ invitation });
  });

  r.patch('/:id', async (req, res) => {
    const id = parseInput(idParam, req.params.id, 'The person id');
    const person = await updatePerson(deps, req.user!, id, parseInput(updatePersonSchema, req.body, 'The change'));
    res.json({ person });
  });

  return r;
}
