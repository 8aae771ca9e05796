import { formatQuantity } from '@shuntwise/contracts';
import { Matrix, QrDecomposition } from 'ml-matrix';
import type { BreakdownModel } from './breakdown-model';
import { K_OVER_Q, T_REF_C, ZERO_CELSIUS_K, thermalVoltage } from './physics';

const celsius = (x: number) => formatQuantity(x, 'temperature', { trim: true });

/** One bench point of a sample in breakdown: reverse current (A, positive), voltage (V), temperature (°C). */
export interface MeasuredPoint {
  readonly current: number;
  readonly voltage: number;
  readonly tempC: number;
}

/**
 * The breakdown model fitted to one sample's points by linear least squares on
 *   V(I, T) = v0 + αVz·(T − 25 °C) + NBV·(k/q)·(T + 273.15)·ln(I/iRef) + RS·(I − iRef)
 * (the SPICE diode's reverse branch, BV + NBV·Vt·ln(I/IBV) + RS·I, written around iRef so v0 is
 * the Zener voltage at iRef and 25 °C). αVz is fitted only when the points span two or more
 * temperatures; otherwise it comes from the caller (the card's coefficient) or is taken as 0 —
 * either way the fit says so. `model` plugs into diodeVoltage/dynamicImpedance of the core.
 */
export interface MeasuredFit {
  readonly model: BreakdownModel;
  readonly points: number;
  readonly temperaturesC: readonly number[];
  /** Root-mean-square and largest absolute residual (V). */
  readonly residualRms: number;
  readonly residualMax: number;
  /** Lowest and highest measured current (A): the model is interpolation only inside them. */
  readonly currentMin: number;
  readonly currentMax: number;
  readonly alphaFitted: boolean;
  readonly assumptions: string[];
  readonly warnings: string[];
}

export interface MeasuredFitOptions {
  /** The current v0 is stated at (A): the card's izt is the natural choice. */
  readonly referenceCurrent: number;
  /** dVz/dT (V/K) to move single-temperature points to 25 °C, when the points cannot give it. */
  readonly alphaVzFallback?: number | null;
}

/** Why a set of points cannot be fitted; the message names what is wrong. */
export class MeasuredFitError extends Error {}

const MIN_POINTS = 4;
/** Temperatures closer than this (K) count as one. */
const SAME_TEMPERATURE_K = 2;

