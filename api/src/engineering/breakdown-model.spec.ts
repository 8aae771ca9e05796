import fc from 'fast-check';
import type { EngineeringCard } from '@shuntwise/contracts';
import { currentAtVoltage, diodeVoltage, dynamicImpedance, fitBreakdownModel, kneeRatio, voltageSpan } from './breakdown-model';
import { EngineeringInputError } from './engineering-input.error';
import { cardArbitrary, logUniform } from './testing/card-arbitraries';

const corners = fc.constantFrom('min' as const, 'nom' as const, 'max' as const);

describe('fitting the SPICE reverse-breakdown law V = BV + NBV·Vt·ln(I/IBV) + RS·I to a card', () => {
  it('solves NBV·Vt and RS exactly from two impedance points (SPICE diode law, solved by hand)', () => {
    // Zd = a/I + RS: 5 = a/0.02 + RS and 20 = a/0.004 + RS give a = 0.075 V, RS = 1.25 Ω.
    const model = fitBreakdownModel({ vzNom: 6.8, izt: 0.02, zzt: 5, izk: 0.004, zzk: 20 });
    expect(model.basis).toBe('two-point');
    expect(model.nbvVt).toBeCloseTo(0.075, 12);
    expect(model.rs).toBeCloseTo(1.25, 12);
    // NBV = a/Vt(25 °C) with Vt = 25.6926 mV (CODATA 2018); BV = vzNom − RS·izt.
    expect(model.nbv).toBeCloseTo(0.075 / 0.0256926, 4);
    expect(model.bv).toBeCloseTo(6.8 - 1.25 * 0.02, 12);
    expect(model.ibv).toBe(0.02);
  });

  it('clamps a negative RS to 0, keeps zzt at izt and says what the knee loses (DESIGN: clamp and report)', () => {
    // a = 533·0.001·0.02/0.019 = 0.561 V, RS = 17 − 28.05 = −11.05 Ω (by hand).
    const model = fitBreakdownModel({ vzNom: 5.1, izt: 0.02, zzt: 17, izk: 0.001, zzk: 550 });
    expect(model.basis).toBe('clamped');
    expect(model.rs).toBe(0);
    expect(model.nbvVt).toBeCloseTo(17 * 0.02, 12);
    expect(model.warnings.join(' ')).toMatch(/RS = −11\.1 Ω .*clamped.*340 Ω against the card's 550 Ω/);
  });

  it('ignores a knee point with zzk below zzt (NBV would be negative) and reports it', () => {
    const model = fitBreakdownModel({ vzNom: 12, izt: 0.01, zzt: 20, izk: 0.001, zzk: 10 });
    expect(model.basis).toBe('clamped');
    expect(model.nbv).toBeGreaterThan(0);
    expect(model.warnings[0]).toMatch(/ZZK .* is not above ZZT/);
  });

  it('with one impedance point assumes RS = 0 and says so', () => {
    const fromIzt = fitBreakdownModel({ vzNom: 3.3, izt: 0.005, zzt: 28 });
    expect(fromIzt.basis).toBe('izt-only');
    expect(fromIzt.rs).toBe(0);
    expect(fromIzt.assumptions.join(' ')).toMatch(/RS assumed 0/);
    const fromKnee = fitBreakdownModel({ vzNom: 24, izt: 0.01, izk: 0.00025, zzk: 600 });
    expect(fromKnee.basis).toBe('izk-only');
    expect(dynamicImpedance(fromKnee, 0.00025)).toBeCloseTo(600, 9);
  });

  it('without any impedance marks Zd as no data', () => {
    const model = fitBreakdownModel({ vzNom: 10, izt: 0.0125 });
    expect(model.basis).toBe('none');
    expect(model.warnings[0]).toMatch(/no impedance on the card/);
  });

  it('refuses a self-contradicting card with every field named', () => {
    const bad: EngineeringCard = { vzNom: 5.1, vzMin: 5.3, vzMax: 5.0, izt: 0.02, izk: 0.03 };
    expect(() => fitBreakdownModel(bad)).toThrow(EngineeringInputError);
    try {
      fitBreakdownModel(bad);
    } catch (error) {
      expect((error as EngineeringInputError).problems.map((p) => p.field)).toEqual(['vzMin', 'vzMax', 'izk']);
    }
  });

  it('moves Vz at izt by αVz·ΔT (DESIGN: Vz(Tj) = Vz(25 °C) + αVz·(Tj − 25 °C))', () => {
    const model = fitBreakdownModel({ vzNom: 12, izt: 0.02, zzt: 9, tc: 8.5e-3 });
    expect(diodeVoltage(model, 0.02, 125) - diodeVoltage(model, 0.02, 25)).toBeCloseTo(0.0085 * 100, 12);
  });

  it('gives the knee ratio and span of the fitted law (hand calculation from a = 0.075 V, RS = 1.25 Ω)', () => {
    const model = fitBreakdownModel({ vzNom: 6.8, izt: 0.02, zzt: 5, izk: 0.004, zzk: 20 });
    expect(kneeRatio(model, 0.004, 0.02)).toBeCloseTo(20 / 5, 9);
    // V(20 mA) − V(4 mA) = a·ln 5 + RS·16 mA = 0.12071 + 0.02 = 0.14071 V.
    expect(voltageSpan(model, 0.004, 0.02)).toBeCloseTo(0.075 * Math.log(5) + 1.25 * 0.016, 9);
  });
});

describe('properties of the fitted law (fast-check)', () => {
  it('V(I) is strictly increasing at any junction temperature and tolerance corner', () => {
    fc.assert(
      fc.property(
        cardArbitrary,
        logUniform(1e-5, 0.5),
        logUniform(1.0001, 100),
        fc.double({ min: -55, max: 175, noNaN: true }),
        corners,
        (card, i, ratio, tj, corner) => {
          const model = fitBreakdownModel(card);
          expect(diodeVoltage(model, i * ratio, tj, corner)).toBeGreaterThan(diodeVoltage(model, i, tj, corner));
        },
      ),
    );
  });

  it('Zd is positive and non-increasing in I', () => {
    fc.assert(
      fc.property(cardArbitrary, logUniform(1e-5, 0.5), logUniform(1, 100), fc.double({ min: -55, max: 175, noNaN: true }), (card, i, ratio, tj) => {
        const model = fitBreakdownModel(card);
        const low = dynamicImpedance(model, i, tj);
        expect(low).toBeGreaterThan(0);
        expect(dynamicImpedance(model, i * ratio, tj)).toBeLessThanOrEqual(low);
      }),
    );
  });

  it('every fit has NBV > 0 and RS ≥ 0, anchors V(izt, 25 °C) = vzNom and keeps zzt at izt', () => {
    fc.assert(
      fc.property(cardArbitrary, (card) => {
        const model = fitBreakdownModel(card);
        expect(model.nbv).toBeGreaterThan(0);
        expect(model.rs).toBeGreaterThanOrEqual(0);
        expect(diodeVoltage(model, card.izt, 25)).toBeCloseTo(card.vzNom, 12);
        expect(diodeVoltage(model, card.izt, 25, 'min')).toBeCloseTo(card.vzMin!, 12);
        expect(dynamicImpedance(model, card.izt) / card.zzt!).toBeCloseTo(1, 12);
        if (model.basis === 'two-point') expect(dynamicImpedance(model, card.izk!) / card.zzk!).toBeCloseTo(1, 12);
      }),
    );
  });

  it('currentAtVoltage inverts V(I)', () => {
    fc.assert(
      fc.property(cardArbitrary, logUniform(1e-4, 0.2), fc.double({ min: -40, max: 150, noNaN: true }), (card, i, tj) => {
        const model = fitBreakdownModel(card);
        expect(currentAtVoltage(model, diodeVoltage(model, i, tj), tj) / i).toBeCloseTo(1, 9);
      }),
    );
  });
});
