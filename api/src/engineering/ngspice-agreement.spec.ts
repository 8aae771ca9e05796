// Outside reference: ngspice 45 (WebAssembly build in the npm package eecircuit-engine). One
// simulator is started for this file and reused; netlists use the exported `.model` unchanged.
import fc from 'fast-check';
import type { EngineeringCard, RegulatorRequest } from '@shuntwise/contracts';
import { diodeVoltage, dynamicImpedance, fitBreakdownModel } from './breakdown-model';
import { designRegulator, solveShuntRegulator } from './regulator';
import { junctionTemperatureC } from './self-heating';
import { spiceModelLine } from './spice-model';
import { cardArbitrary, logUniform } from './testing/card-arbitraries';
import { NGSPICE_OPTIONS, startNgspice, type Ngspice } from './testing/ngspice';

let ngspice: Ngspice;
let worstSweepError = 0;
let worstShiftError = 0;
let worstRegulatorError = 0;
const OPTIONS = NGSPICE_OPTIONS;
const run = (netlist: string) => ngspice.run(netlist);

/** ngspice DC sweep of the exported model driven by a current source, 0.1 mA…50 mA in 0.1 mA steps. */
async function sweep(modelLine: string, tempC: number): Promise<{ current: number[]; voltage: number[] }> {
  const out = await run(`sweep\n${modelLine}\nI1 0 k DC 1m\nD1 0 k DZ\n${OPTIONS}\n.temp ${tempC}\n.dc I1 0.1m 50m 0.1m\n.end\n`);
  return { current: out.get('i(i-sweep)')!.map(Math.abs), voltage: out.get('v(k)')! };
}

/** ngspice operating point of a single current (A) through the model at tempC. */
async function voltageAt(modelLine: string, current: number, tempC: number): Promise<number> {
  const out = await run(`op\n${modelLine}\nI1 0 k DC ${current}\nD1 0 k DZ\n${OPTIONS}\n.temp ${tempC}\n.op\n.end\n`);
  return out.get('v(k)')![0];
}

/** ngspice operating point of supply → R → diode ∥ constant-current load, with its self-heating diode when thermal. */
async function regulatorAt(modelLine: string, supply: number, r: number, load: number, tempC: number, thermal: boolean) {
  const diode = thermal ? 'D1 0 k tj DZ thermal' : 'D1 0 k DZ';
  const out = await run(`reg\n${modelLine}\nV1 in 0 DC ${supply}\nR1 in k ${r}\n${diode}\nI2 k 0 DC ${load}\n${OPTIONS}\n.temp ${tempC}\n.op\n.end\n`);
  return { vOut: out.get('v(k)')![0], rise: thermal ? out.get('v(tj)')![0] : 0 };
}

beforeAll(async () => {
  ngspice = await startNgspice();
});

afterAll(() => {
  // Printed so the agreement can be quoted; the assertions below are what fail.
  console.log(
    `ngspice agreement over ${ngspice.runs} runs: sweep ${(worstSweepError * 1e3).toFixed(4)} mV, ` +
      `temperature shift ${(worstShiftError * 100).toFixed(4)} %, regulator ${(worstRegulatorError * 1e3).toFixed(4)} mV`,
  );
});

const EDGE_CARDS: Record<string, EngineeringCard> = {
  'two-point fit, 12 V avalanche part': { vzNom: 12, vzMin: 11.4, vzMax: 12.6, izt: 0.02, zzt: 9, izk: 0.001, zzk: 120, tc: 8.5e-3 },
  'clamped fit (RS < 0), 5.1 V part': { vzNom: 5.1, izt: 0.02, zzt: 17, izk: 0.001, zzk: 550, tc: (0.03 / 100) * 5.1 },
  'one impedance point, 3.3 V tunnelling part': { vzNom: 3.3, izt: 0.005, zzt: 28, tc: -2.2e-3 },
  'knee point only, 24 V part': { vzNom: 24, izt: 0.01, izk: 0.00025, zzk: 600, tc: (0.085 / 100) * 24 },
  'stiff 75 V part at 50 mA': { vzNom: 75, izt: 0.05, zzt: 2, izk: 0.005, zzk: 30, tc: (0.09 / 100) * 75 },
  'no temperature coefficient': { vzNom: 6.8, izt: 0.02, zzt: 3.5, izk: 0.001, zzk: 60 },
};

