import { inviteUserSchema, signInSchema } from '@swardwise/domain';
import type { FormItemRule } from 'element-plus';
import { describe, expect, test } from 'vitest';
import { z } from 'zod';
import { zodRules } from './zodRules.ts';

/** Runs one Element Plus rule the way async-validator does and returns its message, or null. */
function check(rules: FormItemRule[] | undefined, value: unknown): Promise<string | null> {
  const rule = rules?.[0];
  if (!rule?.validator) throw new Error('no validator');
  return new Promise((resolve) => {
    void rule.validator!(rule, value, (error?: string | Error) => resolve(error ? (error instanceof Error ? error.message : error) : null), {}, {});
  });
}

describe('zodRules', () => {
  test('should give one rule per field of the schema', () => {
    expect(Object.keys(zodRules(signInSchema))).toEqual(['email', 'password']);
  });

  test('should report the schema’s own message for a bad value', async () => {
    const rules = zodRules(signInSchema);
    expect(await check(rules.email, 'not-an-address')).toBe('enter a valid e-mail address');
    expect(await check(rules.password, '')).toBe('enter your password');
  });

  test('should pass a good value', async () => {
    const rules = zodRules(signInSchema);
    expect(await check(rules.email, 'foreman@swardwise.example')).toBeNull();
    expect(await check(rules.password, 'x')).toBeNull();
  });

  test('should mark fields the schema requires and leave optional ones unmarked', () => {
    const rules = zodRules(z.object({ name: z.string().min(1), note: z.string().optional() }));
    expect(rules.name?.[0]?.required).toBe(true);
    expect(rules.note?.[0]?.required).toBe(false);
  });

  test('should report a cross-field refinement on the field it names when given the model', async () => {
    const model = { email: 'a@b.example', name: 'Ann Lee', role: 'foreman', districtId: null as number | null };
    const rules = zodRules(inviteUserSchema, { model: () => model });
    expect(await check(rules.districtId, null)).toBe('a foreman must be bound to a district');
    expect(await check(rules.name, 'Ann Lee')).toBeNull();
    model.districtId = 2;
    expect(await check(rules.districtId, 2)).toBeNull();
  });

  test('should use the given trigger', () => {
    expect(zodRules(signInSchema, { trigger: 'change' }).email?.[0]?.trigger).toBe('change');
    expect(zodRules(signInSchema).email?.[0]?.trigger).toBe('blur');
  });
});
