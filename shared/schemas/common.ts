import { z } from 'zod';

/** A page of a list: every list endpoint answers with this shape. */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), page: z.number().int(), total: z.number().int() });
}

export const IdParamSchema = z.object({ id: z.coerce.number().int().positive() });

export const EmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'E-mail address is too long')
  .pipe(z.email('Enter a valid e-mail address'));

export const PasswordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');
