import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { requireRole } from '../middleware/require-auth';
import { parseInput } from '../middleware/validate';
import { reviewQueue, waitingCount } from '../services/review-queue';

const queueQuery = z.object({
  cause: z.string().trim().max(40).optional(),
  attention: z.enum(['1', '0', 'true', 'false']).optional(),
});

export function reviewRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireRole('moderator'));
  r.get('/queue', async (req, res) => {
    const q = parseInput(queueQuery, req.query, 'The queue filter');
    const { entries, waiting } = await reviewQueue(deps, req.user!, { cause: q.cause, attention: q.attention === '1' || q.attention === 'true' });
    res.json({ queue: entries, waiting });
  });
  r.get('/count', async (_req, res) => {
    res.json({ waiting: await waitingCount(deps) });
  });
  return r;
}
