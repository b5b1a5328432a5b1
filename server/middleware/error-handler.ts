import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorCode } from '@shared/errors';
import { isDatabaseUnavailable } from '../db/unavailable';
import { AppError, fieldsFromZod } from '../errors';
import { requestFields } from './request-log';

interface PgError {
  code?: string;
  constraint?: string;
  detail?: string;
}

// body-parser's error types (its README, "Errors"), worded for people.
const clientErrorMessages: Record<string, string> = {
  'charset.unsupported': 'The request body must be JSON in UTF-8.',
  'encoding.unsupported': 'The request body uses a content encoding the server does not read (use gzip, deflate, br or none).',
  'request.aborted': 'The request was cut off before its body arrived.',
  'request.size.invalid': 'The request body is not as long as its Content-Length says.',
  'parameters.too.many': 'The request body has too many parameters.',
};

const codeForStatus: Partial<Record<number, ErrorCode>> = {
  400: 'validation_failed',
  401: 'unauthenticated',
  403: 'forbidden',
  404: 'not_found',
  409: 'conflict',
  410: 'gone',
  415: 'unsupported_media_type',
  429: 'rate_limited',
};

/** Answers every unknown /api path with the standard 404 body. */
export const apiNotFound: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: 'No such API route.' } });
};

/** Maps thrown errors to the one error body; a 500 never carries a stack or SQL. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const requestId = String(req.id ?? '');
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, fields: err.fields } });
    return;
  }
  if (err instanceof ZodError) {
    res.status(400).json({
      error: { code: 'validation_failed', message: 'Some fields need attention.', fields: fieldsFromZod(err) },
    });
    return;
  }
  const e = err as PgError & { type?: string; status?: unknown; statusCode?: unknown };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'validation_failed', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (e?.type === 'entity.too.large') {
    res.status(400).json({ error: { code: 'validation_failed', message: 'The request body is too large.' } });
    return;
  }
  // Errors that already carry a 4xx (the body parser's, the router's for a path it cannot decode) keep it.
  const status = typeof e?.status === 'number' ? e.status : typeof e?.statusCode === 'number' ? e.statusCode : 0;
  if (status >= 400 && status < 500) {
    const message =
      (e.type && clientErrorMessages[e.type]) ??
      (err instanceof URIError ? 'The address holds a malformed percent-encoding.' : 'The request could not be read.');
    res.status(status).json({ error: { code: codeForStatus[status] ?? 'validation_failed', message } });
    return;
  }
  if (e?.code === '23505') {
    res.status(409).json({ error: { code: 'conflict', message: 'That already exists.' } });
    return;
  }
  if (e?.code === '23503') {
    res.status(400).json({ error: { code: 'validation_failed', message: 'A referenced record does not exist.' } });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    req.log?.warn({ requestId, req: requestFields(req), reason: (err as Error)?.message }, 'database unavailable');
    res.setHeader('Retry-After', '5');
    res.status(503).json({
      error: {
        code: 'unavailable',
        message: 'The database is not reachable just now. Please try again in a few seconds.',
        requestId,
      },
    });
    return;
  }
  req.log?.error({ err, requestId, req: requestFields(req) }, 'unhandled error');
  res.status(500).json({
    error: { code: 'internal', message: 'Something went wrong on our side. Please try again.', requestId },
  });
};
