import fc from 'fast-check';
import { regulatorRequestSchema, regulatorResponseSchema, type EngineeringCard, type RegulatorRequest } from '@shuntwise/contracts';
import { fitBreakdownModel } from './breakdown-model';
import { designRegulator, solveShuntRegulator } from './regulator';
import { cardArbitrary, logUniform } from './testing/card-arbitraries';

// Sedra & Smith, "Microelectronic Circuits", the Zener shunt-regulator treatment (rules
// quoted from memory): R ≤ (Vs,min − Vz)/(Iz,min + IL,max) keeps the diode in regulation;
// the diode dissipates most at maximum supply and no load, Pz = Vz·(Vs,max − Vz)/R; the
// resistor carries (Vs,max − Vz)²/R; line regulation rz/(R + rz).

const base = { ambient: { min: 25, max: 25 }, selfHeating: false } as const;

describe('shunt-regulator design rules (Sedra & Smith, from memory)', () => {
  it('largest R keeps Iz,min = 5 × izk at minimum supply and maximum load: (Vs,min − Vz)/(Iz,min + IL,max), less the resistor tolerance', () => {
    // 5 × izk = izt, so the diode sits exactly at vzNom there.
    const card: EngineeringCard = { vzNom: 5.1, izt: 0.02, zzt: 5, izk: 0.004, zzk: 20, pdMax: 5, tjMax: 175 };
    const design = designRegulator({ ...base, card, supply: { min: 9, max: 12 }, load: { min: 0, max: 0.01 }, resistor: { series: 'E24', tolerance: 0.05 } });
    expect(design.range.kneeCurrent).toBeCloseTo(0.02, 15);
    expect(design.range.max).toBeCloseTo((9 - 5.1) / (0.02 + 0.01) / 1.05, 9);
  });

  it('smallest R keeps the diode within its allowed power at maximum supply and minimum load: (Vs,max − Vz)/(Iz,max + IL,min)', () => {
    // Allowed power 0.5 × 0.51 W = 0.255 W = vzNom × izt, so Iz,max = izt and V = vzNom there.
    const card: EngineeringCard = { vzNom: 5.1, izt: 0.05, zzt: 2, izk: 0.002, zzk: 40, pdMax: 0.51, tjMax: 175 };
    const design = designRegulator({
      ...base,
      card,
      supply: { min: 9, max: 12 },
      load: { min: 0.002, max: 0.01 },
      resistor: { series: 'E24', tolerance: 0.05 },
      powerFraction: 0.5,
    });
    expect(design.range.allowedDiodeCurrent).toBeCloseTo(0.05, 9);
    expect(design.range.min).toBeCloseTo((12 - 5.1) / (0.05 + 0.002) / 0.95, 6);
  });

  it('diode power peaks at maximum supply and no load, Vz·(Vs,max − Vz)/R; resistor power (Vs,max − Vz)²/R', () => {
    // izt = 45 mA = (15 V − 5.1 V)/220 Ω, so at that corner the diode sits exactly at vzNom.
    const card: EngineeringCard = { vzNom: 5.1, izt: 0.045, zzt: 1, izk: 0.002, zzk: 20, pdMax: 1, tjMax: 175 };
    const design = designRegulator({
      ...base,
      card,
      supply: { min: 12, nom: 13.5, max: 15 },
      load: { min: 0, max: 0.02 },
      resistor: { series: 'E24', tolerance: 0 },
      diodeCurrent: (13.5 - 5.1) / 220 - 0.02,
    });
    expect(design.verdict).toBe('ok');
    expect(design.selected?.resistance).toBe(220);
    expect(design.diodePower).toBeCloseTo((5.1 * (15 - 5.1)) / 220, 9);
    const worst = design.outputBand!.corners.find((c) => c.diodePower === design.diodePower)!;
    expect(worst).toMatchObject({ supply: 15, load: 0 });
    // The rule takes Vz constant; this stiff diode stays within 30 mV of it, so within 1 %.
    expect(Math.abs(design.resistorPower! / ((15 - 5.1) ** 2 / 220) - 1)).toBeLessThan(0.01);
  });

  it('the simple formula R = (Vs − Vz)/(Iz + IL,max) uses the nominal supply and izt', () => {
    const card: EngineeringCard = { vzNom: 5.1, izt: 0.02, zzt: 17, pdMax: 0.5, tjMax: 175 };
    const design = designRegulator({
      ...base,
      card,
      supply: { min: 11, nom: 12, max: 13 },
      load: { min: 0, max: 0.01 },
      resistor: { series: 'E24', tolerance: 0.05 },
    });
    expect(design.simple.resistance).toBeCloseTo((12 - 5.1) / (0.02 + 0.01), 9);
  });
});

describe('bench facts (common practice, no source)', () => {
  it('330 Ω from 5 V with 4.4 V across the diode carries 1.8 mA', () => {
    const model = fitBreakdownModel({ vzNom: 4.4, izt: 0.0018, zzt: 60 });
    const op = solveShuntRegulator(model, 5, 330, 0, 25, 'nom', false);
    expect(op.vOut).toBeCloseTo(4.4, 2);
    expect(op.diodeCurrent).toBeCloseTo(0.0018, 4);
  });

  it('a 4.7 V part fed from 10 V through 330 Ω sits near 4.69 V at about 16 mA', () => {
    const model = fitBreakdownModel({ vzNom: 4.7, izt: 0.02, zzt: 5 });
    const op = solveShuntRegulator(model, 10, 330, 0, 25, 'nom', false);
    expect(Math.abs(op.vOut - 4.69)).toBeLessThan(0.02);
    expect(Math.abs(op.diodeCurrent - 0.016)).toBeLessThan(0.0003);
  });
});

