import { formatNumber, formatPercent, formatQuantity } from './format';
import type { QuantityKind } from './quantity';

/**
 * How a field is named where a person reads it: the label its form shows and the kind of
 * quantity it holds (so a value in a message is "5.10 mV", never "0.0051"). The one map
 * from field paths to labels: API messages, the contracts' own rules and the web forms read it.
 */
export interface FieldLabel {
  label: string;
  kind?: QuantityKind;
  /** A fraction shown as a percentage (0.5 → "50 %"). */
  percent?: boolean;
}

const v = (label: string): FieldLabel => ({ label, kind: 'voltage' });
const a = (label: string): FieldLabel => ({ label, kind: 'current' });
const ohm = (label: string): FieldLabel => ({ label, kind: 'resistance' });
const c = (label: string): FieldLabel => ({ label, kind: 'temperature' });

/** A rating card's fields, by the symbols datasheets print. */
export const CARD_FIELD_LABELS = {
  vzMin: v('VZ min'),
  vzNom: v('VZ nom'),
  vzMax: v('VZ max'),
  izt: a('IZT'),
  zzt: ohm('ZZT'),
  izk: a('IZK'),
  zzk: ohm('ZZK'),
  irMax: a('IR max'),
  vr: v('VR'),
  tc: { label: 'αVZ' },
  pdMax: { label: 'PD max', kind: 'power' },
  pdRefC: c('T ref'),
  tjMax: c('TJ max'),
  rthJA: { label: 'RthJA', kind: 'thermalResistance' },
  izm: a('IZM'),
} as const satisfies Record<string, FieldLabel>;

/**
 * A rating card's fields in words, for CSV headers a person reads without a glossary
 * ("Zener voltage nominal (V)", not vzNom). The card import reads these back as well as the
 * short names, so files written before and after either spelling import alike.
 */
export const CARD_FIELD_WORDS: Record<keyof typeof CARD_FIELD_LABELS, string> = {
  vzMin: 'Zener voltage min',
  vzNom: 'Zener voltage nominal',
  vzMax: 'Zener voltage max',
  izt: 'Test current',
  zzt: 'Dynamic impedance at test current',
  izk: 'Knee current',
  zzk: 'Dynamic impedance at knee current',
  irMax: 'Reverse leakage max',
  vr: 'Reverse voltage of the leakage',
  tc: 'Temperature coefficient',
  pdMax: 'Power rating',
  pdRefC: 'Power rating reference temperature',
  tjMax: 'Junction temperature max',
  rthJA: 'Thermal resistance junction to ambient',
  izm: 'Zener current max',
};

/** A house part's spec, as the spec editor labels it. */
export const SPEC_FIELD_LABELS: Record<string, FieldLabel> = {
  iRef: a('Reference current'),
  'vz.min': v('VZ min'),
  'vz.nom': v('VZ nom'),
  'vz.max': v('VZ max'),
  zdMax: ohm('Largest Zd at the reference current'),
  'knee.iKnee': a('Knee current'),
  'knee.maxRatio': { label: 'Largest knee ratio' },
  'knee.maxSpan': v('Largest span'),
  'leakage.irMax': a('Largest IR'),
  'leakage.vr': v('VR of the leakage limit'),
  'tc.min': { label: 'αVZ from', kind: 'tempCoVoltage' },
  'tc.max': { label: 'αVZ to', kind: 'tempCoVoltage' },
  'power.pdMin': { label: 'Smallest PD rating', kind: 'power' },
  'power.deratingFraction': { label: 'Share of derated power', percent: true },
  'envelope.iMin': a('Current from'),
  'envelope.iMax': a('Current to'),
  'envelope.taMin': c('Ambient from'),
  'envelope.taMax': c('Ambient to'),
  'outputWindow.vMin': v('Output from'),
  'outputWindow.vMax': v('Output to'),
  marginalBandPercent: { label: 'Marginal within' },
};

/** The circuit check's inputs, as the Find parts form labels them. */
export const CIRCUIT_FIELD_LABELS: Record<string, FieldLabel> = {
  'supply.min': v('Lowest supply'),
  'supply.nom': v('Nominal supply'),
  'supply.max': v('Highest supply'),
  'load.min': a('Smallest load'),
  'load.max': a('Largest load'),
  'ambient.min': c('Lowest ambient'),
  'ambient.max': c('Highest ambient'),
  'resistor.tolerance': { label: 'Resistor tolerance', percent: true },
  kneeFactor: { label: 'Knee margin' },
  powerFraction: { label: 'Diode power used at most', percent: true },
};

