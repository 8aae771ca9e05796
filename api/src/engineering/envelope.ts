import { formatQuantity, type Envelope, type EnvelopeCorner, type ToleranceCorner, type VoltageWindow } from '@shuntwise/contracts';
import { diodeVoltage, type BreakdownModel } from './breakdown-model';
import { junctionTemperatureC } from './self-heating';

const celsius = (x: number) => formatQuantity(x, 'temperature', { trim: true });

export interface WindowOptions {
  /** Self-heating from the card's rthJA (default true). */
  selfHeating?: boolean;
  /** Include vzMin/vzMax (default true). */
  includeTolerance?: boolean;
  /**
   * Currents tried between iMin and iMax, log-spaced, ends included (default 9): with a
   * negative coefficient self-heating can bend V(I) so that the extreme is not at an end.
   */
  currentSamples?: number;
}

/**
 * Lowest and highest diode voltage (V) over an envelope: currents iMin..iMax (A) × the two
 * ambient ends (°C) × the tolerance ends, each with self-heating iterated to convergence.
 */
export function worstCaseWindow(model: BreakdownModel, envelope: Envelope, options: WindowOptions = {}): VoltageWindow {
  const selfHeating = options.selfHeating ?? true;
  const includeTolerance = options.includeTolerance ?? true;
  const samples = envelope.iMin === envelope.iMax ? 1 : Math.max(2, options.currentSamples ?? 9);
  const assumptions: string[] = [];
  const warnings: string[] = [];
  const lowCorner: ToleranceCorner = includeTolerance && model.hasVzMin ? 'min' : 'nom';
  const highCorner: ToleranceCorner = includeTolerance && model.hasVzMax ? 'max' : 'nom';
  const toleranceIncluded = includeTolerance && model.hasVzMin && model.hasVzMax;
  if (includeTolerance && !toleranceIncluded) warnings.push('the card lacks VZ min or VZ max: the window leaves that tolerance end out');
  const heating = selfHeating && model.rthJA !== null;
  if (selfHeating && model.rthJA === null) warnings.push('no RthJA on the card: the window is computed at Tj = Ta');
  if (heating) assumptions.push('Tj = Ta + RthJA·Vz·I, iterated to convergence');
  if (envelope.iMin < model.lowestTestCurrent)
    warnings.push('the lowest current lies below the lowest current the card was measured at: the low end is extrapolated');

  let atMin: EnvelopeCorner | null = null;
  let atMax: EnvelopeCorner | null = null;
  const step = samples === 1 ? 0 : Math.log(envelope.iMax / envelope.iMin) / (samples - 1);
  const ambients = envelope.taMin === envelope.taMax ? [envelope.taMin] : [envelope.taMin, envelope.taMax];
  const tolCorners: ToleranceCorner[] = lowCorner === highCorner ? [lowCorner] : [lowCorner, highCorner];
  for (let s = 0; s < samples; s++) {
    const current = s === samples - 1 ? envelope.iMax : envelope.iMin * Math.exp(step * s);
    for (const taC of ambients) {
      for (const corner of tolCorners) {
        const tjC = heating ? junctionTemperatureC(model, current, taC, corner) : taC;
        if (Number.isNaN(tjC)) {
          warnings.push(`thermal runaway at ${formatQuantity(current, 'current')} and ${celsius(taC)}: that corner has no steady state`);
          continue;
        }
        const voltage = diodeVoltage(model, current, tjC, corner);
        if (corner === lowCorner && (atMin === null || voltage < atMin.voltage)) atMin = { current, taC, tjC, corner, voltage };
        if (corner === highCorner && (atMax === null || voltage > atMax.voltage)) atMax = { current, taC, tjC, corner, voltage };
      }
    }
  }
  if (atMin === null || atMax === null) throw new Error('no corner of the envelope reaches a steady state');
  return { vMin: atMin.voltage, vMax: atMax.voltage, atMin, atMax, toleranceIncluded, selfHeating: heating, assumptions, warnings };
}
