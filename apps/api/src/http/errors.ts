/** One error shape on every answer: `{ error: { code, message, details } }`. */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, DomainError, appError, errors } from '@swardwise/domain';
import { ZodError } from 'zod';

export const noRoute: RequestHandler = (req, _res, next) => {
  next(errors.noRoute(req.method, req.path));
};

/** Turns zod issues into `{ path, message }` pairs with the part of the request prefixed. */
export function issuesOf(error: ZodError, part: string) {
  return error.issues.map((issue) => ({
    path: [part, ...issue.path.map(String)].join('.'),
    message: issue.message,
  }));
}

interface BodyParserError extends Error {
  type?: string;
  status?: number;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  void _next;
  let error: AppError;
  if (err instanceof AppError) {
    error = err;
  } else if (err instanceof DomainError) {
    error = errors.fromDomain(err);
  } else if (err instanceof ZodError) {
    error = errors.invalid('The request is not valid', issuesOf(err, 'body'));
  } else if ((err as BodyParserError).type === 'entity.parse.failed') {
    error = appError('request/malformed_json', 'The request body is not valid JSON');
  } else if ((err as BodyParserError).type === 'entity.too.large') {
    error = appError('request/too_large', 'The request body is too large');
  } else if (typeof (err as BodyParserError).status === 'number' && (err as BodyParserError).status! < 500) {
    const status = (err as BodyParserError).status!;
    error = errors.refusedRequest(status, (err as Error).message);
  } else {
    req.log?.error({ err }, 'unhandled error');
    error = errors.internal();
  }
  closeIfUnread(req, res);
  res.status(error.status).json(error.toBody());
};

/**
 * A request refused before its body was read (403 ahead of an upload, 413 on the declared
 * size) has the connection closed after the answer, instead of Node reading and discarding
 * the rest of the body to keep the connection alive for another request.
 */
function closeIfUnread(req: Parameters<ErrorRequestHandler>[1], res: Parameters<ErrorRequestHandler>[2]): void {
  const hasBody = Number(req.get('content-length') ?? 0) > 0 || req.get('transfer-encoding') !== undefined;
  if (hasBody && !req.complete) res.setHeader('Connection', 'close');
}
