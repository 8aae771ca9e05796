// Outside reference: ngspice 45 (eecircuit-engine). Bench points are simulated by ngspice from a
// known diode .model, measurement noise is added (seeded; the seed is printed, MEASURED_FIT_SEED
// replays it), and the fit must give back the model within the tolerances named in each test.
import fc from 'fast-check';
import { diodeVoltage, dynamicImpedance } from './breakdown-model';
import { fitMeasuredSample, MeasuredFitError, spreadOf, type MeasuredPoint } from './measured-fit';
import { NGSPICE_OPTIONS, startNgspice, type Ngspice } from './testing/ngspice';

const SEED = process.env.MEASURED_FIT_SEED ? Number(process.env.MEASURED_FIT_SEED) : (Date.now() ^ (Math.random() * 2 ** 31)) >>> 0;
let ngspice: Ngspice;

beforeAll(async () => {
  console.log(`measured-fit seed ${SEED} (replay with MEASURED_FIT_SEED=${SEED})`);
  ngspice = await startNgspice();
});

/** Known parts as ngspice models (TLEV=0: BV(T) = BV − TCV·(T − TNOM), so TCV = −αVz). */
interface Truth {
  name: string;
  bv: number;
  ibv: number;
  nbv: number;
  rs: number;
  alphaVz: number;
}
const PARTS: Truth[] = [
  { name: '5.1 V, soft knee, negative coefficient', bv: 5.06, ibv: 0.02, nbv: 26, rs: 2, alphaVz: -0.0008 },
  { name: '12 V avalanche part', bv: 11.9, ibv: 0.01, nbv: 6, rs: 6, alphaVz: 0.0085 },
  { name: '33 V avalanche part, large RS', bv: 32.6, ibv: 0.005, nbv: 4, rs: 40, alphaVz: 0.03 },
];

const modelLine = (t: Truth) => `.model DZ D(BV=${t.bv} IBV=${t.ibv} NBV=${t.nbv} RS=${t.rs} TCV=${-t.alphaVz} TLEV=0 TNOM=25)`;

/** ngspice operating points of the known model at log-spaced currents and one temperature. */
async function simulate(t: Truth, currents: number[], tempC: number): Promise<MeasuredPoint[]> {
  const points: MeasuredPoint[] = [];
  for (const current of currents) {
    const out = await ngspice.run(`op\n${modelLine(t)}\nI1 0 k DC ${current}\nD1 0 k DZ\n${NGSPICE_OPTIONS}\n.temp ${tempC}\n.op\n.end\n`);
    points.push({ current, voltage: out.get('v(k)')![0], tempC });
  }
  return points;
}

const logSpaced = (from: number, to: number, n: number) => Array.from({ length: n }, (_, k) => from * (to / from) ** (k / (n - 1)));

/** Gaussian noise (Box–Muller) from a seeded fast-check random source, σ in volts. */
function addNoise(points: MeasuredPoint[], sigma: number, seed: number): MeasuredPoint[] {
  // Uniform integers without fast-check's bias towards edge values, scaled to (0, 1].
  const unit = fc.noBias(fc.integer({ min: 1, max: 2 ** 31 })).map((n) => n / 2 ** 31);
  const gaussians = fc.sample(fc.tuple(unit, unit), { seed, numRuns: points.length });
  return points.map((p, k) => {
    const [u, v] = gaussians[k];
    return { ...p, voltage: p.voltage + sigma * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v) };
  });
}

