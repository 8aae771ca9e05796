import type { ExtractionField, QuantityKind } from '@shuntwise/contracts';
import { closeGaps, findQuantities } from './quantity-text';
import type { Line } from './text-layout';
import { bareConditionField, conditionField, CONDITION_SYMBOL, CURRENT_SYMBOLS, LABELS, TEMPERATURE_QUALIFIER } from './vocabulary';

/**
 * Which card field a column header or a row label names. The symbol or words say what is
 * meant ("IZK", "knee impedance"); the unit's kind settles what a mixed header such as
 * "IR at VR (V)" or "VZ at IZT (V)" is about.
 */

const P = LABELS;

export type Qualifier = 'min' | 'nom' | 'typ' | 'max';

export function qualifierOf(text: string): Qualifier | undefined {
  // Not the letters of a part number ("The MAX3V6 regulates at 3.60 V" gives no maximum).
  const m = /(min|nom|typ|max)(?:imum|inal|ical)?\.?(?![a-z\d])/i.exec(text);
  return m ? (m[1].toLowerCase() as Qualifier) : undefined;
}

export interface FieldMatch {
  field: ExtractionField;
  qualifier?: Qualifier;
  /** Higher wins when several columns or lines name the same field. */
  rank: number;
}

/** The field a header or label names, given the kind of its unit. */
export function fieldFor(text: string, kind: QuantityKind | undefined): FieldMatch | undefined {
  const q = qualifierOf(text);
  switch (kind) {
    case 'voltage':
      if (P.vr.test(text)) return { field: 'vr', rank: 1 };
      if (P.vz.test(text)) {
        const field = q === 'min' ? 'vzMin' : q === 'max' ? 'vzMax' : 'vzNom';
        // A column that says "nom" or "typ" outranks one that names no qualifier (a scan that
        // lost the "min" over the first of three VZ columns must not make it the nominal one).
        return { field, qualifier: q, rank: q === 'nom' || q === 'typ' ? 2 : 1 };
      }
      return undefined;
    case 'current':
      // Symbols first: "Knee imp. … IR max" is a leakage column even though "knee" is in it.
      for (const [re, field] of CURRENT_SYMBOLS) {
        if (re.test(text)) return field === 'irMax' ? { field, qualifier: q, rank: q === 'typ' ? 0 : 1 } : { field, rank: 1 };
      }
      if (/\bknee\b/i.test(text)) return { field: 'izk', rank: 1 };
      if (P.izm.test(text)) return { field: 'izm', rank: 1 };
      if (P.izt.test(text)) return { field: 'izt', rank: 1 };
      if (P.ir.test(text)) return { field: 'irMax', qualifier: q, rank: q === 'typ' ? 0 : 1 };
      return undefined;
    case 'resistance': {
      const r = q === 'typ' ? 0 : 1;
      if (/\bZ\s?ZK\b|\br\s?zk\b/i.test(text)) return { field: 'zzk', qualifier: q, rank: r };
      if (/\bZ\s?ZT?\b|\br\s?zj?\b/i.test(text)) return { field: 'zzt', qualifier: q, rank: r };
      if (P.zzk.test(text) || P.izk.test(text)) return { field: 'zzk', qualifier: q, rank: r };
      if (P.zzt.test(text) || /\bimp/i.test(text)) return { field: 'zzt', qualifier: q, rank: r };
      return undefined;
    }
    case 'tempCoVoltage':
    case 'tempCoPercent':
      if (P.tc.test(text) || P.vz.test(text)) {
        // The typical value is the card's coefficient; a min or max alone is a limit, not the value.
        return { field: 'tc', qualifier: q, rank: q === 'typ' || q === 'nom' ? 2 : q ? 0 : 1 };
      }
      return undefined;
    case 'power':
      if (P.pd.test(text)) return { field: 'pdMax', rank: 1 };
      return undefined;
    case 'temperature':
      if (P.tj.test(text)) return { field: 'tjMax', rank: 1 };
      return undefined;
    case 'thermalResistance':
      if (P.rthJA.test(text) && !P.notRthJA.test(text)) return { field: 'rthJA', rank: 1 };
      return undefined;
    default:
      return undefined;
  }
}

export function isPackageHeader(text: string): boolean {
  return P.packageHeader.test(text);
}

