import type { EngineeringCardInput, MeasuredSample, Spec } from '@shuntwise/contracts';
import { specSchema } from '@shuntwise/contracts';
import { analyseMeasurements } from './measurement-analysis';

// Points on a known reverse characteristic V = v0 + n·Vt·ln(I/iRef) + RS·(I − iRef) at 25 °C,
// Vt = 25.693 mV (kT/q at 298.15 K, CODATA constants). The fit itself is checked against
// ngspice in engineering/measured-fit.spec.ts; here the limits and verdicts are (common
// practice, no source): a value inside its window passes, outside fails, the worst sample decides.
const VT = 0.025693;
function sample(sampleId: string, lot: string, v0: number, n = 2, rs = 5, iRef = 0.005): MeasuredSample {
  const currents = [0.0002, 0.0005, 0.001, 0.002, 0.005, 0.01, 0.02];
  return {
    sampleId,
    lot,
    points: currents.map((current) => ({ current, voltage: v0 + n * VT * Math.log(current / iRef) + rs * (current - iRef), tempC: 25 })),
  };
}

const card: EngineeringCardInput = { vzNom: 5.1, vzMin: 4.85, vzMax: 5.36, izt: 0.005, zzt: 20, izk: 0.00025, zzk: 600 };
const spec: Spec = specSchema.parse({
  iRef: 0.01,
  vz: { min: 4.9, nom: 5.1, max: 5.3 },
  zdMax: 25,
  envelope: { iMin: 0.001, iMax: 0.02, taMin: -20, taMax: 70 },
});

describe('measured samples against the card and the spec', () => {
  it('a lot inside the datasheet window is not failed; the nearest sample sets the margin; the spread is per lot and over all', () => {
    const a = analyseMeasurements({ samples: [sample('S1', 'L1', 5.05), sample('S2', 'L1', 5.12), sample('S3', 'L2', 5.2)], card, cardVersion: 1, spec: null });
    const vz = a.checks.find((c) => c.id === 'card-vz')!;
    // S3 at 5.2 V is nearest the 5.36 V end: (5.36 − 5.2)/5.36 = 2.99 %, inside the default 5 % band → marginal.
    expect(vz.margin).toBeCloseTo(((5.36 - 5.2) / 5.36) * 100, 6);
    expect(vz.verdict).toBe('marginal');
    expect(vz.failingSamples).toEqual([]);
    expect(a.samples[0].vzAtIzt).toBeCloseTo(5.05, 6);
    expect(a.samples[0].zdAtIzt).toBeCloseTo((2 * VT) / 0.005 + 5, 3);
    expect(a.lots.map((l) => [l.lot, l.samples])).toEqual([
      ['L1', 2],
      ['L2', 1],
      [null, 3],
    ]);
    expect(a.lots[0].vzAtIzt!.mean).toBeCloseTo(5.085, 6);
  });

  it('a drifting lot fails the datasheet window and names its samples', () => {
    const a = analyseMeasurements({ samples: [sample('S1', 'L1', 5.1), sample('D1', 'L9', 5.45), sample('D2', 'L9', 5.5)], card, cardVersion: 3, spec: null });
    const vz = a.checks.find((c) => c.id === 'card-vz')!;
    expect(vz.verdict).toBe('fail');
    expect(vz.failingSamples).toEqual(['D1', 'D2']);
    expect(vz.value).toBeCloseTo(5.5, 6);
    expect(vz.limit).toBe(5.36);
    expect(a.overall).toBe('fail');
  });

  it('reads the samples at the spec’s reference current and holds them to its window and Zd limit', () => {
    const a = analyseMeasurements({ samples: [sample('S1', 'L1', 5.1, 2, 30)], card, cardVersion: 1, spec: { housePartId: 7, version: 2, spec } });
    const s = a.samples[0];
    expect(s.vzAtIRef).toBeCloseTo(5.1 + 2 * VT * Math.log(2) + 30 * 0.005, 6);
    const vz = a.checks.find((c) => c.id === 'spec-vz')!;
    expect(vz.margin).toBeCloseTo(((5.3 - s.vzAtIRef!) / 5.3) * 100, 6);
    expect(vz.verdict).toBe('marginal');
    expect(vz.failingSamples).toEqual([]);
    const zd = a.checks.find((c) => c.id === 'spec-zd')!;
    expect(zd.value).toBeCloseTo((2 * VT) / 0.01 + 30, 3);
    expect(zd.verdict).toBe('fail');
  });

  it('a sample that cannot be fitted is listed with its reason, never counted as a pass', () => {
    const bad: MeasuredSample = { sampleId: 'X', lot: null, points: [{ current: 0.005, voltage: 5.1, tempC: 25 }] };
    const a = analyseMeasurements({ samples: [bad], card, cardVersion: 1, spec: null });
    expect(a.samples[0].error).toMatch(/at least 4/);
    expect(a.checks.every((c) => c.verdict === 'no-data')).toBe(true);
    expect(a.overall).toBe('no-data');
  });

  it('does not read a figure outside the measured currents', () => {
    const narrow: MeasuredSample = {
      sampleId: 'N',
      lot: null,
      points: [0.005, 0.01, 0.02, 0.05].map((current) => ({ current, voltage: 5.1 + 0.05 * Math.log(current / 0.005), tempC: 25 })),
    };
    const a = analyseMeasurements({ samples: [narrow], card, cardVersion: 1, spec: null });
    expect(a.samples[0].zdAtKnee).toBeNull();
    expect(a.samples[0].warnings.join(' ')).toMatch(/outside the measured currents/);
  });
});
