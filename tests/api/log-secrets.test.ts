/**
 * No secret in logs or answers: the sign-in paths (right and wrong passwords, a password
 * change, a reset, an invitation) and error answers leave no password, hash, session secret or
 * cookie in the server log or in what the API answers. The log of the whole API test run is
 * scanned the same way when the run ends (support/log-scan.ts).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { useTestApi } from '../support/app.ts';
import { PASSWORD } from '../support/fixture.ts';
import { findSecrets, SECRETS } from '../support/log-scan.ts';

const api = useTestApi();

const leaks = (text: string) => SECRETS.filter(({ pattern }) => pattern.test(text)).map(({ what }) => what);

describe('secrets', () => {
  test('should find a planted secret (the scan can fail)', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-logscan-'));
    try {
      fs.writeFileSync(path.join(dir, 'a.log'), `{"msg":"ok"}\n{"msg":"user","hash":"$argon2id$v=19$m=19456,t=2,p=1$abc"}\n{"req":{"headers":{"cookie":"swardwise.sid=s%3Aabcdefghijklmnopqrstuvwxyz.sig"}}}\n`);
      const found = findSecrets(dir);
      expect(found.map((f) => f.split(': ')[1])).toEqual(['a password hash', 'a session cookie', 'a cookie header']);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  test('should keep passwords, hashes, the secret and cookies out of the log and the answers of the sign-in paths', async () => {
    const answers: string[] = [];
    const keep = (res: supertest.Response) => {
      answers.push(JSON.stringify(res.body), JSON.stringify(res.headers['content-type'] ?? ''));
      return res;
    };
    const anonymous = supertest(api.app);
    keep(await anonymous.post('/api/auth/sign-in').send({ email: api.fixture.users.head.email, password: `${PASSWORD}-wrong` }));
    keep(await anonymous.post('/api/auth/sign-in').send({ email: 'nobody@test.example', password: PASSWORD }));
    const admin = await api.signIn('admin');
    keep(await admin.get('/api/users'));
    keep(await admin.get('/api/auth/me'));
    keep(await admin.post('/api/users').send({ email: 'newcomer@test.example', name: 'New Comer', role: 'head' }));
    keep(await anonymous.post('/api/auth/forgot-password').send({ email: api.fixture.users.head.email }));
    keep(await anonymous.post('/api/auth/reset-password').send({ token: 'x'.repeat(40), password: `${PASSWORD}-new` }));
    keep(await anonymous.post('/api/auth/accept-invite').send({ token: 'y'.repeat(40), password: `${PASSWORD}-new` }));
    const head = await api.signIn('head');
    const me = keep(await head.get('/api/auth/me'));
    keep(await head.patch('/api/auth/me').send({ version: me.body.user?.version ?? 1, password: `${PASSWORD}-changed`, currentPassword: PASSWORD }));
    keep(await head.patch('/api/auth/me').send({ version: 1, password: 12 }));
    keep(await head.get('/api/nothing-here'));
    await api.background.idle();

    const inAnswers = answers.flatMap(leaks);
    expect(inAnswers).toEqual([]);
    expect(answers.join('\n')).not.toContain(PASSWORD);
    expect(findSecrets()).toEqual([]);
  });
});
