import type { z } from 'zod';
import { statusForCode, type ErrorCode } from '@shared/errors';

/** An error a service throws on purpose: it reaches the client with its code and message. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.status = statusForCode[code];
  }
}

/** Turns zod issues into the `fields` map forms show beside each input. */
export function fieldsFromZod(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...issue.path, key].join('.')] = 'Unknown field';
      continue;
    }
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Parses input with a schema, throwing a 400 validation error naming each bad field. */
export function parseInput<T extends z.ZodType>(schema: T, input: unknown): z.infer<T> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw new AppError('validation_failed', 'Some fields need attention.', fieldsFromZod(result.error));
  }
  return result.data;
}

export const notFound = (what = 'That') => new AppError('not_found', `${what} was not found.`);
export const forbidden = (message = 'You are not allowed to do that.') => new AppError('forbidden', message);