describe('fitting measured breakdown curves against ngspice-generated points', () => {
  for (const [index, truth] of PARTS.entries()) {
    it(`${truth.name}: noise-free points at 25 °C give Vz at IBV within 0.2 mV and Zd within 1 % (ngspice 45)`, async () => {
      const points = await simulate(truth, logSpaced(truth.ibv / 40, truth.ibv * 2.5, 14), 25);
      const fit = fitMeasuredSample(points, { referenceCurrent: truth.ibv });
      const vAtIbv = truth.bv + truth.rs * truth.ibv;
      expect(Math.abs(diodeVoltage(fit.model, truth.ibv, 25) - vAtIbv)).toBeLessThan(0.2e-3);
      const zdTrue = (truth.nbv * 0.025693) / truth.ibv + truth.rs; // Vt at 25 °C = kT/q = 25.693 mV (CODATA constants)
      expect(Math.abs(dynamicImpedance(fit.model, truth.ibv) / zdTrue - 1)).toBeLessThan(0.01);
      expect(fit.alphaFitted).toBe(false);
      expect(fit.residualRms).toBeLessThan(0.1e-3);
    });

    it(`${truth.name}: 0.5 mV noise, 25 °C and 75 °C, gives Vz within 1 mV, Zd at IBV within 5 %, αVz within 5 % (ngspice 45)`, async () => {
      const currents = logSpaced(truth.ibv / 40, truth.ibv * 2.5, 12);
      const clean = [...(await simulate(truth, currents, 25)), ...(await simulate(truth, currents, 75))];
      const points = addNoise(clean, 0.5e-3, SEED + index);
      const fit = fitMeasuredSample(points, { referenceCurrent: truth.ibv });
      expect(fit.alphaFitted).toBe(true);
      expect(Math.abs(diodeVoltage(fit.model, truth.ibv, 25) - (truth.bv + truth.rs * truth.ibv))).toBeLessThan(1e-3);
      const zdTrue = (truth.nbv * 0.025693) / truth.ibv + truth.rs;
      expect(Math.abs(dynamicImpedance(fit.model, truth.ibv) / zdTrue - 1)).toBeLessThan(0.05);
      expect(Math.abs(fit.model.alphaVz / truth.alphaVz - 1)).toBeLessThan(0.05);
      // The fitted curve stays within 3 σ of ngspice's noise-free points everywhere measured.
      for (const p of clean) expect(Math.abs(diodeVoltage(fit.model, p.current, p.tempC) - p.voltage)).toBeLessThan(1.5e-3);
    });
  }

  it('points at 50 °C only are moved to 25 °C with the card’s coefficient, and say so (ngspice 45)', async () => {
    const truth = PARTS[1];
    const points = await simulate(truth, logSpaced(truth.ibv / 20, truth.ibv * 2, 10), 50);
    const fit = fitMeasuredSample(points, { referenceCurrent: truth.ibv, alphaVzFallback: truth.alphaVz });
    expect(Math.abs(diodeVoltage(fit.model, truth.ibv, 25) - (truth.bv + truth.rs * truth.ibv))).toBeLessThan(2e-3);
    expect(fit.assumptions.join(' ')).toMatch(/moved to 25 °C/);
    const without = fitMeasuredSample(points, { referenceCurrent: truth.ibv });
    expect(without.warnings.join(' ')).toMatch(/not 25 °C/);
  });
});

describe('points that cannot be fitted give a plain reason', () => {
  const base = (current: number) => ({ current, voltage: 5 + 0.05 * Math.log(current / 0.005), tempC: 25 });
  it('too few points', () => {
    expect(() => fitMeasuredSample([0.001, 0.002, 0.005].map(base), { referenceCurrent: 0.005 })).toThrow(MeasuredFitError);
  });
  it('a current range too narrow to show the slope', () => {
    expect(() => fitMeasuredSample([0.005, 0.0055, 0.006, 0.0065, 0.007].map(base), { referenceCurrent: 0.005 })).toThrow(/factor of 3/);
  });
  it('a voltage that falls with current is not a breakdown curve', () => {
    const points = [0.001, 0.002, 0.005, 0.01, 0.02].map((current) => ({ current, voltage: 5 - 0.05 * Math.log(current), tempC: 25 }));
    expect(() => fitMeasuredSample(points, { referenceCurrent: 0.005 })).toThrow(/does not rise/);
  });
});

describe('spread across samples (common practice, no source: sample standard deviation with n − 1)', () => {
  it('mean, extremes and standard deviation of 2, 4, 4, 4, 5, 5, 7, 9', () => {
    const s = spreadOf([2, 4, 4, 4, 5, 5, 7, 9])!;
    expect(s.mean).toBe(5);
    expect(s.min).toBe(2);
    expect(s.max).toBe(9);
    expect(s.stdDev).toBeCloseTo(Math.sqrt(32 / 7), 12);
  });
  it('one value has no spread; none has no statistics', () => {
    expect(spreadOf([5.1])!.stdDev).toBe(0);
    expect(spreadOf([])).toBeNull();
  });
});
