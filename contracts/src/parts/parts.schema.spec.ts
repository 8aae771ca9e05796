import { describe, expect, it } from 'vitest';
import type { ExtractedVariant } from '../datasheets/extraction.schema';
import { cardDraftFromExtraction } from './card-from-extraction';
import { housePartListQuerySchema } from './house-part.schema';
import { putRatingCardRequestSchema, ratingCardFieldsInputSchema } from './rating-card.schema';
import { specSchema } from './spec.schema';
import { vendorPartListQuerySchema } from './vendor-part.schema';

const entered = { source: 'entered' as const };

describe('list queries', () => {
  it('read the table’s paging and a comma list of sorts, "-" for descending', () => {
    expect(vendorPartListQuerySchema.parse({ pageIndex: '2', pageSize: '25', sort: 'manufacturer,-vzNom', hasCard: 'true', vzNomMin: '4.7' })).toMatchObject({
      pageIndex: 2,
      pageSize: 25,
      sort: [
        { field: 'manufacturer', desc: false },
        { field: 'vzNom', desc: true },
      ],
      hasCard: true,
      vzNomMin: 4.7,
    });
    expect(vendorPartListQuerySchema.parse({})).toMatchObject({ pageIndex: 0, pageSize: 50, sort: [{ field: 'mpn', desc: false }] });
    expect(housePartListQuerySchema.parse({ sort: '-updatedAt,-updatedAt' }).sort).toEqual([{ field: 'updatedAt', desc: true }]);
  });

  it('refuse an unknown sort field naming the sortable ones, and an oversized page', () => {
    const bad = vendorPartListQuerySchema.safeParse({ sort: 'price' });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].message).toMatch(/cannot sort by "price"; sortable: mpn, manufacturer/);
    expect(vendorPartListQuerySchema.safeParse({ pageSize: '201' }).success).toBe(false);
  });
});

describe('rating card input', () => {
  it('needs vzNom and izt, and names each contradicting field at <field>.value', () => {
    const missing = ratingCardFieldsInputSchema.safeParse({ vzNom: { value: 5.1, provenance: entered } });
    expect(missing.error!.issues.map((i) => i.path.join('.'))).toEqual(['izt']);
    const contradicting = ratingCardFieldsInputSchema.safeParse({
      vzNom: { value: 5.1, provenance: entered },
      izt: { value: 5e-3, provenance: entered },
      vzMax: { value: 5.0, provenance: entered },
      vr: { value: 5.5, provenance: entered },
    });
    expect(contradicting.error!.issues.map((i) => i.path.join('.'))).toEqual(['vzMax.value', 'vr.value']);
  });

  it('requires an extracted value to name its datasheet and page; defaults confirmed to true', () => {
    const bad = putRatingCardRequestSchema.safeParse({
      version: 0,
      fields: { vzNom: { value: 5.1, provenance: { source: 'extracted' } }, izt: { value: 5e-3, provenance: entered } },
    });
    expect(bad.error!.issues.map((i) => i.path.join('.'))).toEqual(['fields.vzNom.provenance.datasheetId', 'fields.vzNom.provenance.page']);
    const good = putRatingCardRequestSchema.parse({
      version: 3,
      fields: { vzNom: { value: 5.1, provenance: entered }, izt: { value: 5e-3, provenance: entered } },
    });
    expect(good.fields.izt.confirmed).toBe(true);
  });
});

describe('spec', () => {
  const base = { iRef: 5e-3, vz: { min: 4.85, nom: 5.1, max: 5.36 }, envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 } };
  it('fills the optional limits with null and the marginal band with 5 %', () => {
    expect(specSchema.parse(base)).toMatchObject({
      zdMax: null,
      knee: null,
      leakage: null,
      tc: null,
      power: null,
      packages: [],
      outputWindow: null,
      marginalBandPercent: 5,
    });
  });
  it('names the field of each contradiction', () => {
    const r = specSchema.safeParse({ ...base, knee: { maxRatio: 10 }, leakage: { irMax: 1e-6, vr: 5 }, outputWindow: { vMin: 5.5, vMax: 5 } });
    expect(r.error!.issues.map((i) => i.path.join('.'))).toEqual(['knee.iKnee', 'leakage.vr', 'outputWindow.vMin']);
  });
});

describe('cardDraftFromExtraction', () => {
  const variant: ExtractedVariant = {
    mpn: 'X-5V1',
    fields: {
      vzNom: { value: '5.1', unit: 'V', si: 5.1, page: 2, text: 'X-5V1 4.85 5.1 5.36 5 60' },
      zzt: { value: '60', unit: 'Ω', si: 60, page: 2, text: 'X-5V1 4.85 5.1 5.36 5 60' },
      tc: { value: '−1.8', unit: 'mV/°C', si: -0.0018, page: 2, text: 'TC −1.8 mV/°C' },
    },
  };
  it('marks every found value extracted, with its datasheet, page and text, and keeps tc in mV/K', () => {
    const draft = cardDraftFromExtraction(variant, 9);
    expect(draft.vzNom).toEqual({
      value: 5.1,
      printed: '5.1 V',
      provenance: { source: 'extracted', datasheetId: 9, page: 2, text: 'X-5V1 4.85 5.1 5.36 5 60' },
    });
    expect(draft.tc).toMatchObject({ value: -1.8, unit: 'mV/K', printed: '−1.8 mV/°C' });
    expect(draft.izt).toBeUndefined();
  });
  it('keeps a %/K coefficient in %/K (the card converts it with vzNom)', () => {
    const draft = cardDraftFromExtraction({ mpn: 'Y', fields: { tc: { value: '+0.06', unit: '%/K', si: 0.0072, page: 1, text: 'αVZ +0.06 %/K' } } }, 1);
    expect(draft.tc).toMatchObject({ value: 0.06, unit: '%/K' });
  });
  it('reads a %/K coefficient printed with a decimal comma (common practice in datasheets, no source)', () => {
    const draft = cardDraftFromExtraction({ mpn: 'Z', fields: { tc: { value: '−0,058', unit: '%/K', si: -0.0029, page: 1, text: 'αVZ −0,058 %/K' } } }, 1);
    expect(draft.tc).toMatchObject({ value: -0.058, unit: '%/K', printed: '−0,058 %/K' });
  });
});