describe('how ngspice reads the breakdown temperature coefficient', () => {
  // Found here, ngspice 45: with TLEV=0, BV(T) = BV − TCV·(T − TNOM), so a positive TCV
  // lowers BV and the exported TCV is −αVz; with TLEV=1 TCV is relative (BV·(1 − TCV·ΔT));
  // TBV1 is accepted and read like TCV (same sign); TNOM in the model overrides the 27 °C
  // default. A model parameter ngspice does not know is a fatal error (runSim never settles).
  it('TLEV=0: a positive TCV lowers BV by TCV·ΔT (ngspice)', async () => {
    const cold = await voltageAt('.model DZ D(BV=5 IBV=20m NBV=2 TCV=2m TLEV=0 TNOM=25)', 0.02, 25);
    const hot = await voltageAt('.model DZ D(BV=5 IBV=20m NBV=2 TCV=2m TLEV=0 TNOM=25)', 0.02, 75);
    expect(cold).toBeCloseTo(5, 4);
    expect(hot - cold).toBeCloseTo(-0.002 * 50, 4);
  });

  it('TLEV=1: TCV is a fraction of BV per kelvin (ngspice)', async () => {
    const hot = await voltageAt('.model DZ D(BV=5 IBV=20m NBV=2 TCV=1m TLEV=1 TNOM=25)', 0.02, 75);
    expect(hot).toBeCloseTo(5 * (1 - 0.001 * 50), 4);
  });

  it('TBV1 is read like TCV, same sign (ngspice)', async () => {
    const hot = await voltageAt('.model DZ D(BV=5 IBV=20m NBV=2 TBV1=2m TNOM=25)', 0.02, 75);
    expect(hot).toBeCloseTo(5 - 0.002 * 50, 4);
  });

  it('RTH0 without a thermal node changes nothing, so the thermal export stays usable in plain netlists (ngspice)', async () => {
    const plain = await voltageAt('.model DZ D(BV=5 IBV=20m NBV=2 TNOM=25)', 0.01, 25);
    const withRth = await voltageAt('.model DZ D(BV=5 IBV=20m NBV=2 TNOM=25 RTH0=300)', 0.01, 25);
    expect(withRth).toBe(plain);
  });

  it('NBV·Vt scales with absolute temperature (ngspice)', async () => {
    // Vt = kT/q: at 0.1 × IBV the drop is NBV·Vt·ln 10, and Vt grows with T in kelvin.
    const line = '.model DZ D(BV=5 IBV=10m NBV=10 TNOM=25)';
    const drop25 = 5 - (await voltageAt(line, 0.001, 25));
    const drop125 = 5 - (await voltageAt(line, 0.001, 125));
    expect(drop125 / drop25).toBeCloseTo(398.15 / 298.15, 4);
  });
});

describe('V(I) against an ngspice DC sweep of the exported model, 0.1 mA…50 mA, within 0.5 mV', () => {
  async function expectSweepAgrees(card: EngineeringCard, tempC: number) {
    const model = fitBreakdownModel(card);
    const { current, voltage } = await sweep(spiceModelLine(model), tempC);
    expect(current.length).toBe(500);
    let worst = 0;
    for (let k = 0; k < current.length; k++) worst = Math.max(worst, Math.abs(voltage[k] - diodeVoltage(model, current[k], tempC)));
    worstSweepError = Math.max(worstSweepError, worst);
    expect(worst).toBeLessThan(0.5e-3);
  }

  for (const [name, card] of Object.entries(EDGE_CARDS)) {
    it(`${name} (ngspice)`, () => expectSweepAgrees(card, 25));
  }

  it('generated cards at 25 °C and at a generated temperature (ngspice, fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(cardArbitrary, fc.double({ min: -40, max: 150, noNaN: true }), async (card, tempC) => {
        await expectSweepAgrees(card, 25);
        await expectSweepAgrees(card, tempC);
      }),
      { numRuns: 25, seed: 3003, endOnFailure: true },
    );
  });

  it('the tolerance corners export shifted to vzMin and vzMax (ngspice)', async () => {
    const card = EDGE_CARDS['two-point fit, 12 V avalanche part'];
    const model = fitBreakdownModel(card);
    for (const corner of ['min', 'max'] as const) {
      const v = await voltageAt(spiceModelLine(model, { corner }), card.izt, 25);
      expect(Math.abs(v - (corner === 'min' ? card.vzMin! : card.vzMax!))).toBeLessThan(0.5e-3);
      expect(Math.abs(v - diodeVoltage(model, card.izt, 25, corner))).toBeLessThan(0.5e-3);
    }
  });
});

describe("the exported model's temperature shift agrees with αVz within 1 % (ngspice)", () => {
  it('generated cards between 25 °C and a second temperature, and V at every current there', async () => {
    await fc.assert(
      fc.asyncProperty(
        cardArbitrary,
        fc.double({ min: -40, max: 150, noNaN: true }).filter((t) => Math.abs(t - 25) > 10),
        async (card, t2) => {
          const model = fitBreakdownModel(card);
          const line = spiceModelLine(model);
          const shift = ((await voltageAt(line, card.izt, t2)) - (await voltageAt(line, card.izt, 25))) / (t2 - 25);
          const error = Math.abs(shift - model.alphaVz) / Math.abs(model.alphaVz);
          worstShiftError = Math.max(worstShiftError, error);
          expect(error).toBeLessThan(0.01);
          // Away from izt the log term moves with T too; the engine follows the same law.
          for (const current of [card.izt / 10, card.izt * 2]) {
            expect(Math.abs((await voltageAt(line, current, t2)) - diodeVoltage(model, current, t2))).toBeLessThan(0.5e-3);
          }
        },
      ),
      { numRuns: 20, seed: 3004, endOnFailure: true },
    );
  });
});