describe('verdicts say why', () => {
  const card: EngineeringCard = {
    vzNom: 5.1,
    vzMin: 4.85,
    vzMax: 5.36,
    izt: 0.02,
    zzt: 17,
    izk: 0.001,
    zzk: 550,
    tc: (0.03 / 100) * 5.1,
    pdMax: 0.5,
    tjMax: 175,
    rthJA: 300,
  };
  const request: RegulatorRequest = {
    card,
    supply: { min: 10.8, nom: 12, max: 13.2 },
    load: { min: 0, max: 0.01 },
    ambient: { min: -20, max: 70 },
    resistor: { series: 'E24', tolerance: 0.05 },
  };

  it('designs a working regulator in the published shape, with its assumptions and the caution', () => {
    const design = designRegulator(request);
    expect(regulatorResponseSchema.parse(design)).toEqual(design);
    expect(design.verdict).toBe('ok');
    expect(design.selected!.resistance).toBeGreaterThanOrEqual(design.range.min!);
    expect(design.selected!.resistance).toBeLessThanOrEqual(design.range.max!);
    expect(design.outputBand!.corners).toHaveLength(32);
    expect(design.assumptions.join(' ')).toMatch(/5 × IZK/);
    expect(design.caution).toMatch(/Safety-relevant circuits/);
  });

  it('writes its reasons with the shared formatter: a cold corner as −40 °C with a true minus (U+2212, ISO 80000-1, from memory)', () => {
    // A falling coefficient puts the highest knee voltage at the cold end, so the reason names it.
    const design = designRegulator({ ...request, card: { ...card, tc: (-0.05 / 100) * card.vzNom } /* −0.05 %/K */, ambient: { min: -40, max: 85 } });
    expect(design.range.maxReason).toMatch(/\(\u221240 °C, max part\)/);
    const text = [design.range.minReason, design.range.maxReason, ...design.reasons, ...design.warnings, ...design.assumptions].join('\n');
    expect(text).not.toMatch(/-\d/);
    expect(text).toMatch(/resistor at \+5 %/);
  });

  it('no resistor when the minimum supply does not clear the diode', () => {
    const design = designRegulator({ ...request, supply: { min: 4.5, max: 13.2 } });
    expect(design.verdict).toBe('no-solution');
    expect(design.reasons[0]).toMatch(/minimum supply 4\.500 V is not above/);
  });

  it('no resistor when the supply range is too wide for the power', () => {
    const design = designRegulator({ ...request, supply: { min: 7, max: 30 }, load: { min: 0, max: 0.02 } });
    expect(design.verdict).toBe('no-solution');
    expect(design.reasons.join(' ')).toMatch(/power limit needs at least .* but the knee needs at most/);
  });

  it('no data, never ok, without a power rating or izm', () => {
    const bare = { vzNom: 5.1, izt: 0.02, zzt: 17, izk: 0.001, zzk: 550 };
    const design = designRegulator({ ...request, card: bare });
    expect(design.verdict).toBe('no-data');
    expect(design.reasons[0]).toMatch(/no data: no power limit/);
  });

  it('an ok design keeps every corner above the knee and inside the power (fast-check)', () => {
    let ok = 0;
    fc.assert(
      fc.property(cardArbitrary, logUniform(1.3, 3), logUniform(0.01, 0.2), logUniform(1e-4, 0.05), (card, headroom, spread, loadMax) => {
        const nom = card.vzNom * headroom;
        const design = designRegulator({
          card: { ...card, izk: card.izk ?? card.izt / 10, zzk: card.zzk ?? card.zzt! * 10, pdMax: 1, tjMax: 175 },
          supply: { min: nom * (1 - spread), nom, max: nom * (1 + spread) },
          load: { min: 0, max: loadMax },
          ambient: { min: -20, max: 70 },
          resistor: { series: 'E96', tolerance: 0.01 },
        });
        if (design.verdict !== 'ok') return;
        ok++;
        for (const corner of design.outputBand!.corners) {
          expect(corner.belowKnee).toBe(false);
          expect(corner.overPower).toBe(false);
        }
      }),
      { numRuns: 200, seed: 3006 },
    );
    // Enough designs must succeed for the property to mean something.
    expect(ok).toBeGreaterThan(40);
  });
});

describe('the regulator request schema names bad fields', () => {
  it('supply order, load order and resistor series', () => {
    const result = regulatorRequestSchema.safeParse({
      card: { vzNom: 5.1, izt: 0.02 },
      supply: { min: 12, max: 10 },
      load: { min: 0.02, max: 0.01 },
      ambient: { min: 0, max: 50 },
      resistor: { series: 'E12', tolerance: 0.05 },
    });
    expect(result.error!.issues.map((i) => i.path.join('.'))).toEqual(expect.arrayContaining(['supply.min', 'load.min', 'resistor.series']));
  });
});
