import { ratingCardFieldsInputSchema, type RatingCardFieldsInput, type SpecInput } from '@shuntwise/contracts';
import { specSchema } from '@shuntwise/contracts';
import { diffFields, normalizeAt, storedFields } from './rating-cards.service';

const entered = { source: 'entered' as const };
const input = (extra: Partial<RatingCardFieldsInput> = {}) =>
  ratingCardFieldsInputSchema.parse({
    vzNom: { value: 12, printed: '12 V', provenance: entered },
    izt: { value: 0.01, printed: '10 mA', provenance: entered },
    zzt: { value: 9, provenance: { source: 'extracted', datasheetId: 3, page: 2, text: 'ZZT 9 Ω' } },
    ...extra,
  } as RatingCardFieldsInput);
const priya = { id: 1, name: 'Priya Raman' };
const tomas = { id: 2, name: 'Tomas Eklund' };

describe('storedFields', () => {
  it('completes provenance and records who confirmed each value, and when', () => {
    const stored = storedFields(input(), null, priya, '2026-12-01T10:00:00.000Z');
    expect(stored.zzt).toEqual({
      value: 9,
      printed: null,
      provenance: { source: 'extracted', datasheetId: 3, page: 2, text: 'ZZT 9 Ω', confirmedBy: priya, confirmedAt: '2026-12-01T10:00:00.000Z' },
    });
    expect(Object.keys(stored)).toEqual(['vzNom', 'izt', 'zzt']);
  });

  it('keeps the first confirmation of an unchanged value; a changed or unconfirmed one is recorded afresh', () => {
    const first = storedFields(input(), null, priya, '2026-12-01T10:00:00.000Z');
    const second = storedFields(
      input({
        izt: { value: 0.005, provenance: entered },
        zzt: { value: 9, provenance: { source: 'extracted', datasheetId: 3, page: 2, text: 'ZZT 9 Ω' }, confirmed: false },
      }),
      first,
      tomas,
      '2026-12-02T10:00:00.000Z',
    );
    expect(second.vzNom!.provenance).toMatchObject({ confirmedBy: priya, confirmedAt: '2026-12-01T10:00:00.000Z' });
    expect(second.izt!.provenance).toMatchObject({ confirmedBy: tomas, confirmedAt: '2026-12-02T10:00:00.000Z' });
    expect(second.zzt!.provenance).toMatchObject({ confirmedBy: null, confirmedAt: null });
    expect(diffFields(first, second)).toEqual(['izt', 'zzt']);
  });

  it('keeps tc as printed and adds V/K: a %/K figure is relative to vzNom (definition; common practice, no source)', () => {
    const stored = storedFields(input({ tc: { value: 0.07, unit: '%/K', provenance: entered } }), null, priya, 'now');
    expect(stored.tc).toMatchObject({ value: 0.07, unit: '%/K' });
    expect(stored.tc!.voltsPerKelvin).toBeCloseTo((0.07 / 100) * 12, 15);
    const mv = storedFields(input({ tc: { value: 8.4, unit: 'mV/K', provenance: entered } }), null, priya, 'now');
    expect(mv.tc!.voltsPerKelvin).toBeCloseTo(8.4e-3, 15);
  });

  it('counts a removed value as a change, and a %/K tc whose V/K moved with vzNom', () => {
    const before = storedFields(input({ tc: { value: 0.07, unit: '%/K', provenance: entered } }), null, priya, 'now');
    const noZzt = storedFields(input({ zzt: undefined, tc: { value: 0.07, unit: '%/K', provenance: entered } }), before, priya, 'now');
    expect(diffFields(before, noZzt)).toEqual(['zzt']);
    const newVz = storedFields(
      input({ vzNom: { value: 12.2, provenance: entered }, tc: { value: 0.07, unit: '%/K', provenance: entered } }),
      before,
      priya,
      'now',
    );
    expect(diffFields(before, newVz)).toEqual(['vzNom', 'tc']);
  });
});

describe('normalizeAt', () => {
  const card = { vzNom: 5.1, izt: 5e-3, zzt: 40, izk: 0.25e-3, zzk: 500, tc: 0.3e-3 };
  it("uses the spec's reference, knee and envelope currents at 25 °C and the envelope's ambients", () => {
    const spec = specSchema.parse({
      iRef: 2e-3,
      vz: { min: 4.85, nom: 5.1, max: 5.36 },
      knee: { iKnee: 0.5e-3, maxRatio: 10 },
      envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
    } satisfies SpecInput);
    const result = normalizeAt(card, { housePartId: 1, partNumber: 'HP-1', specVersion: 1, spec });
    expect([...new Set(result.points.map((p) => p.current))]).toEqual([0.5e-3, 1e-3, 2e-3, 20e-3]);
    expect([...new Set(result.points.map((p) => p.tempC))]).toEqual([-40, 25, 85]);
  });
  it("falls back to the card's own test currents and the stated 1, 5, 10, 20 mA at 25 °C, as the card editor does", () => {
    const result = normalizeAt(card, null);
    expect(result.points.map((p) => [p.current, p.tempC])).toEqual([
      [0.25e-3, 25],
      [1e-3, 25],
      [5e-3, 25],
      [10e-3, 25],
      [20e-3, 25],
    ]);
  });
});
