/** Parses a request part with a domain zod schema; a failure becomes a 400 with per-field issues. */
import { errors } from '@swardwise/domain';
import type { z } from 'zod';
import { issuesOf } from './errors.ts';

/**
 * Below this magnitude a number reads as zero. No measure in this product is that small, and
 * the database's single-precision columns refuse what they cannot hold (below about 1.2e-38)
 * instead of rounding it, which would turn a hostile 1e-300 into a server error.
 */
const NEGLIGIBLE = 1e-12;

/** The value with negligible numbers as zero, at any depth (a copy; nesting is bounded before this). */
export function withoutNegligible(value: unknown): unknown {
  if (typeof value === 'number') return value !== 0 && Math.abs(value) < NEGLIGIBLE ? 0 : value;
  if (Array.isArray(value)) return value.map(withoutNegligible);
  if (value && typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, withoutNegligible(v)]));
  }
  return value;
}

export function parse<S extends z.ZodType>(schema: S, value: unknown, part: 'body' | 'query' | 'params'): z.infer<S> {
  const result = schema.safeParse(withoutNegligible(value ?? {}));
  if (!result.success) {
    const issues = issuesOf(result.error, part);
    const first = issues[0];
    throw errors.invalid(first ? `${first.path}: ${first.message}` : `The ${part} is not valid`, issues);
  }
  return result.data;
}
