import {
  CARD_FIELD_KINDS,
  formatQuantity,
  kindOfUnit,
  normaliseQuantityText,
  parseQuantity,
  UnitParseError,
  type CardField,
  type PlainCardField,
  type QuantityKind,
  type TempCoUnit,
} from '@shuntwise/contracts';

/**
 * How the card's fields are named on screen: the symbol datasheets print and a plain
 * description. Shared by the card editor, the series review and the CSV preview.
 */
export interface CardFieldMeta {
  field: CardField;
  symbol: string;
  label: string;
  /** The unit a bare number is read in while typing ("20" in the IZT field is 20 mA). */
  typingUnit: string;
}

export const CARD_FIELD_META: Record<CardField, CardFieldMeta> = {
  vzMin: { field: 'vzMin', symbol: 'VZ min', label: 'Zener voltage, lowest, at IZT', typingUnit: 'V' },
  vzNom: { field: 'vzNom', symbol: 'VZ nom', label: 'Zener voltage, nominal, at IZT', typingUnit: 'V' },
  vzMax: { field: 'vzMax', symbol: 'VZ max', label: 'Zener voltage, highest, at IZT', typingUnit: 'V' },
  izt: { field: 'izt', symbol: 'IZT', label: 'Test current', typingUnit: 'mA' },
  zzt: { field: 'zzt', symbol: 'ZZT', label: 'Dynamic impedance at IZT', typingUnit: 'Ω' },
  izk: { field: 'izk', symbol: 'IZK', label: 'Knee current', typingUnit: 'mA' },
  zzk: { field: 'zzk', symbol: 'ZZK', label: 'Impedance at IZK', typingUnit: 'Ω' },
  irMax: { field: 'irMax', symbol: 'IR max', label: 'Reverse leakage at VR', typingUnit: 'µA' },
  vr: { field: 'vr', symbol: 'VR', label: 'Reverse voltage of the leakage test', typingUnit: 'V' },
  tc: { field: 'tc', symbol: 'αVZ', label: 'Temperature coefficient of VZ', typingUnit: 'mV/K' },
  pdMax: { field: 'pdMax', symbol: 'PD max', label: 'Power rating', typingUnit: 'mW' },
  pdRefC: { field: 'pdRefC', symbol: 'T ref', label: 'Ambient the power rating is given at', typingUnit: '°C' },
  tjMax: { field: 'tjMax', symbol: 'TJ max', label: 'Largest junction temperature', typingUnit: '°C' },
  rthJA: { field: 'rthJA', symbol: 'RthJA', label: 'Thermal resistance, junction to ambient', typingUnit: 'K/W' },
  izm: { field: 'izm', symbol: 'IZM', label: 'Largest Zener current', typingUnit: 'mA' },
};

/** The card's fields in the groups the editor shows them in. */
export const CARD_FIELD_GROUPS: ReadonlyArray<{ title: string; fields: readonly CardField[] }> = [
  { title: 'Breakdown', fields: ['vzMin', 'vzNom', 'vzMax', 'izt'] },
  { title: 'Impedance', fields: ['zzt', 'izk', 'zzk'] },
  { title: 'Leakage', fields: ['irMax', 'vr'] },
  { title: 'Temperature', fields: ['tc'] },
  { title: 'Power and heat', fields: ['pdMax', 'pdRefC', 'tjMax', 'rthJA', 'izm'] },
];

export function cardFieldKind(field: PlainCardField): QuantityKind {
  return CARD_FIELD_KINDS[field];
}

/** A temperature coefficient as the card keeps it: the number in the unit the datasheet used. */
export interface TempCoValue {
  value: number;
  unit: TempCoUnit;
}

/** "−2.10 mV/K", "0.0730 %/K": a card value through the shared formatter. */
export function formatCardValue(field: CardField, value: number | null | undefined, unit?: TempCoUnit | null, digits?: number): string {
  if (field === 'tc') {
    if (value === null || value === undefined) return '–';
    return unit === '%/K' ? formatQuantity(value, 'tempCoPercent', { digits }) : formatQuantity(value / 1000, 'tempCoVoltage', { digits });
  }
  return formatQuantity(value, CARD_FIELD_KINDS[field], { digits });
}

/**
 * Reads a typed temperature coefficient: "-2.5 mV/K", "-2.5 mV/°C", "0.06 %/K", or a bare
 * number in `bareUnit`. %/K stays %/K; anything in V/K becomes mV/K as the card keeps it.
 */
export function parseTempCo(text: string, bareUnit: TempCoUnit, field = 'αVZ'): TempCoValue {
  const clean = normaliseQuantityText(text);
  const unitText = clean.replace(/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*/, '');
  const kind = unitText === '' ? (bareUnit === '%/K' ? 'tempCoPercent' : 'tempCoVoltage') : kindOfUnit(unitText);
  if (kind === 'tempCoPercent') {
    return { value: parseQuantity(clean, 'tempCoPercent', { field, defaultUnit: '%/K' }), unit: '%/K' };
  }
  if (kind === 'tempCoVoltage') {
    const si = parseQuantity(clean, 'tempCoVoltage', { field, defaultUnit: 'mV/K' });
    return { value: Number((si * 1000).toPrecision(12)), unit: 'mV/K' };
  }
  throw new UnitParseError(field, text, 'a temperature coefficient (e.g. -2.5 mV/K, -2.5 mV/°C, 0.06 %/K)');
}

/** Two card values are the same when they agree to 9 significant figures (float noise aside). */
export function sameNumber(a: number | null | undefined, b: number | null | undefined): boolean {
  if (a === null || a === undefined || b === null || b === undefined) return (a ?? null) === (b ?? null);
  if (a === b) return true;
  return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}
