import { describe, expect, it } from 'vitest';
import { crops } from '../crops';
import {
  cropOverrideBodySchema,
  CropCreateBodySchema,
  CropListQuerySchema,
  CropRelationCreateBodySchema,
  cropValueSchemas,
  overridableCropFields,
  type CropValueField,
} from './crops';

const issuesAt = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.join('.'));

describe('crop value schemas', () => {
  it('accept every sourced value of the reference catalogue, so an override can restate any of them', () => {
    let checked = 0;
    for (const c of crops) {
      for (const field of Object.keys(cropValueSchemas) as CropValueField[]) {
        const v = c[field];
        if (v === undefined) continue;
        const r = cropValueSchemas[field].safeParse(v.value);
        expect(r.success, `${c.slug}.${field}: ${JSON.stringify(r.error?.issues)}`).toBe(true);
        checked++;
      }
    }
    // computed: 32 crops × 22 fields, less the three optional ones (emergence table, Kc, stages) some
    // crops lack; at least 20 each.
    expect(checked).toBeGreaterThanOrEqual(crops.length * 20);
  });

  it('accept a whole reference crop (without its slug) as a club crop body', () => {
    for (const { slug, ...rest } of crops) {
      const r = CropCreateBodySchema.safeParse(rest);
      expect(r.success, `${slug}: ${JSON.stringify(r.error?.issues)}`).toBe(true);
    }
  });

  it('refuse a value outside its field’s schema, naming where', () => {
    const bad = cropOverrideBodySchema('daysToMaturity').safeParse({ value: { min: 90, max: 60, from: 'sowing' }, source: 'from-memory' });
    expect(issuesAt(bad)).toEqual(['value.max']);
    const kind = cropOverrideBodySchema('sowing').safeParse({ value: 'broadcast', source: 'common-practice' });
    expect(issuesAt(kind)).toEqual(['value']);
    const noSource = cropOverrideBodySchema('soilPh').safeParse({ value: { min: 6, max: 7 } });
    expect(issuesAt(noSource)).toEqual(['source']);
    const extra = cropOverrideBodySchema('soilPh').safeParse({ value: { min: 6, max: 7 }, source: 'from-memory', colour: 'red' });
    expect(extra.success).toBe(false);
    // 14 is past the schema's own upper bound of 10 (cropValueSchemas.soilPh).
    expect(issuesAt(cropOverrideBodySchema('soilPh').safeParse({ value: { min: 6, max: 14 }, source: 'from-memory' }))).toEqual(['value.max']);
    expect(overridableCropFields).not.toContain('family');
    expect(overridableCropFields).not.toContain('botanicalName');
  });

  it('refuse a family that is not a botanical family name and a kind that is not listed', () => {
    const { slug: _slug, ...base } = crops[0];
    expect(issuesAt(CropCreateBodySchema.safeParse({ ...base, family: { value: 'cabbage family', source: 'from-memory' } }))).toEqual(['family.value']);
    expect(issuesAt(CropCreateBodySchema.safeParse({ ...base, kind: 'tuber' }))).toEqual(['kind']);
    expect(CropListQuerySchema.safeParse({ family: 'brassicaceae' }).success).toBe(true);
    expect(issuesAt(CropListQuerySchema.safeParse({ family: 'cabbages' }))).toEqual(['family']);
  });
});

describe('club relation body', () => {
  const ok = {
    cropAId: 1,
    cropBId: 2,
    effect: 'antagonistic',
    scope: { kind: 'neighbours', distanceM: 1.234 },
    reason: 'Shade from the tall row.',
    evidence: 'common_practice',
    severity: 'watch',
    source: 'common-practice',
  };
  it('keeps the distance to the centimetre the column holds', () => {
    expect(CropRelationCreateBodySchema.parse(ok).scope).toEqual({ kind: 'neighbours', distanceM: 1.23 });
  });
  it('holds the reference rules: a clash needs research, research needs a publication, one crop is no pair', () => {
    expect(issuesAt(CropRelationCreateBodySchema.safeParse({ ...ok, severity: 'clash' }))).toEqual(['severity']);
    expect(issuesAt(CropRelationCreateBodySchema.safeParse({ ...ok, evidence: 'research' }))).toEqual(['source']);
    expect(issuesAt(CropRelationCreateBodySchema.safeParse({ ...ok, effect: 'beneficial' }))).toEqual(['severity']);
    expect(issuesAt(CropRelationCreateBodySchema.safeParse({ ...ok, cropBId: 1 }))).toEqual(['cropBId']);
    expect(CropRelationCreateBodySchema.safeParse({ ...ok, evidence: 'research', severity: 'clash', source: 'Club trial beds 2026' }).success).toBe(true);
  });
});
