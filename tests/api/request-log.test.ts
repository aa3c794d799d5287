/** The request log keeps paths, never the one-time tokens of invitation and reset links. */
import { Writable } from 'node:stream';
import { pino } from 'pino';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { loggableUrl } from '../../apps/api/src/http/request-log.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

describe('request log', () => {
  test('should log the paths of invitation and reset links without their tokens', async () => {
    let output = '';
    const destination = new Writable({
      write(chunk, _enc, cb) {
        output += String(chunk);
        cb();
      },
    });
    const { app } = api.makeApp({}, { logger: pino({ level: 'info' }, destination) });
    const secrets = ['reset-token-1b0c9a7e3f5d', 'invite-token-77aa41c0e9d2', 'api-token-5e1f0b9c2a33', 'error-token-0c1d2e3f4a5b'];
    await supertest(app).get(`/reset-password?token=${secrets[0]}`);
    await supertest(app).get(`/accept-invite?token=${secrets[1]}&from=mail`);
    await supertest(app).post(`/api/auth/reset-password?token=${secrets[2]}`).send({ token: secrets[2], password: 'a-long-new-password' });
    await supertest(app).get(`/api/fields/not-a-number?token=${secrets[3]}`);

    const lines = output.trim().split('\n').map((l) => JSON.parse(l) as { req?: { url: string } });
    const urls = lines.map((l) => l.req?.url).filter(Boolean);
    expect(urls).toEqual(
      expect.arrayContaining(['/reset-password?token=[redacted]', '/accept-invite?token=[redacted]&from=mail', '/api/auth/reset-password?token=[redacted]']),
    );
    for (const secret of secrets) expect(output).not.toContain(secret);
  });

  test('should keep harmless query values and plain paths as they are', () => {
    expect(loggableUrl('/api/records?from=2026-05-01&to=2026-05-31')).toBe('/api/records?from=2026-05-01&to=2026-05-31');
    expect(loggableUrl('/api/fields')).toBe('/api/fields');
    expect(loggableUrl('/x?Token=abc&password=p&api_key=k')).toBe('/x?Token=[redacted]&password=[redacted]&api_key=[redacted]');
  });
});