/** Filters of the lists. */
export const FILTER_FIELD_LABELS: Record<string, FieldLabel> = {
  vzFrom: v('VZ from'),
  vzTo: v('VZ to'),
  vzNomMin: v('Lower VZ'),
  vzNomMax: v('Upper VZ'),
  pdMin: { label: 'Power at least', kind: 'power' },
  toleranceMax: { label: 'Tolerance', percent: true },
};

const ALL: Record<string, FieldLabel> = { ...FILTER_FIELD_LABELS, ...CIRCUIT_FIELD_LABELS, ...SPEC_FIELD_LABELS, ...CARD_FIELD_LABELS };

/**
 * The label of a field path as a request or a form carries it: `spec.vz.min`, `card.vzMin`,
 * `fields.vzMax.value`, `envelope.iMin`. Leading wrappers and a trailing `value` are
 * dropped until a known field remains; undefined when none does.
 */
export function fieldLabelOf(path: string | ReadonlyArray<PropertyKey>): FieldLabel | undefined {
  let parts = (typeof path === 'string' ? path.split('.') : path.map(String)).filter((p) => p !== '' && !/^\d+$/.test(p));
  if (parts[parts.length - 1] === 'value') parts = parts.slice(0, -1);
  while (parts.length > 0) {
    const found = ALL[parts.join('.')];
    if (found) return found;
    parts = parts.slice(1);
  }
  return undefined;
}

/** "VZ min", or the path itself when no label is known. */
export function fieldName(path: string | ReadonlyArray<PropertyKey>): string {
  return fieldLabelOf(path)?.label ?? (typeof path === 'string' ? path : path.map(String).join('.'));
}

/** A value of the field as a person reads it: "5.10 mV", "50 %", or the number when the kind is unknown. */
export function fieldValue(path: string | ReadonlyArray<PropertyKey>, value: number): string {
  const meta = fieldLabelOf(path);
  if (meta?.percent) return formatPercent(value, { digits: 4 });
  if (meta?.kind) return formatQuantity(value, meta.kind, { digits: 4, trim: true });
  return formatNumber(value, 4, { trim: true });
}

/** "VZ min (5.30 V)": a field and its value, for messages about two fields. */
export function fieldWithValue(path: string, value: number): string {
  return `${fieldName(path)} (${fieldValue(path, value)})`;
}

/** The parts of a zod 4 issue a message is made from. */
export interface LabelledIssue {
  code?: string;
  path: ReadonlyArray<PropertyKey>;
  message: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  inclusive?: boolean;
  origin?: string;
  expected?: string;
  values?: ReadonlyArray<unknown>;
  format?: string;
}

// zod's built-in wording ("Too small: expected number to be >0") is for developers.
const ZOD_DEFAULT = /^(Too small|Too big|Invalid (input|option|string|format|type)|Required$|Unrecognized key)/;

/** Whether a message is zod's own rather than one the contracts wrote. */
export function isGenericIssueMessage(message: string): boolean {
  return ZOD_DEFAULT.test(message);
}

/**
 * The message of one validation issue in the form's words: the contracts' own messages
 * as written; zod's generic ones as "VZ max must be above 0 V", "IZT: give a number".
 */
export function issueMessage(issue: LabelledIssue): string {
  // The physical bounds (units/bounds.ts) say the range in words and units; they only lack the field's name.
  if (/^must be /.test(issue.message)) return `${fieldName(issue.path)} ${issue.message}`;
  if (!isGenericIssueMessage(issue.message)) return issue.message;
  const name = fieldName(issue.path);
  const limit = (x: number | bigint | undefined) => fieldValue(issue.path, Number(x));
  const numeric = issue.origin === 'number' || issue.origin === 'int' || issue.origin === 'bigint';
  switch (issue.code) {
    case 'too_small':
      if (numeric) return `${name} must be ${issue.inclusive ? 'at least' : 'above'} ${limit(issue.minimum)}`;
      return Number(issue.minimum) <= 1
        ? `${name} is required`
        : `${name}: use at least ${issue.minimum} ${issue.origin === 'array' ? 'entries' : 'characters'}`;
    case 'too_big':
      if (numeric) return `${name} must be ${issue.inclusive === false ? 'below' : 'at most'} ${limit(issue.maximum)}`;
      return `${name}: use at most ${issue.maximum} ${issue.origin === 'array' ? 'entries' : 'characters'}`;
    case 'invalid_type':
      return issue.expected === 'number' ? `${name}: give a number` : `${name}: check this value`;
    case 'invalid_value':
      return `${name}: choose one of ${(issue.values ?? []).join(', ')}`;
    case 'invalid_format':
      return issue.format === 'email' ? `${name}: enter a valid e-mail address` : `${name}: check the format`;
    case 'unrecognized_keys':
      return `${issue.message.replace(/^Unrecognized keys?:\s*/, 'Not a field here: ')}`;
    default:
      return `${name}: check this value`;
  }
}
