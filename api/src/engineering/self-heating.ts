import type { ToleranceCorner } from '@shuntwise/contracts';
import { diodeVoltage, type BreakdownModel } from './breakdown-model';
import { K_OVER_Q, T_REF_C, ZERO_CELSIUS_K } from './physics';

/** Stop when the junction temperature moves less than this between iterations (K). */
const TJ_TOLERANCE_K = 1e-9;
const MAX_ITERATIONS = 20;

/**
 * Junction temperature (°C) of a diode carrying `current` (A) at ambient `taC` (°C):
 * Tj = Ta + RthJA·V(I, Tj)·I, solved by Newton iteration to convergence (V is affine in Tj
 * here, so one step lands and the next confirms). Ta when the card has no rthJA; NaN on
 * thermal runaway, when RthJA·I·dV/dTj ≥ 1 and no steady state exists.
 */
export function junctionTemperatureC(model: BreakdownModel, current: number, taC: number, corner: ToleranceCorner = 'nom'): number {
  const rth = model.rthJA;
  if (rth === null) return taC;
  // V(Tj) = v25 + slope·(Tj − 25 °C), the same law as diodeVoltage with its logarithm taken once.
  const ln = Math.log(current / model.izt);
  const slope = model.alphaVz + model.nbv * K_OVER_Q * ln;
  const loopGain = rth * current * slope;
  if (loopGain >= 1) return Number.NaN;
  const vz = corner === 'nom' ? model.vzNom : corner === 'min' ? model.vzLow : model.vzHigh;
  const v25 = vz + model.nbv * K_OVER_Q * (T_REF_C + ZERO_CELSIUS_K) * ln + model.rs * (current - model.izt);
  let tj = taC;
  for (let k = 0; k < MAX_ITERATIONS; k++) {
    const residual = tj - taC - rth * (v25 + slope * (tj - T_REF_C)) * current;
    if (Math.abs(residual) < TJ_TOLERANCE_K) return tj;
    tj -= residual / (1 - loopGain);
  }
  return Number.NaN;
}

/** Diode voltage (V) at a current (A) and ambient (°C) with self-heating when asked for and possible. */
export function voltageAtAmbient(model: BreakdownModel, current: number, taC: number, corner: ToleranceCorner = 'nom', selfHeating = true): number {
  const tj = selfHeating ? junctionTemperatureC(model, current, taC, corner) : taC;
  return diodeVoltage(model, current, tj, corner);
}
