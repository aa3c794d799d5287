/**
 * Every API test writes its server log to tests/.artifacts/api-logs (support/app.ts). After the
 * whole run of the API tests this reads all of it and fails the run when a password, a
 * password hash, the session secret or a session cookie shows up in a log line.
 */
import fs from 'node:fs';
import path from 'node:path';
import { PASSWORD } from './fixture.ts';

export const API_LOG_DIR = path.resolve(import.meta.dirname, '../.artifacts/api-logs');
/** The session secret every test API signs its cookies with. */
export const TEST_SESSION_SECRET = 'test-secret';

/** What must never be logged: the fixture password, argon2 hashes, the secret, cookie values. */
export const SECRETS: { what: string; pattern: RegExp }[] = [
  { what: 'the fixture password', pattern: new RegExp(PASSWORD.replace(/[-]/g, '\\-')) },
  { what: 'a password hash', pattern: /\$argon2(id|i|d)\$/ },
  { what: 'the session secret', pattern: new RegExp(TEST_SESSION_SECRET) },
  { what: 'a session cookie', pattern: /swardwise\.sid=|s%3A[A-Za-z0-9_-]{20,}\./ },
  { what: 'a password or hash field', pattern: /"(password|passwordHash|password_hash|newPassword|currentPassword)"\s*:/i },
  { what: 'a cookie header', pattern: /"(cookie|set-cookie)"\s*:/i },
];

/** Every line of the logs that carries a secret, as `file:line: what`. */
export function findSecrets(dir = API_LOG_DIR): string[] {
  if (!fs.existsSync(dir)) return [];
  const found: string[] = [];
  for (const name of fs.readdirSync(dir)) {
    const lines = fs.readFileSync(path.join(dir, name), 'utf8').split('\n');
    lines.forEach((line, i) => {
      for (const { what, pattern } of SECRETS) if (pattern.test(line)) found.push(`${name}:${i + 1}: ${what}: ${line.slice(0, 200)}`);
    });
  }
  return found;
}

/** vitest global setup of the api project: an empty log folder before, the scan after. */
export default function setup(): () => void {
  fs.rmSync(API_LOG_DIR, { recursive: true, force: true });
  fs.mkdirSync(API_LOG_DIR, { recursive: true });
  return () => {
    const found = findSecrets();
    const lines = fs.readdirSync(API_LOG_DIR).reduce((n, f) => n + fs.readFileSync(path.join(API_LOG_DIR, f), 'utf8').split('\n').length - 1, 0);
    if (found.length) {
      // vitest reports an error thrown here but still exits 0: fail the run through the exit code.
      console.error(`Secrets in the API log of this test run (${API_LOG_DIR}):\n${found.slice(0, 50).join('\n')}`);
      process.exitCode = 1;
      return;
    }
    console.log(`API log of the run: ${lines} lines, no password, hash, session secret or cookie in them`);
  };
}
