import type { Request } from 'express';
import { parseIdText } from '@shared/schemas/common';
import { AppError } from '../errors';

/** An id from the address (`/plots/:plotId`), or 400 naming the parameter. */
export function idParam(req: Request, name: string): number {
  const id = parseIdText(req.params[name]);
  if (id === null) throw new AppError('validation_failed', 'Invalid id in the address.', { [name]: 'Must be a whole number from 1 to 2147483647' });
  return id;
}