export { LABELS };

export interface Condition {
  field: 'izt' | 'izk' | 'vr';
  value: string;
  unit: string;
  kind: QuantityKind;
  /** Where the condition sits in the text. */
  index: number;
  end: number;
}

/** "@ 0.25 mA", "at 5 mA", "at VR 1 V": a condition after a value, with or without its symbol. */
const BARE = /(?:@|\bat\b)\s*(?:(I\s?Z\s?\(K\)|I\s?Z\s?T|I\s?Z\s?K|I\s?test|I\s?T|I\s?K|I\s?Z|V\s?RM|V\s?R|U\s?R)\s*[=:]?\s*)?(?=[+\-−–]?\.?\d)/giu;

/**
 * Test conditions written as "SYMBOL = value unit" ("IZ = 5 mA", "VR = 2 V", "IZK = 0.25 mA")
 * or after "@" / "at" ("144 Ω @ 0.25 mA", "0.10 µA @ 6.5 V"). `context` is the field of the
 * value they qualify: IZ on a knee-impedance line is the knee current, a bare current after a
 * knee impedance too. Conditions that are not card fields (f, tp, TA, Tj, IF, "at 25 °C") are
 * cut from the text as well, so that the caller never reads them as a rating.
 */
export function findConditions(text: string, context?: ExtractionField): { conditions: Condition[]; rest: string } {
  const conditions: Condition[] = [];
  const cuts: Array<[number, number]> = [];
  const taken = (a: number, b: number) => cuts.some(([x, y]) => a < y && b > x);
  for (const m of text.matchAll(CONDITION_SYMBOL)) {
    const after = m.index + m[0].length;
    const q = findQuantities(text.slice(after, after + 24))[0];
    if (!q || q.index !== 0) continue;
    const end = after + q.end;
    cuts.push([m.index, end]);
    const field = conditionField(m[1], q.kind, context);
    if (field && q.kind) conditions.push({ field, value: q.value, unit: q.unit, kind: q.kind, index: m.index, end });
  }
  for (const m of text.matchAll(BARE)) {
    const after = m.index + m[0].length;
    const q = findQuantities(text.slice(after, after + 24))[0];
    if (!q || q.index !== 0 || !q.kind || taken(m.index, after + q.end)) continue;
    // "rated at 500 mW" is the rating itself; only what a test sets up is a condition.
    if (!m[1] && q.kind !== 'current' && q.kind !== 'voltage' && q.kind !== 'temperature') continue;
    const end = after + q.end;
    cuts.push([m.index, end]);
    const field = m[1] ? conditionField(m[1], q.kind, context) : bareConditionField(q.kind, context);
    if (field) conditions.push({ field, value: q.value, unit: q.unit, kind: q.kind, index: m.index, end });
  }
  for (const m of text.matchAll(TEMPERATURE_QUALIFIER)) {
    if (!taken(m.index, m.index + m[0].length)) cuts.push([m.index, m.index + m[0].length]);
  }
  let rest = text;
  for (const [a, b] of cuts.sort((x, y) => y[0] - x[0])) rest = rest.slice(0, a) + ' '.repeat(b - a) + rest.slice(b);
  return { conditions, rest: closeGaps(rest) };
}

/** A series-wide test condition printed in a table's title, kept with the line it came from. */
export interface TitleCondition extends Condition {
  line: Line;
}

/**
 * "Electrical characteristics, XY series (TA = 25 °C, IZT = 5 mA, IZ(K) = 0.5 mA)": the test
 * currents a table's title sets for every row. Looks at the few lines above the table's top
 * line on the same page; only a one-cell title line whose conditions stand in brackets counts,
 * so prose and other tables' rows above are never read as a condition.
 */
export function titleConditions(lines: Line[], top: number): TitleCondition[] {
  for (let k = top - 1; k >= Math.max(0, top - 3); k--) {
    const line = lines[k];
    if (line.cells.length > 1) continue;
    const bracket = /\(([^()]*(?:\([^()]*\)[^()]*)*)\)\s*$/.exec(line.text);
    if (!bracket) continue;
    const found = findConditions(bracket[1]).conditions.filter((c) => c.field === 'izt' || c.field === 'izk');
    if (found.length) return found.map((c) => ({ ...c, line }));
  }
  return [];
}
