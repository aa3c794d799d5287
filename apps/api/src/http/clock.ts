/** Puts the department clock on each API request, its stored time zone read first. */
import type { RequestHandler } from 'express';
import type { DepartmentClock } from '../services/clock.ts';

export function withClock(clock: DepartmentClock): RequestHandler {
  return (req, _res, next) => {
    clock.ready().then(() => {
      req.clock = clock;
      next();
    }, next);
  };
}
