import { describe, expect, test, vi } from 'vitest';
import type { Request, RequestHandler, Response } from 'express';
import { AppError, errors, idParamSchema, type Actor, type SessionUser } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import type { Clock } from '../services/clock.ts';
import { photoFileHandler, photoParamsSchema, photoUploadHandlers } from './photo-routes.ts';

const user: SessionUser = { id: 7, email: 'l@test.example', name: 'Ash Mower', role: 'crew', districtId: 2, crewId: 3, siteIds: [], units: 'metric', version: 1 };
const actor: Actor = { id: 7, role: 'crew', districtId: 2, crewId: 3, siteIds: [] };
const db = {} as Db;

function request(params: Record<string, string>, extra: { body?: unknown; file?: { buffer: Buffer } } = {}) {
  return { actor, user, clock: {} as Clock, params, body: extra.body, file: extra.file } as unknown as Request;
}

function response() {
  const sent: { status?: number; json?: unknown; headers: Record<string, string>; type?: string; file?: string } = { headers: {} };
  const res = {
    status: (n: number) => ((sent.status = n), res),
    json: (v: unknown) => ((sent.json = v), res),
    setHeader: (k: string, v: string) => ((sent.headers[k] = v), res),
    type: (t: string) => ((sent.type = t), res),
    sendFile: (f: string) => void (sent.file = f),
  };
  return { res: res as unknown as Response, sent };
}

async function run(handler: RequestHandler, req: Request, res: Response) {
  const next = vi.fn();
  await handler(req, res, next);
  return next;
}

describe('photoUploadHandlers', () => {
  const store = vi.fn(async (_ctx: unknown, _params: { id: number }, upload: { clientRef?: string | undefined }) => ({ photo: { id: 1 }, duplicate: upload.clientRef === 'retried-ref' }));
  const receive: RequestHandler = (_req, _res, next) => next();

  test('should refuse a caller before the upload is read, with the parsed params', async () => {
    const allowed = vi.fn(async () => {
      throw errors.forbidden('not yours');
    });
    const [check, read] = photoUploadHandlers(db, { params: idParamSchema, allowed, receive, code: 'work_photo', store });
    expect(read).toBe(receive);
    const { res } = response();
    await expect(run(check!, request({ id: '12' }), res)).rejects.toBeInstanceOf(AppError);
    expect(allowed).toHaveBeenCalledWith(expect.objectContaining({ actor }), { id: 12 });
  });

  test('should answer 201 for a new photo, 200 for a retried one, and name a missing file by the route’s code', async () => {
    const [check, , save] = photoUploadHandlers(db, { params: idParamSchema, allowed: async () => undefined, receive, code: 'request_photo', store });
    const next = await run(check!, request({ id: '12' }), response().res);
    expect(next).toHaveBeenCalledWith();

    const fresh = response();
    await run(save!, request({ id: '12' }, { body: {}, file: { buffer: Buffer.from('x') } }), fresh.res);
    expect(fresh.sent.status).toBe(201);

    const again = response();
    await run(save!, request({ id: '12' }, { body: { clientRef: 'retried-ref' }, file: { buffer: Buffer.from('x') } }), again.res);
    expect(again.sent.status).toBe(200);
    expect(store).toHaveBeenLastCalledWith(expect.anything(), { id: 12 }, { buffer: Buffer.from('x'), clientRef: 'retried-ref' });

    await expect(run(save!, request({ id: '12' }, { body: {} }), response().res)).rejects.toMatchObject({ code: 'request_photo/no_file' });
  });
});

describe('photoFileHandler', () => {
  test('should send the file the service finds, cached privately for a day', async () => {
    const find = vi.fn(async () => ({ file: '/uploads/wo12-a.jpg', mime: 'image/jpeg' }));
    const { res, sent } = response();
    await run(photoFileHandler(db, photoParamsSchema, find), request({ id: '12', photoId: '4' }), res);
    expect(find).toHaveBeenCalledWith(expect.objectContaining({ actor }), { id: 12, photoId: 4 });
    expect(sent).toMatchObject({ headers: { 'Cache-Control': 'private, max-age=86400' }, type: 'image/jpeg', file: '/uploads/wo12-a.jpg' });
  });
});
