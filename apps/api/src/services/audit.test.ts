import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { redact } from './audit.ts';

const src = path.resolve(import.meta.dirname, '..');

function sourceFiles(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'migrations') continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) sourceFiles(full, out);
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.test.ts')) out.push(full);
  }
  return out;
}

describe('audit', () => {
  test('should drop passwords, tokens, secrets and their hashes at any depth', () => {
    const row = {
      id: 3,
      email: 'a@test.example',
      password: 'hunter2-hunter2',
      passwordHash: '$argon2id$…',
      token: 'abc',
      tokenHash: 'def',
      clientSecret: 's',
      api_key: 'k',
      nested: { resetToken: 't', keep: 1, list: [{ password: 'p', name: 'n' }] },
      passwordReset: true,
      code: 'north',
      at: new Date('2026-06-01T10:00:00Z'),
    };
    expect(redact(row)).toEqual({
      id: 3,
      email: 'a@test.example',
      nested: { keep: 1, list: [{ name: 'n' }] },
      passwordReset: true,
      code: 'north',
      at: '2026-06-01T10:00:00.000Z',
    });
    expect(redact(null)).toBeNull();
  });

  test('should write audit rows only through writeAudit in services/audit.ts', () => {
    const files = sourceFiles(src);
    expect(files.length).toBeGreaterThan(50);
    const writers = files.filter((f) => /insert\(\s*auditLog\s*\)|insert\s+into\s+\$\{\s*auditLog\s*\}|insert\s+into\s+"?audit_log"?/i.test(fs.readFileSync(f, 'utf8')));
    expect(writers.map((f) => path.relative(src, f))).toEqual(['services/audit.ts']);
  });
});