describe('self-heating against ngspice’s self-heating diode (RTH0, thermal node)', () => {
  it('junction temperature and voltage of a diode fed from 50 V through 1.5 kΩ (ngspice)', async () => {
    const card: EngineeringCard = { vzNom: 3.9, vzMin: 3.7, vzMax: 4.1, izt: 0.02, zzt: 13, izk: 0.001, zzk: 200, tc: -2.5e-3, rthJA: 400 };
    const model = fitBreakdownModel(card);
    const spice = await regulatorAt(spiceModelLine(model, { thermal: true }), 50, 1500, 0, 40, true);
    const op = solveShuntRegulator(model, 50, 1500, 0, 40);
    // Node tj carries the rise above ambient: about 48 K here.
    expect(spice.rise).toBeGreaterThan(40);
    expect(Math.abs(40 + spice.rise - op.tjC)).toBeLessThan(0.01);
    expect(Math.abs(op.tjC - junctionTemperatureC(model, op.diodeCurrent, 40))).toBeLessThan(1e-6);
    expect(Math.abs(spice.vOut - op.vOut)).toBeLessThan(0.5e-3);
  });
});

describe("the regulator's operating points agree with ngspice within 1 mV", () => {
  async function expectCornersAgree(request: RegulatorRequest): Promise<number> {
    const design = designRegulator(request);
    const model = fitBreakdownModel(request.card);
    const thermal = (request.selfHeating ?? true) && model.rthJA !== null;
    let compared = 0;
    for (const c of design.outputBand?.corners ?? []) {
      // Out of breakdown the diode is a leakage path the breakdown model does not describe;
      // above tjMax ngspice's saturation current (IS grows ~10⁸× by 200 °C) adds a leakage the
      // breakdown law leaves out. Neither is an operating point the part is rated for.
      if (c.diodeCurrent < 1e-6) continue;
      if (c.tjC === null || (request.card.tjMax != null && c.tjC > request.card.tjMax)) continue;
      const line = spiceModelLine(model, { corner: c.corner, thermal });
      const spice = await regulatorAt(line, c.supply, c.resistance, c.load, c.ambientC, thermal);
      const error = Math.abs(spice.vOut - c.vOut);
      worstRegulatorError = Math.max(worstRegulatorError, error);
      expect(error).toBeLessThan(1e-3);
      if (thermal) expect(Math.abs(c.ambientC + spice.rise - c.tjC)).toBeLessThan(0.05);
      compared++;
    }
    return compared;
  }

  it('a 5.1 V design over supply, load, ambient, tolerance and resistor corners, with self-heating (ngspice)', async () => {
    const compared = await expectCornersAgree({
      card: { vzNom: 5.1, vzMin: 4.85, vzMax: 5.36, izt: 0.02, zzt: 17, izk: 0.001, zzk: 550, tc: (0.03 / 100) * 5.1, pdMax: 0.5, tjMax: 175, rthJA: 300 },
      supply: { min: 10.8, nom: 12, max: 13.2 },
      load: { min: 0, max: 0.01 },
      ambient: { min: -20, max: 70 },
      resistor: { series: 'E24', tolerance: 0.05 },
    });
    expect(compared).toBe(32);
  });

  it('generated cards and circuits (ngspice, fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(
        cardArbitrary,
        logUniform(1.3, 3),
        logUniform(0.02, 0.15),
        logUniform(1e-4, 0.03),
        fc.constantFrom('E24' as const, 'E96' as const),
        async (card, headroom, spread, loadMax, series) => {
          const nom = card.vzNom * headroom;
          const request: RegulatorRequest = {
            card: { ...card, pdMax: 1.3, tjMax: 175 },
            supply: { min: nom * (1 - spread), nom, max: nom * (1 + spread) },
            load: { min: loadMax / 10, max: loadMax },
            ambient: { min: -10, max: 60 },
            resistor: { series, tolerance: series === 'E24' ? 0.05 : 0.01 },
          };
          await expectCornersAgree(request);
        },
      ),
      { numRuns: 8, seed: 3005, endOnFailure: true },
    );
  });

  it('line regulation Zd/(R + Zd) matches ngspice’s response to a supply step within 1 % (Sedra & Smith, from memory; ngspice)', async () => {
    const card: EngineeringCard = { vzNom: 9.1, izt: 0.014, zzt: 10, izk: 0.0005, zzk: 150, tc: (0.06 / 100) * 9.1 };
    const model = fitBreakdownModel(card);
    const line = spiceModelLine(model);
    const r = 470;
    const op = solveShuntRegulator(model, 15, r, 0.002, 25, 'nom', false);
    const zd = dynamicImpedance(model, op.diodeCurrent, 25);
    const up = await regulatorAt(line, 15.01, r, 0.002, 25, false);
    const down = await regulatorAt(line, 14.99, r, 0.002, 25, false);
    const measured = (up.vOut - down.vOut) / 0.02;
    expect(Math.abs(measured - zd / (r + zd)) / measured).toBeLessThan(0.01);
  });
});
