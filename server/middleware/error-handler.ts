import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { isDatabaseUnavailable } from '../db/unavailable';
import { AppError, fieldsFromZod } from '../errors';

interface PgError {
  code?: string;
  constraint?: string;
  detail?: string;
}

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
  const e = err as PgError & { type?: string; status?: number };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'validation_failed', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (e?.type === 'entity.too.large') {
    res.status(400).json({ error: { code: 'validation_failed', message: 'The request body is too large.' } });
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
    req.log?.warn({ requestId, reason: (err as Error)?.message }, 'database unavailable');
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
  req.log?.error({ err, requestId }, 'unhandled error');
  res.status(500).json({
    error: { code: 'internal', message: 'Something went wrong on our side. Please try again.', requestId },
  });
};
