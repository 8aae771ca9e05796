import type { EngineeringCardInput } from '@shuntwise/contracts';
import { dynamicImpedance, voltageSpan, type BreakdownModel } from './breakdown-model';
import { T_REF_C } from './physics';

/** The card's knee region at 25 °C: Zd at a current and the voltage span between two currents. */
export interface KneeReading {
  zd(current: number): number;
  span(iLow: number, iHigh: number): number;
  assumption: string;
}

/**
 * Zd = zzt·(izt/I)^p through the card's two impedance points, and the voltage span it
 * gives between iLow and iHigh (the integral of Zd dI).
 */
export function powerLawKnee(
  izt: number,
  zzt: number,
  izk: number,
  zzk: number,
): { p: number; zd(current: number): number; span(iLow: number, iHigh: number): number } {
  const p = Math.log(zzk / zzt) / Math.log(izt / izk);
  return {
    p,
    zd: (i) => zzt * (izt / i) ** p,
    span: (a, b) => (Math.abs(p - 1) < 1e-12 ? zzt * izt * Math.log(b / a) : (zzt * izt ** p * (b ** (1 - p) - a ** (1 - p))) / (1 - p)),
  };
}

/**
 * How the knee is read from a card: the two-point fit when it is physical. When the two
 * points need RS < 0 (Zd falling faster than 1/I, usually printed values rounded), the
 * clamped model would understate the knee, so the card's points are joined by the power law
 * of powerLawKnee instead, which passes through both. Without a knee point there is no
 * vendor data for the knee at all.
 */
export function kneeReading(model: BreakdownModel, card: EngineeringCardInput): KneeReading | { missing: string } {
  if (model.basis === 'two-point') {
    return {
      zd: (i) => dynamicImpedance(model, i, T_REF_C),
      span: (a, b) => voltageSpan(model, a, b, T_REF_C),
      assumption: 'Zd(I) = NBV·Vt/I + RS through both impedance points of the card',
    };
  }
  if (model.basis === 'clamped' && card.zzt != null && card.zzk != null && card.izk != null && card.zzk > card.zzt) {
    const law = powerLawKnee(card.izt, card.zzt, card.izk, card.zzk);
    return {
      zd: law.zd,
      span: law.span,
      assumption: `the card's impedance points need RS < 0, which no junction has: Zd joined through both points as ZZT·(IZT/I)^p with p = ${Number(law.p.toPrecision(4))}, which does not understate the knee as the clamped fit would`,
    };
  }
  if (model.basis === 'clamped') return { missing: 'the card’s ZZK is not above its ZZT, so its knee point contradicts itself: the knee is not known' };
  return { missing: 'the card gives no knee point (IZK with ZZK): the curve below IZT would be an assumption, not vendor data' };
}
