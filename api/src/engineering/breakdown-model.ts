import {
  engineeringCardContradictions,
  formatQuantity,
  type BreakdownModelSummary,
  type EngineeringCardInput,
  type ModelBasis,
  type ToleranceCorner,
} from '@shuntwise/contracts';
import { EngineeringInputError } from './engineering-input.error';
import { K_OVER_Q, T_REF_C, ZERO_CELSIUS_K, thermalVoltage } from './physics';

/**
 * A card's breakdown characteristic as the SPICE diode's reverse branch:
 *   V(I, Tj) = vz(corner) + alphaVz·(Tj − 25 °C) + NBV·Vt(Tj)·ln(I/izt) + RS·(I − izt)
 * which is BV + NBV·Vt·ln(I/IBV) + RS·I with IBV = izt and BV = vzNom − RS·izt, so
 * V(izt, 25 °C) = vzNom exactly; Zd(I) = NBV·Vt/I + RS. ngspice scales NBV·Vt with the
 * absolute temperature and shifts BV by −TCV·(T − TNOM); the same law is used here.
 * Build it with fitBreakdownModel; every field is SI.
 */
export interface BreakdownModel {
  readonly vzNom: number;
  /** vz at izt, 25 °C, for the low and high tolerance ends (vzNom when the card has none). */
  readonly vzLow: number;
  readonly vzHigh: number;
  readonly hasVzMin: boolean;
  readonly hasVzMax: boolean;
  readonly izt: number;
  /** NBV·Vt at 25 °C (V), NBV, RS (Ω). */
  readonly nbvVt: number;
  readonly nbv: number;
  readonly rs: number;
  /** SPICE BV (V) and IBV (A). */
  readonly bv: number;
  readonly ibv: number;
  /** dVz/dT at izt (V/K); 0 with hasAlpha false when the card gives none. */
  readonly alphaVz: number;
  readonly hasAlpha: boolean;
  /** Junction-to-ambient thermal resistance (K/W), null when unknown. */
  readonly rthJA: number | null;
  /** Lowest current the card was measured at (A): izk, or izt without a knee point. */
  readonly lowestTestCurrent: number;
  readonly basis: ModelBasis;
  readonly assumptions: string[];
  readonly warnings: string[];
}

const VT_REF = thermalVoltage(T_REF_C);

/**
 * Fits the breakdown model to a card (SI). Two impedance points (izt, zzt) and (izk, zzk)
 * give NBV·Vt and RS exactly; one point assumes RS = 0; a fit with RS < 0 or NBV ≤ 0 is
 * clamped and reported. Throws EngineeringInputError for a self-contradicting card.
 */
export function fitBreakdownModel(card: EngineeringCardInput): BreakdownModel {
  const problems = engineeringCardContradictions(card);
  if (problems.length > 0) throw new EngineeringInputError(problems);
  const assumptions: string[] = [];
  const warnings: string[] = [];
  const { vzNom, izt } = card;
  const zzt = card.zzt ?? null;
  const izk = card.izk ?? null;
  const zzk = card.zzk ?? null;

  let nbvVt: number;
  let rs: number;
  let basis: ModelBasis;
  if (zzt !== null && izk !== null && zzk !== null) {
    // zzt = a/izt + RS and zzk = a/izk + RS: two equations, two unknowns.
    const a = ((zzk - zzt) * izk * izt) / (izt - izk);
    const r = zzt - a / izt;
    if (a <= 0) {
      basis = 'clamped';
      nbvVt = zzt * izt;
      rs = 0;
      warnings.push(
        `ZZK (${ohm(zzk)}) is not above ZZT (${ohm(zzt)}): a junction's impedance falls with current, so the knee point is ignored; RS = 0 and ZZT is kept at IZT`,
      );
    } else if (r < 0) {
      basis = 'clamped';
      nbvVt = zzt * izt;
      rs = 0;
      warnings.push(
        `the two impedance points give RS = ${ohm(r)} (non-physical): clamped to 0 Ω keeping ZZT at IZT; the model's Zd at IZK is ${ohm(nbvVt / izk)} against the card's ${ohm(zzk)}, so knee checks from this model understate the knee`,
      );
    } else {
      basis = 'two-point';
      nbvVt = a;
      rs = r;
      assumptions.push('NBV·Vt and RS solved exactly from (IZT, ZZT) and (IZK, ZZK)');
    }
  } else if (zzt !== null) {
    basis = 'izt-only';
    nbvVt = zzt * izt;
    rs = 0;
    assumptions.push(
      'one impedance point (IZT, ZZT): RS assumed 0, so all of ZZT comes from the junction term (the steepest knee the model allows for this ZZT)',
    );
  } else if (izk !== null && zzk !== null) {
    basis = 'izk-only';
    nbvVt = zzk * izk;
    rs = 0;
    assumptions.push('one impedance point (IZK, ZZK): RS assumed 0, so Zd at IZT is extrapolated from the knee');
    warnings.push('no ZZT on the card: Zd at IZT comes from the knee point alone');
  } else {
    basis = 'none';
    nbvVt = VT_REF;
    rs = 0;
    warnings.push('no impedance on the card: Zd is no data; V away from IZT assumes an ideal junction (NBV = 1, RS = 0)');
  }
  if ((izk === null) !== (zzk === null)) {
    warnings.push(izk === null ? 'ZZK given without IZK: the knee point is not used' : 'IZK given without ZZK: the knee point is not used');
  }

  let alphaVz = 0;
  const hasAlpha = card.tc != null;
  if (card.tc != null) {
    alphaVz = card.tc;
    assumptions.push('Vz(Tj) = Vz(25 °C) + αVz·(Tj − 25 °C) at IZT; the log term follows Vt = kT/q as in SPICE');
  } else {
    assumptions.push('no temperature coefficient on the card: Vz at IZT taken as constant with temperature');
  }
  const hasVzMin = card.vzMin != null;
  const hasVzMax = card.vzMax != null;
  if (hasVzMin || hasVzMax) {
    assumptions.push('tolerance parts share the nominal curve shifted to VZ min/VZ max at IZT');
  }

  return {
    vzNom,
    vzLow: card.vzMin ?? vzNom,
    vzHigh: card.vzMax ?? vzNom,
    hasVzMin,
    hasVzMax,
    izt,
    nbvVt,
    nbv: nbvVt / VT_REF,
    rs,
    bv: vzNom - rs * izt,
    ibv: izt,
    alphaVz,
    hasAlpha,
    rthJA: card.rthJA ?? null,
    lowestTestCurrent: izk ?? izt,
    basis,
    assumptions,
    warnings,
  };
}

