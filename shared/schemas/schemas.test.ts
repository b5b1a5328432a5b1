import { describe, expect, it } from 'vitest';
import { PlotUpdateBodySchema } from './plots';
import { SiteUpdateBodySchema } from './sites';
import { ClubSettingsUpdateBodySchema } from './clubs';

// The API refuses unknown fields everywhere (DEVELOPERS.md); partial update bodies too.
describe('update bodies', () => {
  it('refuse unknown fields and take only the fields sent, without filling defaults', () => {
    expect(PlotUpdateBodySchema.safeParse({ version: 1, colour: 'red' }).success).toBe(false);
    expect(SiteUpdateBodySchema.safeParse({ version: 1, owner: 'x' }).success).toBe(false);
    expect(ClubSettingsUpdateBodySchema.safeParse({ slug: 'new' }).success).toBe(false);
    expect(PlotUpdateBodySchema.parse({ version: 2, x: 1.5 })).toEqual({ version: 2, x: 1.5 });
    expect(SiteUpdateBodySchema.parse({ version: 3, pathWidth: 1 })).toEqual({ version: 3, pathWidth: 1 });
  });
});
