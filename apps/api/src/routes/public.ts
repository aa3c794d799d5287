/** What anyone may read without signing in: the status board of the fields. */
import { Router } from 'express';
import type { AppDeps } from '../app-deps.ts';
import { statusBoard } from '../services/status-board.ts';

/** Short enough that a closure for lightning reaches a phone within a minute. */
export const STATUS_MAX_AGE_S = 30;

export function publicRouter({ db, clock }: AppDeps): Router {
  const router = Router();

  router.get('/status', async (req, res) => {
    const board = await statusBoard(db, clock.now());
    res.set('Cache-Control', `public, max-age=${STATUS_MAX_AGE_S}, must-revalidate`);
    res.set('ETag', board.etag);
    const asked = req.get('If-None-Match');
    if (asked && asked.split(',').some((tag) => tag.trim().replace(/^W\//, '') === board.etag)) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(board.json);
  });

  return router;
}