/** vz at izt and 25 °C for a tolerance corner (V). */
export function cornerVz(model: BreakdownModel, corner: ToleranceCorner): number {
  return corner === 'nom' ? model.vzNom : corner === 'min' ? model.vzLow : model.vzHigh;
}

/** Diode voltage (V) at a reverse current (A) and junction temperature (°C), for a tolerance corner. */
export function diodeVoltage(model: BreakdownModel, current: number, tjC: number, corner: ToleranceCorner = 'nom'): number {
  const vz = corner === 'nom' ? model.vzNom : corner === 'min' ? model.vzLow : model.vzHigh;
  return (
    vz + model.alphaVz * (tjC - T_REF_C) + model.nbv * K_OVER_Q * (tjC + ZERO_CELSIUS_K) * Math.log(current / model.izt) + model.rs * (current - model.izt)
  );
}

/** Small-signal dynamic impedance Zd = NBV·Vt(Tj)/I + RS (Ω) at a current (A) and junction temperature (°C). */
export function dynamicImpedance(model: BreakdownModel, current: number, tjC: number = T_REF_C): number {
  return (model.nbv * K_OVER_Q * (tjC + ZERO_CELSIUS_K)) / current + model.rs;
}

/** dV/dTj at a current (V/K): alphaVz plus the log term's temperature slope. */
export function voltageTempSlope(model: BreakdownModel, current: number): number {
  return model.alphaVz + model.nbv * K_OVER_Q * Math.log(current / model.izt);
}

/** Knee ratio Zd(iKnee)/Zd(iRef) at one junction temperature (°C), as specs limit it. */
export function kneeRatio(model: BreakdownModel, iKnee: number, iRef: number, tjC: number = T_REF_C): number {
  return dynamicImpedance(model, iKnee, tjC) / dynamicImpedance(model, iRef, tjC);
}

/** Voltage change (V) of the nominal part from iMin to iMax (A) at one junction temperature (°C). */
export function voltageSpan(model: BreakdownModel, iMin: number, iMax: number, tjC: number = T_REF_C): number {
  return diodeVoltage(model, iMax, tjC) - diodeVoltage(model, iMin, tjC);
}

/** Current (A) at which the corner's diode sits at voltage v (V) at junction temperature tjC (°C); NaN when out of range. */
export function currentAtVoltage(model: BreakdownModel, v: number, tjC: number, corner: ToleranceCorner = 'nom'): number {
  // V is strictly increasing in I: bisect in ln(I) between 1 fA and 1 kA.
  let lo = Math.log(1e-15);
  let hi = Math.log(1e3);
  if (diodeVoltage(model, Math.exp(lo), tjC, corner) > v || diodeVoltage(model, Math.exp(hi), tjC, corner) < v) return NaN;
  for (let k = 0; k < 200 && hi - lo > 1e-13; k++) {
    const mid = 0.5 * (lo + hi);
    if (diodeVoltage(model, Math.exp(mid), tjC, corner) < v) lo = mid;
    else hi = mid;
  }
  return Math.exp(0.5 * (lo + hi));
}

function ohm(value: number): string {
  return formatQuantity(value, 'resistance');
}

/** The fitted model as the API reports it (normalisation, `.model` route, evaluation). */
export function modelSummary(model: BreakdownModel): BreakdownModelSummary {
  return {
    bv: model.bv,
    ibv: model.ibv,
    nbv: model.nbv,
    rs: model.rs,
    nbvVt: model.nbvVt,
    alphaVz: model.hasAlpha ? model.alphaVz : null,
    basis: model.basis,
    assumptions: model.assumptions,
  };
}
