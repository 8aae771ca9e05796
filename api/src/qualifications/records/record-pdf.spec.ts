import { createHash } from 'node:crypto';
import { DESIGN_CAUTION } from '../../engineering/caution';
import { evaluateCard } from '../evaluation/evaluate';
import { canonicalJson, recordCurve, type RecordInputs } from './record-inputs';
import { renderDecisionRecord } from './record-pdf';

// Invented demo part and spec (a 5.1 V regulator diode).
const spec = {
  iRef: 5e-3,
  vz: { min: 4.6, nom: 5.1, max: 5.6 },
  zdMax: 60,
  knee: { iKnee: 0.25e-3, maxRatio: 20, maxSpan: null },
  leakage: { irMax: 2e-6, vr: 2 },
  tc: { min: -1e-3, max: 3e-3 },
  power: { pdMin: 0.3, deratingFraction: 0.5 },
  packages: ['SOD-123'],
  envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
  outputWindow: null,
  marginalBandPercent: 5,
};
const p = { source: 'entered' as const, datasheetId: null, page: null, text: null, confirmedBy: null, confirmedAt: null };
const card = {
  vzMin: { value: 4.9, printed: '4.9 V', provenance: p },
  vzNom: { value: 5.1, printed: '5.1 V', provenance: p },
  vzMax: { value: 5.3, printed: '5.3 V', provenance: p },
  izt: { value: 5e-3, printed: '5 mA', provenance: p },
  zzt: { value: 40, printed: '40 Ω', provenance: p },
  izk: { value: 0.25e-3, printed: '0.25 mA', provenance: p },
  zzk: { value: 500, printed: '500 Ω', provenance: p },
};

function inputs(madeAt = '2026-12-01T10:00:00.000Z'): RecordInputs {
  const evaluation = evaluateCard({
    spec,
    specVersion: 1,
    card: { vzNom: 5.1, vzMin: 4.9, vzMax: 5.3, izt: 5e-3, zzt: 40, izk: 0.25e-3, zzk: 500 },
    cardVersion: 1,
    vendorPackage: 'SOD-123',
  });
  const { curve, note } = recordCurve(card, spec);
  return {
    format: 1,
    madeAt,
    case: {
      id: 7,
      revision: 1,
      previousId: null,
      state: 'cleared',
      stateLabel: 'Cleared',
      overall: evaluation.overall,
      summary: '',
      openedAt: '2026-11-30T09:00:00.000Z',
      submittedAt: '2026-11-30T09:30:00.000Z',
      preparedBy: { id: 2, name: 'Priya Raman' },
      reviewer: null,
      decision: { state: 'cleared', stateLabel: 'Cleared', at: madeAt, by: { id: 3, name: 'Tomas Eklund' }, text: null },
      revocation: null,
    },
    housePart: { id: 1, partNumber: 'HP-5V1', description: 'Regulator diode 5.1 V', specVersion: 1, spec },
    vendorPart: { id: 2, manufacturer: 'Orrin Devices', mpn: 'OR-5V1', package: 'SOD-123', cardVersion: 1, card, cardNote: null },
    datasheets: [],
    evaluation,
    measurementSets: [],
    curve,
    curveNote: note,
    comments: [],
    audit: [],
    caution: DESIGN_CAUTION,
  };
}
const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

describe('decision record PDF', () => {
  it('gives the same bytes for the same inputs, and other bytes for another record time', async () => {
    const base = inputs();
    const a = await renderDecisionRecord(base);
    const b = await renderDecisionRecord(JSON.parse(canonicalJson(base)) as RecordInputs);
    expect(a.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(sha(a)).toBe(sha(b));
    expect(a.includes(Buffer.from('D:20261201100000Z'))).toBe(true); // CreationDate from the record's time, not the clock
    const c = await renderDecisionRecord({ ...base, madeAt: '2026-12-01T10:00:01.000Z' });
    expect(sha(c)).not.toBe(sha(a));
  });

  it('draws the curve at 25 °C from the fitted card: at izt the nominal line is vzNom and the ends are the card’s limits', () => {
    // V(izt, 25 °C) = vz of each corner by construction of the model (SPICE reverse branch anchored at izt; common practice, no source).
    const { curve } = recordCurve(card, spec);
    const atIzt = curve!.points.find((q) => Math.abs(q.current - 5e-3) < 1e-12)!;
    expect(atIzt.nom).toBeCloseTo(5.1, 9);
    expect(atIzt.low).toBeCloseTo(4.9, 9);
    expect(atIzt.high).toBeCloseTo(5.3, 9);
    expect(curve!.points.every((q, i, all) => i === 0 || q.nom > all[i - 1].nom)).toBe(true);
    expect(recordCurve(null, spec).curve).toBeNull();
  });
});

describe('canonical JSON', () => {
  it('sorts keys at every depth, drops undefined members, and refuses what JSON cannot say', () => {
    expect(canonicalJson({ b: 1, a: { d: [1, 'x', null], c: true }, u: undefined })).toBe('{"a":{"c":true,"d":[1,"x",null]},"b":1}');
    expect(canonicalJson({ a: 1, b: 2 })).toBe(canonicalJson({ b: 2, a: 1 }));
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(/NaN/);
    expect(() => canonicalJson([undefined])).toThrow(/undefined/);
  });
});
