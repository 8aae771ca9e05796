import type { ExtractionField, QuantityKind } from '@shuntwise/contracts';
import { findQuantities } from './quantity-text';

/**
 * Which card field a column header or a row label names. The symbol or words say what is
 * meant ("IZK", "knee impedance"); the unit's kind settles what a mixed header such as
 * "IR at VR (V)" or "VZ at IZT (V)" is about.
 */

const P = {
  zzk: /\bZ\s?ZK\b|\bknee\s+imp/i,
  zzt: /\bZ\s?ZT\b|\bZ\s?Z\b|\bdyn(?:amic|\.)?\s*imp|\br\s?zj?\b/i,
  izk: /\bI\s?ZK\b|\bknee\b/i,
  izm: /\bI\s?ZM\b|\bI\s?Z\s?max\b|\bmax(?:imum|\.)?\s+(?:zener|regulator)\s+current/i,
  izt: /\bI\s?ZT\b|\btest(?:\s+current)?\b/i,
  ir: /\bI\s?R\b|\bleakage\b|\breverse\s+current/i,
  vr: /\bV\s?R\b|\breverse\s+voltage/i,
  vz: /\bV\s?Z(?:min|nom|max|typ)?\b|\bzener\s+voltage/i,
  tc: /α|\bTC\b|\bS\s?Z\b|\btemp(?:erature|\.)?\s*co/i,
  pd: /\bP\s?(?:tot|D)\b|\bpower\s+(?:dissipation|rating)\b/i,
  tj: /\bjunction\s+temp|\bT\s?j\b|\bT\s?J\b/i,
  rthJA: /\bR\s?(?:th|θ)\s?\(?j-?a\)?|\bjunction\s+to\s+ambient/i,
  notRthJA: /\bR\s?(?:th|θ)\s?\(?j-?[lc]\)?|\bto\s+(?:lead|case|tab|board)/i,
  packageHeader: /\bpackage\b|\bcase\b/i,
};

export type Qualifier = 'min' | 'nom' | 'typ' | 'max';

export function qualifierOf(text: string): Qualifier | undefined {
  const m = /(min|nom|typ|max)(?:imum|inal|ical)?\.?(?![a-z])/i.exec(text);
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
        return { field, qualifier: q, rank: 1 };
      }
      return undefined;
    case 'current':
      // Symbols first: "Knee imp. … IR max" is a leakage column even though "knee" is in it.
      if (/\bI\s?ZK\b/i.test(text)) return { field: 'izk', rank: 1 };
      if (/\bI\s?ZM\b|\bI\s?Z\s?max\b/i.test(text)) return { field: 'izm', rank: 1 };
      if (/\bI\s?ZT\b/i.test(text)) return { field: 'izt', rank: 1 };
      if (/\bI\s?R\b/i.test(text)) return { field: 'irMax', qualifier: q, rank: q === 'typ' ? 0 : 1 };
      if (/\bknee\b/i.test(text)) return { field: 'izk', rank: 1 };
      if (P.izm.test(text)) return { field: 'izm', rank: 1 };
      if (P.izt.test(text)) return { field: 'izt', rank: 1 };
      if (P.ir.test(text)) return { field: 'irMax', qualifier: q, rank: q === 'typ' ? 0 : 1 };
      return undefined;
    case 'resistance': {
      const r = q === 'typ' ? 0 : 1;
      if (/\bZ\s?ZK\b/i.test(text)) return { field: 'zzk', qualifier: q, rank: r };
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

export const LABELS = P;

export interface Condition {
  field: 'izt' | 'izk' | 'vr';
  value: string;
  unit: string;
  kind: QuantityKind;
  /** Where the condition sits in the text. */
  index: number;
  end: number;
}

const CONDITION = /\b(I\s?Z\s?T|I\s?Z\s?K|I\s?Z|V\s?R|I\s?F|I\s?R|T\s?amb|T\s?a|T\s?j|f|t\s?p)\s*=\s*/gi;

/**
 * Test conditions written as "SYMBOL = value unit" ("IZ = 5 mA", "VR = 2 V", "IZK = 0.25 mA").
 * `context` is the field of the line they sit on: IZ on a knee-impedance line is the knee
 * current. Conditions that are not card fields (f, tp, Tamb, IF) are reported with no field
 * so the caller can remove them from the text too.
 */
export function findConditions(text: string, context?: ExtractionField): { conditions: Condition[]; rest: string } {
  const conditions: Condition[] = [];
  let rest = text;
  const cuts: Array<[number, number]> = [];
  for (const m of text.matchAll(CONDITION)) {
    const after = m.index + m[0].length;
    const q = findQuantities(text.slice(after, after + 24))[0];
    if (!q || q.index !== 0) continue;
    const end = after + q.end;
    cuts.push([m.index, end]);
    const symbol = m[1].replace(/\s/g, '').toUpperCase();
    let field: Condition['field'] | undefined;
    if (symbol === 'IZT' && q.kind === 'current') field = 'izt';
    else if (symbol === 'IZK' && q.kind === 'current') field = 'izk';
    else if (symbol === 'IZ' && q.kind === 'current') field = context === 'zzk' ? 'izk' : 'izt';
    else if (symbol === 'VR' && q.kind === 'voltage') field = 'vr';
    if (field && q.kind) conditions.push({ field, value: q.value, unit: q.unit, kind: q.kind, index: m.index, end });
  }
  for (const [a, b] of cuts.reverse()) rest = rest.slice(0, a) + ' '.repeat(b - a) + rest.slice(b);
  return { conditions, rest };
}
