import { formatPercent, formatQuantity, type RegulatorCorner, type RegulatorRequest, type RegulatorResponse, type ToleranceCorner } from '@shuntwise/contracts';
import { diodeVoltage, dynamicImpedance, fitBreakdownModel, type BreakdownModel } from './breakdown-model';
import { DESIGN_CAUTION } from './caution';
import { nearestByRatio, seriesValuesBetween } from './e-series';
import { deratedPowerLimit } from './power';
import { junctionTemperatureC, voltageAtAmbient } from './self-heating';

const celsius = (x: number) => formatQuantity(x, 'temperature', { trim: true });

/** Default lowest diode current as a multiple of izk (common practice, no source). */
export const DEFAULT_KNEE_FACTOR = 5;
/** Without izk the knee limit falls back to this fraction of izt (common practice, no source). */
export const KNEE_FRACTION_OF_IZT = 0.1;

export interface ShuntOperatingPoint {
  /** Output (diode) voltage (V), diode current (A), junction temperature (°C). */
  vOut: number;
  diodeCurrent: number;
  tjC: number;
  /** False when the supply cannot drive the diode into breakdown at this load. */
  inBreakdown: boolean;
}

/**
 * Operating point of supply (V) → series resistance (Ω) → diode in parallel with a load
 * drawing `load` (A), at ambient taC (°C), with self-heating when asked for and possible.
 */
export function solveShuntRegulator(
  model: BreakdownModel,
  supply: number,
  resistance: number,
  load: number,
  taC: number,
  corner: ToleranceCorner = 'nom',
  selfHeating = true,
): ShuntOperatingPoint {
  const open = supply - resistance * load;
  const heat = selfHeating && model.rthJA !== null;
  const excess = (lnI: number): number => {
    const current = Math.exp(lnI);
    const tj = heat ? junctionTemperatureC(model, current, taC, corner) : taC;
    // A runaway junction counts as "too much current".
    if (Number.isNaN(tj)) return Number.NEGATIVE_INFINITY;
    return open - resistance * current - diodeVoltage(model, current, tj, corner);
  };
  let lo = Math.log(1e-15);
  if (open <= 0 || excess(lo) <= 0) return { vOut: open, diodeCurrent: 0, tjC: taC, inBreakdown: false };
  let hi = Math.log(open / resistance);
  // The node voltage is open − R·I, strictly decreasing in I; the diode's is increasing: bisect.
  for (let k = 0; k < 300 && hi - lo > 1e-14; k++) {
    const mid = 0.5 * (lo + hi);
    if (excess(mid) > 0) lo = mid;
    else hi = mid;
  }
  const diodeCurrent = Math.exp(0.5 * (lo + hi));
  const tjC = heat ? junctionTemperatureC(model, diodeCurrent, taC, corner) : taC;
  return { vOut: open - resistance * diodeCurrent, diodeCurrent, tjC, inBreakdown: true };
}

/**
 * Largest diode current (A) whose dissipation V·I stays within `power` (W) at ambient taC
 * (°C); with self-heating the junction then sits at Ta + RthJA·power.
 */
export function currentForPower(model: BreakdownModel, power: number, taC: number, corner: ToleranceCorner = 'nom', selfHeating = true): number {
  const tjC = selfHeating && model.rthJA !== null ? taC + model.rthJA * power : taC;
  let lo = Math.log(1e-15);
  let hi = Math.log(1e3);
  for (let k = 0; k < 300 && hi - lo > 1e-14; k++) {
    const mid = 0.5 * (lo + hi);
    const current = Math.exp(mid);
    if (diodeVoltage(model, current, tjC, corner) * current < power) lo = mid;
    else hi = mid;
  }
  return Math.exp(0.5 * (lo + hi));
}

/**
 * Designs the shunt regulator of `POST /engineering/regulator`: the simple series resistor,
 * the resistor range that keeps the diode above its knee at minimum supply and maximum load
 * and within its derated power (and izm) at maximum supply and minimum load, the nearest
 * E24/E96 value inside it with its tolerance, resistor and diode power, line and load
 * regulation, and the output band over supply × load × ambient × tolerance × resistor.
 */
