import {
  formatPercent,
  formatQuantity,
  type EngineeringCardInput,
  type Envelope,
  type EnvelopeCorner,
  type PowerCheck,
  type ToleranceCorner,
} from '@shuntwise/contracts';
import { diodeVoltage, type BreakdownModel } from './breakdown-model';
import { junctionTemperatureC } from './self-heating';

const celsius = (x: number) => formatQuantity(x, 'temperature', { trim: true });

export interface PowerLimit {
  /** Largest dissipation (W) at the ambient, or null when the card cannot say. */
  limit: number | null;
  /** Which rating set it: the linear derating of pdMax, the thermal resistance, or none. */
  basis: 'pdMax' | 'rthJA' | 'none';
  reason: string;
}

/**
 * Power rating (W) at an ambient (°C): pdMax up to its reference temperature, then linear
 * to zero at tjMax; or (tjMax − Ta)/RthJA; the lower of the two when both are known.
 */
export function deratedPowerLimit(card: EngineeringCardInput, taC: number): PowerLimit {
  const pdRefC = card.pdRefC ?? 25;
  let fromPd: number | null = null;
  if (card.pdMax != null) {
    if (taC <= pdRefC) fromPd = card.pdMax;
    else if (card.tjMax != null) fromPd = Math.max(0, (card.pdMax * (card.tjMax - taC)) / (card.tjMax - pdRefC));
  }
  const fromRth = card.rthJA != null && card.tjMax != null ? Math.max(0, (card.tjMax - taC) / card.rthJA) : null;
  if (fromPd !== null && (fromRth === null || fromPd <= fromRth)) {
    return { limit: fromPd, basis: 'pdMax', reason: `PD max derated linearly from ${celsius(pdRefC)} to zero at TJ max` };
  }
  if (fromRth !== null) return { limit: fromRth, basis: 'rthJA', reason: '(TJ max − Ta)/RthJA' };
  if (card.pdMax != null) {
    return { limit: null, basis: 'none', reason: `PD max applies up to ${celsius(pdRefC)} and the card has no TJ max to derate it above` };
  }
  return { limit: null, basis: 'none', reason: 'the card gives neither PD max nor TJ max with RthJA' };
}

export interface PowerCheckOptions {
  /** Largest fraction of the derated rating allowed (the spec's derating policy); default 1. */
  policyFraction?: number;
  selfHeating?: boolean;
}

/**
 * Worst-case dissipation (W) in an envelope — the highest current, each ambient end, the
 * high tolerance part — against policyFraction × the derated rating at that ambient; also
 * fails a current above izm. Missing ratings give 'no-data', never a pass.
 */
export function powerCheck(model: BreakdownModel, card: EngineeringCardInput, envelope: Envelope, options: PowerCheckOptions = {}): PowerCheck {
  const policyFraction = options.policyFraction ?? 1;
  const selfHeating = options.selfHeating ?? true;
  const assumptions = [`the diode may dissipate ${formatPercent(policyFraction)} of its derated rating`];
  const warnings: string[] = [];
  if (selfHeating && model.rthJA === null) warnings.push('no RthJA on the card: dissipation computed at Tj = Ta');
  const corner: ToleranceCorner = model.hasVzMax ? 'max' : 'nom';
  if (!model.hasVzMax) warnings.push('no VZ max on the card: dissipation uses the nominal voltage');

  let worst: { at: EnvelopeCorner; power: number; derated: number | null; allowed: number | null; margin: number } | null = null;
  let noDataReason = '';
  const current = envelope.iMax;
  for (const taC of envelope.taMin === envelope.taMax ? [envelope.taMin] : [envelope.taMin, envelope.taMax]) {
    const tjC = selfHeating ? junctionTemperatureC(model, current, taC, corner) : taC;
    if (Number.isNaN(tjC)) {
      return {
        verdict: 'fail',
        power: null,
        at: null,
        deratedLimit: null,
        policyFraction,
        allowed: null,
        margin: null,
        reason: `thermal runaway at ${amps(current)} and ${celsius(taC)}: the self-heating iteration does not settle`,
        assumptions,
        warnings,
      };
    }
    const voltage = diodeVoltage(model, current, tjC, corner);
    const power = voltage * current;
    const limit = deratedPowerLimit(card, taC);
    const allowed = limit.limit === null ? null : limit.limit * policyFraction;
    const at: EnvelopeCorner = { current, taC, tjC, corner, voltage };
    if (allowed === null) {
      noDataReason = limit.reason;
      if (worst === null || power > worst.power) worst = { at, power, derated: null, allowed: null, margin: Number.NaN };
      continue;
    }
    const margin = allowed - power;
    if (worst === null || Number.isNaN(worst.margin) || margin < worst.margin) worst = { at, power, derated: limit.limit, allowed, margin };
  }
  if (worst === null) throw new Error('unreachable: an envelope has at least one ambient');
  if (card.izm != null && current > card.izm) {
    return {
      verdict: 'fail',
      power: worst.power,
      at: worst.at,
      deratedLimit: worst.derated,
      policyFraction,
      allowed: worst.allowed,
      margin: Number.isNaN(worst.margin) ? null : worst.margin,
      reason: `the highest current (${amps(current)}) exceeds IZM (${amps(card.izm)})`,
      assumptions,
      warnings,
    };
  }
  if (noDataReason !== '' || worst.allowed === null) {
    return {
      verdict: 'no-data',
      power: worst.power,
      at: worst.at,
      deratedLimit: null,
      policyFraction,
      allowed: null,
      margin: null,
      reason: `no power limit at ${celsius(worst.at.taC)}: ${noDataReason}`,
      assumptions,
      warnings,
    };
  }
  const pass = worst.margin >= 0;
  return {
    verdict: pass ? 'pass' : 'fail',
    power: worst.power,
    at: worst.at,
    deratedLimit: worst.derated,
    policyFraction,
    allowed: worst.allowed,
    margin: worst.margin,
    reason: `${watts(worst.power)} at ${amps(current)} and ${celsius(worst.at.taC)} ${pass ? 'within' : 'above'} the allowed ${watts(worst.allowed)}`,
    assumptions,
    warnings,
  };
}

function amps(x: number): string {
  return formatQuantity(x, 'current');
}
function watts(x: number): string {
  return formatQuantity(x, 'power');
}
