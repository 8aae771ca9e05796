import { describe, expect, it } from 'vitest';
import { qualificationClearRequestSchema, qualificationEvaluateRequestSchema, qualificationRecheckRequestSchema } from '../qualifications/qualification.schema';
import { putRatingCardRequestSchema } from '../parts/rating-card.schema';
import { specSchema } from '../parts/spec.schema';
import { PHYSICAL_BOUNDS } from './bounds';

const entered = { source: 'entered' as const };
const v = (value: number) => ({ value, provenance: entered });
const card = (fields: Record<string, unknown>) => ({ version: 0, fields: { vzNom: v(5.1), izt: v(5e-3), ...fields } });
const spec = (overrides: Record<string, unknown> = {}) => ({
  iRef: 5e-3,
  vz: { min: 4.85, nom: 5.1, max: 5.36 },
  envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
  ...overrides,
});
const issues = (result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }) =>
  (result.error?.issues ?? []).map((i) => ({ path: i.path.join('.'), message: i.message }));

// The ranges are this product's own choice around regulator diodes (common practice, no source); see units/bounds.ts.
describe('physical values have sane bounds, refused with the field named', () => {
  it('refuses a tempco of 1e300 mV/K and 1e300 %/K on a rating card, naming tc', () => {
    for (const unit of ['mV/K', '%/K'] as const) {
      const result = putRatingCardRequestSchema.safeParse(card({ tc: { ...v(1e300), unit } }));
      expect(result.success).toBe(false);
      expect(issues(result)).toContainEqual({ path: 'fields.tc.value', message: expect.stringMatching(/^tc: .*between/) });
    }
    expect(putRatingCardRequestSchema.safeParse(card({ tc: { ...v(-2.6), unit: 'mV/K' } })).success).toBe(true);
  });

  it('refuses a Zener voltage of 1e-300 V and a test current of 1e-300 A, naming the field', () => {
    expect(issues(putRatingCardRequestSchema.safeParse(card({ vzNom: v(1e-300) })))).toContainEqual({
      path: 'fields.vzNom.value',
      message: expect.stringMatching(/^vzNom: must be between 0.5 and 1000 V/),
    });
    expect(issues(putRatingCardRequestSchema.safeParse(card({ izt: v(1e-300) })))).toContainEqual({
      path: 'fields.izt.value',
      message: expect.stringMatching(/^izt: .*A/),
    });
    expect(issues(putRatingCardRequestSchema.safeParse(card({ izt: v(1e3) })))).toContainEqual({
      path: 'fields.izt.value',
      message: expect.stringMatching(/^izt: .*100 A/),
    });
  });

  it('refuses out-of-range spec values at their path and keeps plausible ones', () => {
    expect(specSchema.safeParse(spec()).success).toBe(true);
    expect(issues(specSchema.safeParse(spec({ vz: { min: 1e-300, nom: 1e-300, max: 1e-300 } })))).toContainEqual({
      path: 'vz.nom',
      message: expect.stringMatching(/0.5 and 1000 V/),
    });
    expect(issues(specSchema.safeParse(spec({ iRef: 0 })))).toContainEqual({ path: 'iRef', message: expect.stringMatching(/A$/) });
    expect(issues(specSchema.safeParse(spec({ tc: { min: -1e300, max: 1 } })))).toContainEqual({ path: 'tc.min', message: expect.stringMatching(/V\/K/) });
    expect(issues(specSchema.safeParse(spec({ envelope: { iMin: 1e-3, iMax: 1e300, taMin: -40, taMax: 85 } })))).toContainEqual({
      path: 'envelope.iMax',
      message: expect.any(String),
    });
  });

  it('keeps every bound ordered and finite', () => {
    for (const [name, b] of Object.entries(PHYSICAL_BOUNDS)) {
      expect([name, Number.isFinite(b.min) && Number.isFinite(b.max) && b.min < b.max]).toEqual([name, true]);
    }
  });
});

describe('case actions carry the version they were based on', () => {
  it('refuses an action without a version, so no request skips the optimistic lock', () => {
    expect(issues(qualificationEvaluateRequestSchema.safeParse({}))).toEqual([{ path: 'version', message: 'Send the case version you loaded' }]);
    expect(qualificationClearRequestSchema.safeParse({}).success).toBe(false);
    expect(qualificationClearRequestSchema.safeParse({ version: 3 }).success).toBe(true);
    // A re-check opens a new case and leaves the decided one alone: no version.
    expect(qualificationRecheckRequestSchema.safeParse({}).success).toBe(true);
  });
});
