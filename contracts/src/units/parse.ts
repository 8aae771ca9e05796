import { QuantityKind, SI_UNIT } from './quantity';

/** A value that could not be read: names the field, the text and what was expected. */
export class UnitParseError extends Error {
  constructor(
    readonly field: string,
    readonly text: string,
    readonly expected: string,
  ) {
    super(`${field}: cannot read "${text}" as ${expected}`);
    this.name = 'UnitParseError';
  }
}

const PREFIX_FACTOR: Record<string, number> = {
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  µ: 1e-6, // micro sign U+00B5
  μ: 1e-6, // Greek mu U+03BC
  m: 1e-3,
  '': 1,
  k: 1e3,
  K: 1e3,
  M: 1e6,
  G: 1e9,
};

/** Unit spellings per kind (after the prefix), each with the factor to SI. */
const UNIT_SPELLINGS: Record<QuantityKind, ReadonlyArray<[string, number]>> = {
  voltage: [['V', 1]],
  current: [['A', 1]],
  resistance: [
    ['Ω', 1], // Greek capital omega U+03A9
    ['\u2126', 1], // ohm sign U+2126
    ['ohms', 1],
    ['ohm', 1],
    ['Ohms', 1],
    ['Ohm', 1],
  ],
  power: [['W', 1]],
  temperature: [
    ['°C', 1],
    ['℃', 1],
    ['degC', 1],
    ['C', 1],
  ],
  thermalResistance: [
    ['K/W', 1],
    ['°C/W', 1],
    ['℃/W', 1],
    ['C/W', 1],
  ],
  tempCoVoltage: [
    ['V/K', 1],
    ['V/°C', 1],
    ['V/℃', 1],
    ['V/C', 1],
  ],
  tempCoPercent: [
    ['%/K', 1],
    ['%/°C', 1],
    ['%/℃', 1],
    ['%/C', 1],
  ],
};

/** Kinds whose unit takes no prefix. */
const NO_PREFIX: ReadonlySet<QuantityKind> = new Set(['temperature', 'thermalResistance', 'tempCoPercent']);

const NUMBER = String.raw`[+\-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+\-]?\d+)?`;

/** Normalises what PDFs and keyboards hand us: minus signs, odd spaces, degree variants. */
export function normaliseQuantityText(text: string): string {
  return text
    .replace(/[\u2212\u2012\u2013\u2014\uFE63\uFF0D]/g, '-') // minus and dashes used as minus
    .replace(/[\u00A0\u2009\u202F\u2002\u2003]/g, ' ')
    .replace(/\u00BA/g, '°') // masculine ordinal often stands in for the degree sign
    .replace(/\s*\/\s*/g, '/')
    .replace(/°\s+/g, '°')
    .trim();
}

export interface ParseOptions {
  /** Field name for the error message (default "value"). */
  field?: string;
  /** Unit to assume when the text has none, e.g. the unit from a table's column header. */
  defaultUnit?: string;
}

/**
 * Reads a datasheet value of the given kind into SI: "20mA" → 0.02, "0.5 uA" → 5e-7,
 * "7 ohm" → 7, "-2.5 mV/°C" → -0.0025. A unit that does not fit the kind is an error
 * naming the field and the expected unit; nothing is guessed.
 */
export function parseQuantity(text: string, kind: QuantityKind, options: ParseOptions = {}): number {
  const field = options.field ?? 'value';
  const expected = describeExpected(kind);
  const clean = normaliseQuantityText(text);
  const match = new RegExp(`^(${NUMBER})\\s*(.*)$`).exec(clean);
  if (!match) throw new UnitParseError(field, text, expected);
  const number = Number(match[1]);
  if (!Number.isFinite(number)) throw new UnitParseError(field, text, expected);
  let unitText = match[2].trim();
  if (unitText === '') {
    if (options.defaultUnit === undefined) throw new UnitParseError(field, text, `${expected} (no unit given)`);
    unitText = normaliseQuantityText(options.defaultUnit);
  }
  const factor = unitFactor(unitText, kind);
  if (factor === undefined) throw new UnitParseError(field, text, expected);
  return number * factor;
}

/** Factor from the given unit (with prefix) to SI for a kind, or undefined if it does not fit. */
export function unitFactor(unitText: string, kind: QuantityKind): number | undefined {
  const unit = normaliseQuantityText(unitText);
  for (const [spelling, base] of UNIT_SPELLINGS[kind]) {
    if (!unit.endsWith(spelling)) continue;
    const prefix = unit.slice(0, unit.length - spelling.length);
    if (prefix === '') return base;
    if (NO_PREFIX.has(kind)) continue;
    const factor = PREFIX_FACTOR[prefix];
    if (factor !== undefined) return base * factor;
  }
  return undefined;
}

/** Which quantity kind a unit text belongs to, if any ("mV/°C" → tempCoVoltage). */
export function kindOfUnit(unitText: string): QuantityKind | undefined {
  // Longest spellings first so "V/K" is not mistaken for a voltage.
  const order: QuantityKind[] = ['tempCoPercent', 'tempCoVoltage', 'thermalResistance', 'resistance', 'temperature', 'voltage', 'current', 'power'];
  return order.find((kind) => unitFactor(unitText, kind) !== undefined);
}

/**
 * Reads a range as datasheets print it: "4.85…5.36 V", "4.85...5.36 V", "4.85 – 5.36 V",
 * "4.85 to 5.36 V", "-55 to +150 °C". The unit after the second number applies to both
 * unless the first carries its own.
 */
export function parseRange(text: string, kind: QuantityKind, options: ParseOptions = {}): [number, number] {
  const field = options.field ?? 'value';
  const clean = text
    .replace(/[\u2212\uFE63\uFF0D]/g, '-')
    .replace(/[\u00A0\u2009\u202F]/g, ' ')
    .trim();
  const parts = clean.split(/\s*(?:\u2026|\.\.\.|\s+to\s+|\s*[\u2012\u2013\u2014]\s*|(?<![0-9.][eE])(?<=\d\s*[a-zA-Zµμ°%/Ω℃]*)\s*-\s*(?=[+-]?\d))\s*/);
  if (parts.length !== 2) throw new UnitParseError(field, text, `a range of ${describeExpected(kind)}`);
  const [first, second] = parts;
  const secondMatch = new RegExp(`^(${NUMBER})\\s*(.*)$`).exec(normaliseQuantityText(second));
  const sharedUnit = secondMatch?.[2] || options.defaultUnit;
  const low = parseQuantity(first, kind, { field, defaultUnit: sharedUnit });
  const high = parseQuantity(second, kind, { field, defaultUnit: options.defaultUnit });
  if (low > high) throw new UnitParseError(field, text, 'a range whose first value is the smaller');
  return [low, high];
}

function describeExpected(kind: QuantityKind): string {
  const examples: Record<QuantityKind, string> = {
    voltage: 'a voltage (e.g. 5.1 V, 500 mV)',
    current: 'a current (e.g. 20 mA, 0.5 µA)',
    resistance: 'a resistance (e.g. 7 Ω, 7 ohm, 1.2 kΩ)',
    power: 'a power (e.g. 500 mW, 1.3 W)',
    temperature: 'a temperature in °C (e.g. 150 °C)',
    thermalResistance: 'a thermal resistance (e.g. 250 K/W, 250 °C/W)',
    tempCoVoltage: 'a temperature coefficient in V/K (e.g. -2.5 mV/K, -2.5 mV/°C)',
    tempCoPercent: 'a temperature coefficient in %/K (e.g. 0.06 %/K)',
  };
  return examples[kind] ?? SI_UNIT[kind];
}
