import type { ToleranceCorner } from '@shuntwise/contracts';
import { diodeVoltage, type BreakdownModel } from './breakdown-model';

/** Stop when the junction temperature moves less than this between iterations (K). */
const TJ_TOLERANCE_K = 1e-9;
const MAX_ITERATIONS = 100;

/**
 * Junction temperature (°C) of a diode carrying `current` (A) at ambient `taC` (°C):
 * Tj = Ta + RthJA·V(I, Tj)·I, iterated to convergence. Ta when the card has no rthJA;
 * NaN when the iteration does not settle (thermal runaway: RthJA·I·dV/dT ≥ 1).
 */
export function junctionTemperatureC(model: BreakdownModel, current: number, taC: number, corner: ToleranceCorner = 'nom'): number {
  const rth = model.rthJA;
  if (rth === null) return taC;
  let tj = taC;
  for (let k = 0; k < MAX_ITERATIONS; k++) {
    const next = taC + rth * diodeVoltage(model, current, tj, corner) * current;
    if (Math.abs(next - tj) < TJ_TOLERANCE_K) return next;
    tj = next;
  }
  return Number.NaN;
}

/** Diode voltage (V) at a current (A) and ambient (°C) with self-heating when asked for and possible. */
export function voltageAtAmbient(
  model: BreakdownModel,
  current: number,
  taC: number,
  corner: ToleranceCorner = 'nom',
  selfHeating = true,
): number {
  const tj = selfHeating ? junctionTemperatureC(model, current, taC, corner) : taC;
  return diodeVoltage(model, current, tj, corner);
}
