import { z } from 'zod';

/** Stable error codes the API returns; clients switch on these, never on messages. */
export const errorCodes = [
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'csrf_failed',
  'rate_limited',
  'gone',
  'unsupported_media_type',
  'internal',
  'unavailable',
] as const;

export const ErrorCodeSchema = z.enum(errorCodes);
export type ErrorCode = z.infer<typeof ErrorCodeSchema>;

/** The one error body every API failure carries. */
export const ErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    requestId: z.string().optional(),
  }),
});
export type ErrorBody = z.infer<typeof ErrorBodySchema>;

/** HTTP status for each error code. */
export const statusForCode: Record<ErrorCode, number> = {
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  csrf_failed: 403,
  rate_limited: 429,
  gone: 410,
  unsupported_media_type: 415,
  internal: 500,
  unavailable: 503,
};