/** Fits the breakdown model to one sample (SI units). Throws MeasuredFitError for unusable points. */
export function fitMeasuredSample(points: readonly MeasuredPoint[], options: MeasuredFitOptions): MeasuredFit {
  const iRef = options.referenceCurrent;
  if (!(iRef > 0)) throw new MeasuredFitError('the reference current must be above 0 A');
  const usable = points.filter((p) => p.current > 0 && Number.isFinite(p.voltage) && Number.isFinite(p.tempC));
  if (usable.length < MIN_POINTS) {
    throw new MeasuredFitError(`${usable.length} usable point(s) with a current above 0 A: at least ${MIN_POINTS} are needed`);
  }
  const currents = usable.map((p) => p.current);
  const currentMin = Math.min(...currents);
  const currentMax = Math.max(...currents);
  if (currentMax / currentMin < 3) {
    throw new MeasuredFitError('the points span less than a factor of 3 in current: the slope of the curve cannot be told from noise');
  }
  const temperaturesC = distinctTemperatures(usable.map((p) => p.tempC));
  const alphaFitted = temperaturesC.length >= 2;
  const assumptions: string[] = ['least squares on V(I, T) = v0 + αVz·(T − 25 °C) + NBV·Vt(T)·ln(I/iRef) + RS·(I − iRef)'];
  const warnings: string[] = [];

  let alpha = 0;
  if (!alphaFitted) {
    const t = temperaturesC[0];
    if (Math.abs(t - T_REF_C) > SAME_TEMPERATURE_K) {
      if (options.alphaVzFallback != null) {
        alpha = options.alphaVzFallback;
        assumptions.push(`points at ${celsius(t)} only: moved to 25 °C with the card's temperature coefficient`);
      } else {
        warnings.push(`points at ${celsius(t)} only and no temperature coefficient: Vz is stated at ${celsius(t)}, not 25 °C`);
      }
    } else {
      assumptions.push('points at one temperature near 25 °C: αVz not fitted');
    }
  }

  // Columns: v0, [αVz], NBV, RS. Scaled so the least-squares problem is well conditioned.
  const row = (p: MeasuredPoint): number[] => {
    const logTerm = K_OVER_Q * (p.tempC + ZERO_CELSIUS_K) * Math.log(p.current / iRef);
    return alphaFitted ? [1, p.tempC - T_REF_C, logTerm, p.current - iRef] : [1, logTerm, p.current - iRef];
  };
  const target = (p: MeasuredPoint): number => (alphaFitted ? p.voltage : p.voltage - alpha * (p.tempC - T_REF_C));

  let coefficients = solve(usable.map(row), usable.map(target));
  let rs = coefficients[coefficients.length - 1];
  if (rs < 0) {
    // A physical junction has RS ≥ 0: refit without the RS column and report it.
    const rowsNoRs = usable.map((p) => row(p).slice(0, -1));
    coefficients = [...solve(rowsNoRs, usable.map(target)), 0];
    rs = 0;
    warnings.push('the free fit gave a negative series resistance: RS clamped to 0 Ω and refitted');
  }
  const v0 = coefficients[0];
  if (alphaFitted) alpha = coefficients[1];
  const nbv = coefficients[alphaFitted ? 2 : 1];
  if (!(nbv > 0)) {
    throw new MeasuredFitError('the voltage does not rise with the logarithm of the current: these points do not look like a breakdown curve');
  }

  const residuals = usable.map((p) => {
    const predicted = row(p).reduce((sum, x, k) => sum + x * coefficients[k], 0) + (alphaFitted ? 0 : alpha * (p.tempC - T_REF_C));
    return p.voltage - predicted;
  });
  const residualRms = Math.sqrt(residuals.reduce((s, r) => s + r * r, 0) / residuals.length);
  const residualMax = Math.max(...residuals.map(Math.abs));

  const nbvVt = nbv * thermalVoltage(T_REF_C);
  const model: BreakdownModel = {
    vzNom: v0,
    vzLow: v0,
    vzHigh: v0,
    hasVzMin: false,
    hasVzMax: false,
    izt: iRef,
    nbvVt,
    nbv,
    rs,
    bv: v0 - rs * iRef,
    ibv: iRef,
    alphaVz: alpha,
    hasAlpha: alphaFitted || options.alphaVzFallback != null,
    rthJA: null,
    lowestTestCurrent: currentMin,
    basis: 'measured',
    assumptions,
    warnings,
  };
  return { model, points: usable.length, temperaturesC, residualRms, residualMax, currentMin, currentMax, alphaFitted, assumptions, warnings };
}

/** Mean, extremes and sample standard deviation (n − 1; 0 for one value) of a list. */
export interface Spread {
  readonly n: number;
  readonly mean: number;
  readonly min: number;
  readonly max: number;
  readonly stdDev: number;
}

export function spreadOf(values: readonly number[]): Spread | null {
  if (values.length === 0) return null;
  const n = values.length;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const variance = n > 1 ? values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1) : 0;
  return { n, mean, min: Math.min(...values), max: Math.max(...values), stdDev: Math.sqrt(variance) };
}

function distinctTemperatures(values: number[]): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  const groups: number[][] = [];
  for (const t of sorted) {
    const last = groups[groups.length - 1];
    if (last && t - last[0] <= SAME_TEMPERATURE_K) last.push(t);
    else groups.push([t]);
  }
  return groups.map((g) => g.reduce((s, v) => s + v, 0) / g.length);
}

/** Least squares by QR on column-scaled data (the columns differ by many orders of magnitude). */
function solve(rows: number[][], target: number[]): number[] {
  const columns = rows[0].length;
  const scale = Array.from({ length: columns }, (_, k) => Math.max(...rows.map((r) => Math.abs(r[k]))) || 1);
  const a = new Matrix(rows.map((r) => r.map((x, k) => x / scale[k])));
  const qr = new QrDecomposition(a);
  if (!qr.isFullRank()) throw new MeasuredFitError('the points do not determine the curve (too few distinct currents or temperatures)');
  const x = qr.solve(Matrix.columnVector(target)).to1DArray();
  return x.map((v, k) => v / scale[k]);
}
