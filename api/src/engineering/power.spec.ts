import type { EngineeringCard } from '@shuntwise/contracts';
import { fitBreakdownModel } from './breakdown-model';
import { deratedPowerLimit, powerCheck } from './power';

const card: EngineeringCard = { vzNom: 5.1, vzMin: 4.85, vzMax: 5.36, izt: 0.02, zzt: 17, pdMax: 0.5, tjMax: 175 };

describe('power rating derated linearly to zero at tjMax', () => {
  it('500 mW at 25 °C with tjMax 175 °C allows 250 mW at 100 °C and nothing at 175 °C (common practice: linear derating curve, no source)', () => {
    expect(deratedPowerLimit(card, 25).limit).toBeCloseTo(0.5, 12);
    expect(deratedPowerLimit(card, -40).limit).toBeCloseTo(0.5, 12);
    expect(deratedPowerLimit(card, 100).limit).toBeCloseTo(0.25, 12);
    expect(deratedPowerLimit(card, 175).limit).toBe(0);
    expect(deratedPowerLimit(card, 190).limit).toBe(0);
  });

  it('through rthJA the limit is (tjMax − Ta)/RthJA: 150 °C, 250 K/W at 50 °C gives 400 mW (common practice, no source)', () => {
    const limit = deratedPowerLimit({ vzNom: 5.1, izt: 0.02, tjMax: 150, rthJA: 250 }, 50);
    expect(limit.basis).toBe('rthJA');
    expect(limit.limit).toBeCloseTo(0.4, 12);
  });

  it('takes the lower of the two when both are given', () => {
    const both = { ...card, rthJA: 400 }; // (175 − 25)/400 = 375 mW < 500 mW
    expect(deratedPowerLimit(both, 25)).toMatchObject({ basis: 'rthJA' });
    expect(deratedPowerLimit(both, 25).limit).toBeCloseTo(0.375, 12);
  });

  it('has no limit above the reference temperature without tjMax', () => {
    const limit = deratedPowerLimit({ vzNom: 5.1, izt: 0.02, pdMax: 0.5 }, 60);
    expect(limit.limit).toBeNull();
    expect(limit.reason).toMatch(/no TJ max/);
  });
});

describe('worst-case power check over an envelope', () => {
  const envelope = { iMin: 0.005, iMax: 0.05, taMin: -20, taMax: 100 };

  it('passes within the policy fraction and fails beyond it (the worst corner: highest current, hottest ambient)', () => {
    const model = fitBreakdownModel(card);
    // Upper bound by hand: vzMax at 50 mA is about 5.36 V + a·ln 2.5 = 5.67 V → 0.28 W; at 100 °C the rating is 0.25 W.
    const strict = powerCheck(model, card, envelope, { policyFraction: 1 });
    expect(strict.verdict).toBe('fail');
    expect(strict.at?.taC).toBe(100);
    expect(strict.power!).toBeGreaterThan(0.27);
    expect(strict.power!).toBeLessThan(0.29);
    const cool = powerCheck(model, card, { ...envelope, taMax: 40 }, { policyFraction: 0.8 });
    expect(cool.verdict).toBe('pass');
    expect(cool.allowed).toBeCloseTo((0.8 * 0.5 * (175 - 40)) / 150, 12);
  });

  it('states its policy as a percentage without float noise (0.07 × 100 is 7.000000000000001 in IEEE 754; common practice, no source)', () => {
    const check = powerCheck(fitBreakdownModel(card), card, envelope, { policyFraction: 0.07 });
    expect(check.assumptions[0]).toBe('the diode may dissipate 7 % of its derated rating');
    expect(check.reason).not.toMatch(/-\d/);
  });

  it('is no data, never a pass, when the card cannot be derated', () => {
    const bare = { vzNom: 5.1, izt: 0.02, zzt: 17, pdMax: 0.5 };
    const check = powerCheck(fitBreakdownModel(bare), bare, { iMin: 0.001, iMax: 0.002, taMin: 0, taMax: 70 });
    expect(check.verdict).toBe('no-data');
  });

  it('fails a current above izm', () => {
    const withIzm = { ...card, izm: 0.04 };
    expect(powerCheck(fitBreakdownModel(withIzm), withIzm, { iMin: 0.001, iMax: 0.045, taMin: 0, taMax: 25 }).reason).toMatch(/exceeds IZM/);
  });
});