export function designRegulator(request: RegulatorRequest): RegulatorResponse {
  const { card, supply, load, ambient, resistor } = request;
  const model = fitBreakdownModel(card);
  const tol = resistor.tolerance;
  const selfHeating = request.selfHeating ?? true;
  const heat = selfHeating && model.rthJA !== null;
  const kneeFactor = request.kneeFactor ?? DEFAULT_KNEE_FACTOR;
  const powerFraction = request.powerFraction ?? 1;
  const vsNom = supply.nom ?? (supply.min + supply.max) / 2;
  const targetIz = request.diodeCurrent ?? card.izt;
  const reasons: string[] = [];
  const warnings = [...model.warnings];
  const assumptions = [...model.assumptions];
  if (supply.nom === undefined) assumptions.push(`no nominal supply given: ${volts(vsNom)}, the middle of the range`);
  if (request.diodeCurrent === undefined) assumptions.push('the simple formula aims for the diode current IZT');
  assumptions.push(`the diode may dissipate ${formatPercent(powerFraction)} of its derated power rating`);
  if (heat) assumptions.push('self-heating: Tj = Ta + RthJA·Vz·I, iterated to convergence');
  else if (selfHeating) warnings.push('no RthJA on the card: self-heating left out (Tj = Ta)');
  assumptions.push('the load draws a constant current; the resistor fitted may be anywhere within its tolerance');

  // 1. The simple formula.
  const simpleResistance = vsNom > card.vzNom ? (vsNom - card.vzNom) / (targetIz + load.max) : null;
  if (simpleResistance === null) reasons.push(`the nominal supply ${volts(vsNom)} is not above VZ (${volts(card.vzNom)})`);

  // 2. Knee side: the highest diode voltage at the knee current sets the largest resistor.
  let kneeCurrent: number;
  if (card.izk != null) {
    kneeCurrent = kneeFactor * card.izk;
    assumptions.push(`the diode current stays at least ${kneeFactor} × IZK = ${amps(kneeCurrent)}`);
  } else {
    kneeCurrent = KNEE_FRACTION_OF_IZT * card.izt;
    assumptions.push(`no IZK on the card: the diode current stays at least ${KNEE_FRACTION_OF_IZT * 100} % of IZT = ${amps(kneeCurrent)} (common practice)`);
  }
  if (kneeCurrent > card.izt) warnings.push(`the knee limit ${amps(kneeCurrent)} lies above IZT (${amps(card.izt)})`);
  const ambients = ambient.min === ambient.max ? [ambient.min] : [ambient.min, ambient.max];
  const lowCorner: ToleranceCorner = model.hasVzMin ? 'min' : 'nom';
  const highCorner: ToleranceCorner = model.hasVzMax ? 'max' : 'nom';
  const tolCorners: ToleranceCorner[] = lowCorner === highCorner ? [lowCorner] : [lowCorner, highCorner];
  if (!model.hasVzMin || !model.hasVzMax) warnings.push('the card lacks VZ min or VZ max: that tolerance end is taken as nominal');

  let vKnee = Number.NEGATIVE_INFINITY;
  let vKneeAt = ambients[0];
  for (const taC of ambients) {
    const v = voltageAtAmbient(model, kneeCurrent, taC, highCorner, selfHeating);
    if (v > vKnee) {
      vKnee = v;
      vKneeAt = taC;
    }
  }
  const rMaxActual = (supply.min - vKnee) / (load.max + kneeCurrent);
  let rangeMax: number | null = null;
  let maxReason: string;
  if (rMaxActual > 0) {
    rangeMax = rMaxActual / (1 + tol);
    maxReason = `at ${volts(supply.min)} supply and ${amps(load.max)} load the diode keeps ${amps(kneeCurrent)} at up to ${volts(vKnee)} (${celsius(vKneeAt)}, ${highCorner} part), with the resistor at +${pct(tol)}`;
  } else {
    maxReason = `the minimum supply ${volts(supply.min)} is not above the diode's ${volts(vKnee)} at the knee current`;
    reasons.push(`no resistor works: ${maxReason}`);
  }

  // 3. Power side: the lowest resistor keeps the diode within its allowance at maximum supply and minimum load.
  const allowedPowerAt = (taC: number): number | null => {
    const limit = deratedPowerLimit(card, taC).limit;
    return limit === null ? null : limit * powerFraction;
  };
  let rMinActual = Number.NEGATIVE_INFINITY;
  let minReason = '';
  let allowedDiodeCurrent: number | null = null;
  let powerKnown = true;
  let unlimitedAt: number | null = null;
  for (const taC of ambients) {
    const allowedPower = allowedPowerAt(taC);
    if (allowedPower === null) {
      powerKnown = false;
      if (card.izm == null) {
        unlimitedAt = taC;
        continue;
      }
    }
    for (const corner of tolCorners) {
      let iAllow = allowedPower === null ? Number.POSITIVE_INFINITY : currentForPower(model, allowedPower, taC, corner, selfHeating);
      let limitedBy = allowedPower === null ? '' : `${watts(allowedPower)} allowed at ${celsius(taC)}`;
      if (card.izm != null && card.izm < iAllow) {
        iAllow = card.izm;
        limitedBy = `IZM = ${amps(card.izm)}`;
      }
      const tjC = heat ? junctionTemperatureC(model, iAllow, taC, corner) : taC;
      const v = diodeVoltage(model, iAllow, tjC, corner);
      const r = (supply.max - v) / (load.min + iAllow);
      if (allowedDiodeCurrent === null || iAllow < allowedDiodeCurrent) allowedDiodeCurrent = iAllow;
      if (r > rMinActual) {
        rMinActual = r;
        minReason = `at ${volts(supply.max)} supply and ${amps(load.min)} load the diode may carry ${amps(iAllow)} (${limitedBy}, ${corner} part, ${celsius(taC)}), with the resistor at −${pct(tol)}`;
      }
    }
  }
  let rangeMin: number | null = null;
  if (unlimitedAt !== null) {
    minReason = `no power limit at ${celsius(unlimitedAt)}: ${deratedPowerLimit(card, unlimitedAt).reason}, and no IZM`;
    reasons.push(`no data: ${minReason}`);
  } else if (allowedDiodeCurrent !== null) {
    if (!powerKnown) warnings.push('the power rating cannot be derated over the whole ambient range: only IZM limits the current there');
    rangeMin = Math.max(0, rMinActual) / (1 - tol);
    if (rMinActual <= 0) minReason = `the maximum supply ${volts(supply.max)} cannot drive the diode to its limit at minimum load`;
  }

  // 4. A standard value inside the range, as near the simple formula as the range allows.
  let selected: RegulatorResponse['selected'] = null;
  if (rangeMin !== null && rangeMax !== null) {
    if (rangeMin > rangeMax) {
      reasons.push(
        `no resistor works: the power limit needs at least ${ohms(rangeMin)} but the knee needs at most ${ohms(rangeMax)}; narrow the supply or load range, or use a diode with more power or a lower knee current`,
      );
    } else {
      const candidates = seriesValuesBetween(rangeMin, rangeMax, resistor.series);
      const target = simpleResistance ?? Math.sqrt(Math.max(rangeMin, 1e-9) * rangeMax);
      const resistance = nearestByRatio(target, candidates);
      if (Number.isNaN(resistance)) {
        reasons.push(
          `no ${resistor.series} value lies between ${ohms(rangeMin)} and ${ohms(rangeMax)}: try ${resistor.series === 'E24' ? 'E96 or ' : ''}a tighter tolerance`,
        );
      } else {
        selected = { resistance, series: resistor.series, tolerance: tol, low: resistance * (1 - tol), high: resistance * (1 + tol) };
        if (simpleResistance !== null && (simpleResistance < rangeMin || simpleResistance > rangeMax)) {
          warnings.push(`the simple formula's ${ohms(simpleResistance)} lies outside the working range ${ohms(rangeMin)}…${ohms(rangeMax)}`);
        }
      }
    }
  }

  // 5. Every corner of the circuit with the selected resistor (or the simple one when none fits).
  const bandResistance = selected?.resistance ?? simpleResistance;
  let outputBand: RegulatorResponse['outputBand'] = null;
  let diodePower: number | null = null;
  let diodePowerAllowed: number | null = null;
  let resistorPower: number | null = null;
  let lineRegulation: number | null = null;
  let outputResistance: number | null = null;
  let loadRegulation: number | null = null;
  if (bandResistance !== null && bandResistance > 0) {
    if (selected === null) assumptions.push(`no standard value fits: the output band is shown for the simple formula's ${ohms(bandResistance)}`);
    const corners: RegulatorCorner[] = [];
    const supplies = supply.min === supply.max ? [supply.min] : [supply.min, supply.max];
    const loads = load.min === load.max ? [load.min] : [load.min, load.max];
    const resistances = tol === 0 ? [bandResistance] : [bandResistance * (1 - tol), bandResistance * (1 + tol)];
    for (const vs of supplies) {
      for (const il of loads) {
        for (const taC of ambients) {
          const allowed = allowedPowerAt(taC);
          for (const corner of tolCorners) {
            for (const r of resistances) {
              const op = solveShuntRegulator(model, vs, r, il, taC, corner, selfHeating);
              const p = op.vOut * op.diodeCurrent;
              const overPower = (allowed !== null && p > allowed * (1 + 1e-9)) || (card.izm != null && op.diodeCurrent > card.izm * (1 + 1e-9));
              corners.push({
                supply: vs,
                load: il,
                ambientC: taC,
                corner,
                resistance: r,
                vOut: op.vOut,
                diodeCurrent: op.diodeCurrent,
                tjC: Number.isNaN(op.tjC) ? null : op.tjC,
                diodePower: p,
                resistorPower: ((vs - op.vOut) * (vs - op.vOut)) / r,
                belowKnee: !op.inBreakdown || op.diodeCurrent < kneeCurrent * (1 - 1e-9),
                overPower,
              });
              if (diodePower === null || p > diodePower) {
                diodePower = p;
                diodePowerAllowed = allowed;
              }
            }
          }
        }
      }
    }
    let vMin = Number.POSITIVE_INFINITY;
    let vMax = Number.NEGATIVE_INFINITY;
    for (const c of corners) {
      if (c.vOut < vMin) vMin = c.vOut;
      if (c.vOut > vMax) vMax = c.vOut;
      if (resistorPower === null || c.resistorPower > resistorPower) resistorPower = c.resistorPower;
    }
    outputBand = { vMin, vMax, corners };
    if (corners.some((c) => c.tjC === null)) reasons.push('thermal runaway at some corners: no steady state');
    if (selected !== null) {
      const belowKnee = corners.filter((c) => c.belowKnee).length;
      const overPower = corners.filter((c) => c.overPower).length;
      if (belowKnee > 0) reasons.push(`${belowKnee} corners fall below the knee limit`);
      if (overPower > 0) reasons.push(`${overPower} corners exceed the diode's allowance`);
    }

    // Small-signal figures at the nominal point: Sedra & Smith's rz/(R + rz) and R∥rz.
    const taMid = (ambient.min + ambient.max) / 2;
    const ilMid = (load.min + load.max) / 2;
    const nominal = solveShuntRegulator(model, vsNom, bandResistance, ilMid, taMid, 'nom', selfHeating);
    if (model.basis !== 'none' && nominal.inBreakdown) {
      const zd = dynamicImpedance(model, nominal.diodeCurrent, nominal.tjC);
      lineRegulation = zd / (bandResistance + zd);
      outputResistance = (bandResistance * zd) / (bandResistance + zd);
      const atMinLoad = solveShuntRegulator(model, vsNom, bandResistance, load.min, taMid, 'nom', selfHeating);
      const atMaxLoad = solveShuntRegulator(model, vsNom, bandResistance, load.max, taMid, 'nom', selfHeating);
      loadRegulation = atMinLoad.vOut - atMaxLoad.vOut;
      assumptions.push(`line and load regulation at ${volts(vsNom)} supply, ${amps(ilMid)} load, ${celsius(taMid)}; electrical only (no thermal drift)`);
    } else if (model.basis === 'none') {
      warnings.push('no impedance on the card: line and load regulation are no data');
    }
  }

  let verdict: RegulatorResponse['verdict'];
  if (rangeMax === null) verdict = 'no-solution';
  else if (rangeMin === null) verdict = 'no-data';
  else if (selected !== null && reasons.length === 0) verdict = 'ok';
  else verdict = 'no-solution';
  if (verdict === 'no-solution' && reasons.length === 0) reasons.push('no standard resistor satisfies every corner');

  return {
    verdict,
    reasons,
    simple: { resistance: simpleResistance, supply: vsNom, vz: card.vzNom, diodeCurrent: targetIz, loadMax: load.max },
    range: { min: rangeMin, max: rangeMax, kneeCurrent, allowedDiodeCurrent, minReason, maxReason },
    selected,
    resistorPower,
    diodePower,
    diodePowerAllowed,
    lineRegulation,
    outputResistance,
    loadRegulation,
    outputBand,
    assumptions,
    warnings,
    caution: DESIGN_CAUTION,
  };
}

function volts(x: number): string {
  return formatQuantity(x, 'voltage', { digits: 4 });
}
function amps(x: number): string {
  return formatQuantity(x, 'current');
}
function ohms(x: number): string {
  return formatQuantity(x, 'resistance');
}
function watts(x: number): string {
  return formatQuantity(x, 'power');
}
function pct(x: number): string {
  return formatPercent(x);
}
