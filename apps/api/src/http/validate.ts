/** Parses a request part with a domain zod schema; a failure becomes a 400 with per-field issues. */
import { errors } from '@swardwise/domain';
import type { z } from 'zod';
import { issuesOf } from './errors.ts';

export function parse<S extends z.ZodType>(schema: S, value: unknown, part: 'body' | 'query' | 'params'): z.infer<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) {
    const issues = issuesOf(result.error, part);
    const first = issues[0];
    throw errors.invalid(first ? `${first.path}: ${first.message}` : `The ${part} is not valid`, issues);
  }
  return result.data;
}
