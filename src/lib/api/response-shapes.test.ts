import fs from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ErrorBodySchema } from '@shared/errors';
import { MyFeesListSchema } from '@shared/schemas/fees';
import { MyPlotSchema } from '@shared/schemas/my-plot';
import { RESPONSE_SHAPES_FILE, responseShapesSource } from '../../../scripts/response-shapes';
import { CsrfCarrierShape, ErrorBodyShape, MyFeesListShape, MyPlotShape } from './response-shapes.gen';
import { checkShape, type Shape } from './shape';

/** zod's answer and the shape's answer for one value: both succeed with the same data, or both fail. */
function agree<T>(schema: z.ZodType<T>, shape: Shape<T>, value: unknown): void {
  const byZod = schema.safeParse(value);
  const byShape = checkShape(shape, value);
  expect(byShape.success, JSON.stringify(value)).toBe(byZod.success);
  if (byZod.success && byShape.success) expect(byShape.data).toEqual(byZod.data);
}

describe('response shapes', () => {
  it('are up to date with the shared schemas (run `npm run shapes` when this fails)', () => {
    expect(fs.readFileSync(RESPONSE_SHAPES_FILE, 'utf8')).toBe(responseShapesSource());
  });

  it('accept and refuse what zod accepts and refuses', () => {
    const csrf = z.object({ csrfToken: z.string().min(1) });
    agree(csrf, CsrfCarrierShape, { csrfToken: 'abc', user: null });
    agree(csrf, CsrfCarrierShape, { csrfToken: '' });
    agree(csrf, CsrfCarrierShape, {});
    agree(ErrorBodySchema, ErrorBodyShape, { error: { code: 'not_found', message: 'No such plot', fields: { name: 'Required' } } });
    agree(ErrorBodySchema, ErrorBodyShape, { error: { code: 'not_found', message: 'x', fields: { name: 3 } } });
    agree(ErrorBodySchema, ErrorBodyShape, { error: { code: 'x' } });
    agree(ErrorBodySchema, ErrorBodyShape, '<html>Bad gateway</html>');
    agree(MyFeesListSchema, MyFeesListShape, { items: [], page: 1, total: 0, extra: true });
    agree(MyFeesListSchema, MyFeesListShape, { items: [], page: 1.5, total: 0 });
    agree(MyPlotSchema, MyPlotShape, { holding: null, renewal: null });
    agree(MyPlotSchema, MyPlotShape, { holding: 'A-1', renewal: null });
  });

  it('agree with zod on arbitrary JSON', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        agree(ErrorBodySchema, ErrorBodyShape, value);
        agree(MyFeesListSchema, MyFeesListShape, value);
        agree(MyPlotSchema, MyPlotShape, value);
      }),
      { numRuns: 300 },
    );
  });
});
