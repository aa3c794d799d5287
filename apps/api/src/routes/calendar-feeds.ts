/** Private calendar feeds: made and revoked signed in; read by a calendar program with the secret alone. */
import { Router } from 'express';
import { calendarTokenParamsSchema, createCalendarFeedSchema, idParamSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { parse } from '../http/validate.ts';
import { calendarFeedIcs, createCalendarFeed, listCalendarFeeds, revokeCalendarFeed } from '../services/calendar-feeds.ts';

export function calendarFeedsRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await listCalendarFeeds(ctxOf(db, req)));
  });

  router.post('/', async (req, res) => {
    // Roles that may have no feed are refused before the body is read.
    const ctx = ctxAllowed(db, req, 'create', 'CalendarFeed');
    res.status(201).json(await createCalendarFeed(ctx, parse(createCalendarFeedSchema, req.body ?? {}, 'body'), config.publicUrl));
  });

  router.delete('/:id', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id } = parse(idParamSchema, req.params, 'params');
    await revokeCalendarFeed(ctx, id);
    res.status(204).end();
  });

  return router;
}

/** No sign-in: the secret in the address is the only key. */
export function calendarPublicRouter({ db, clock }: AppDeps): Router {
  const router = Router();

  router.get('/:token.ics', async (req, res) => {
    const { token } = parse(calendarTokenParamsSchema, req.params, 'params');
    const ics = await calendarFeedIcs(db, clock, token);
    res.set('Cache-Control', 'private, no-cache');
    res.set('X-Robots-Tag', 'noindex');
    res.type('text/calendar; charset=utf-8').send(ics);
  });

  return router;
}
