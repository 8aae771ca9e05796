import type { ToleranceCorner } from '@shuntwise/contracts';
import type { BreakdownModel } from './breakdown-model';
import { T_REF_C } from './physics';

export interface SpiceModelOptions {
  /** Model name; anything but letters, digits and _ becomes _ (default DZ). */
  name?: string;
  /** Export the low or high tolerance part instead of the nominal one. */
  corner?: ToleranceCorner;
  /** Add RTH0 = rthJA for ngspice's self-heating diode (instance needs a thermal node and the `thermal` flag). */
  thermal?: boolean;
}

/**
 * The card as an ngspice diode `.model` line. Checked in ngspice 45 (eecircuit-engine):
 * it reads the breakdown coefficient as TCV, with TLEV=0 as BV(T) = BV − TCV·(T − TNOM),
 * so a positive TCV lowers BV and TCV = −αVz (TBV1 is read the same way; TCV is the name
 * its diode documents). NBV·Vt follows the absolute temperature. TNOM is set to 25 °C
 * because ngspice's default is 27 °C. An unknown parameter is a fatal ngspice error, so
 * nothing else is written.
 */
export function spiceModelLine(model: BreakdownModel, options: SpiceModelOptions = {}): string {
  const name = (options.name ?? 'DZ').replace(/[^A-Za-z0-9_]/g, '_') || 'DZ';
  const corner = options.corner ?? 'nom';
  const vz = corner === 'nom' ? model.vzNom : corner === 'min' ? model.vzLow : model.vzHigh;
  const parts = [
    `BV=${num(vz - model.rs * model.izt)}`,
    `IBV=${num(model.ibv)}`,
    `NBV=${num(model.nbv)}`,
    `RS=${num(model.rs)}`,
    `TCV=${num(-model.alphaVz)}`,
    'TLEV=0',
    `TNOM=${T_REF_C}`,
  ];
  if (options.thermal && model.rthJA !== null) parts.push(`RTH0=${num(model.rthJA)}`);
  return `.model ${name} D(${parts.join(' ')})`;
}

/** Plain decimal or exponent notation: SPICE would read a trailing "m" or "M" as milli. */
function num(x: number): string {
  const text = Number(x.toPrecision(12)).toString();
  return text === '-0' ? '0' : text;
}
