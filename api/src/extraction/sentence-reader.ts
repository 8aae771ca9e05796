import type { ExtractionField, QuantityKind } from '@shuntwise/contracts';
import { fieldFor, FieldMatch } from './field-patterns';
import { findPackage, isPartNumber } from './part-numbers';
import { blankFootnotes, findQuantities, QuantityToken, toSi } from './quantity-text';
import { Line, lineBox } from './text-layout';
import { FIELD_KINDS, orderOf, VariantDrafts } from './variant-drafts';
import { bareConditionField, conditionField, CONDITION_SYMBOL } from './vocabulary';

/**
 * Ratings written as prose, one paragraph per part: "The XY5V1 (SOD-123) regulates at 5.1 V
 * (4.85 V to 5.36 V) when driven at 5 mA; its dynamic resistance there is at most 60 Ω.
 * Leakage stays below 2 µA at 1 V …". Each number is read with the words before it in its
 * clause (the vocabulary) and the dimension of its unit; a number after "at", "@" or "=" that
 * follows a value is that value's test condition. A number whose clause names no rating is
 * left alone: a worked example's "≈ 2670 Ω" is not an impedance.
 */

/** The part a paragraph is about, when it opens with it ("The XY5V1 …", "XY5V1, SOD-123: …"). */
function openingPart(text: string): string | undefined {
  // A heading alone ("XY5V1") opens a list or table, not prose.
  if (text.split(/\s+/).length < 5) return undefined;
  const words = text.split(/\s+/).slice(0, 3);
  for (const w of words) {
    const t = w.replace(/^[("]+|[),:;."]+$/g, '');
    if (isPartNumber(t)) return t;
  }
  return undefined;
}

interface Paragraph {
  mpn: string;
  lines: Line[];
  /** The text of each line's cell in the paragraph's column (a two-column page puts two cells on one line). */
  parts: string[];
  x0: number;
  text: string;
}

function paragraphs(lines: Line[], used: Set<Line>): Paragraph[] {
  const out: Paragraph[] = [];
  let current: Paragraph | undefined;
  for (const line of lines) {
    // Leader dots make a key–value list, not prose.
    if (used.has(line) || line.cells.length > 2 || /\.{4,}|…{2,}/.test(line.text)) {
      current = undefined;
      continue;
    }
    const last = current?.lines[current.lines.length - 1];
    const cell = current ? line.cells.find((c) => Math.abs(c.x0 - current!.x0) < 4) : undefined;
    const opening = line.cells.map((c) => ({ c, mpn: openingPart(c.text) })).find((o) => o.mpn);
    const continues = current && last && cell && !openingPart(cell.text) && last.y - line.y < 1.8 * Math.max(line.size, last.size);
    if (continues) {
      current!.lines.push(line);
      current!.parts.push(cell!.text);
      current!.text += ' ' + cell!.text;
      continue;
    }
    current = undefined;
    if (opening) {
      current = { mpn: opening.mpn!, lines: [line], parts: [opening.c.text], x0: opening.c.x0, text: opening.c.text };
      out.push(current);
    }
  }
  return out;
}

const CONDITION_BEFORE = /(?:@|\bat\b|=|≈)\s*$/i;

interface Primary {
  field: ExtractionField;
  token: QuantityToken;
}

export function readSentences(pages: Line[][], used: Set<Line>, drafts: VariantDrafts): void {
  for (const lines of pages) {
    for (const p of paragraphs(lines, used)) {
      // The paragraph must read as ratings: two or more numbers with units.
      const all = findQuantities(p.text).filter((t) => t.kind);
      if (all.length < 2) continue;
      const found: Array<() => void> = [];
      const offer = (field: ExtractionField, t: QuantityToken, rank: number) => {
        const kind = t.kind as QuantityKind;
        if (!FIELD_KINDS[field].includes(kind)) return;
        const si = toSi(t.value, t.unit, kind);
        if (si === undefined) return;
        const line = lineOf(p, t.index);
        const order = orderOf(p.lines[0].page, p.lines[0].index);
        found.push(() =>
          drafts
            .get(p.mpn, order)
            .offer(field, { value: t.value, unit: t.unit, kind, si, page: line.page, text: p.text, box: lineBox(line), rank, method: 'sentence' }),
        );
      };
      for (const clause of clauses(p.text)) readClause(clause.text, clause.start, p.text, offer);
      // Prose that names no rating ("XY5V1 5.1 V regulator diode" as a heading) is left to the other readers.
      if (found.length === 0) continue;
      for (const f of found) f();
      const pkg = findPackage(p.text.slice(0, 60));
      if (pkg) drafts.get(p.mpn, 0).offerPackage({ value: pkg.value, page: p.lines[0].page, text: p.text, box: lineBox(p.lines[0]), rank: 2 });
      for (const l of p.lines) used.add(l);
    }
  }
}

function lineOf(p: Paragraph, index: number): Line {
  let at = 0;
  for (let k = 0; k < p.lines.length; k++) {
    if (index < at + p.parts[k].length + 1) return p.lines[k];
    at += p.parts[k].length + 1;
  }
  return p.lines[p.lines.length - 1];
}

/** Clauses end at "; " or at a full stop before a space (decimal points have a digit after them). */
function clauses(text: string): Array<{ text: string; start: number }> {
  const out: Array<{ text: string; start: number }> = [];
  let start = 0;
  for (const m of text.matchAll(/[;.](?=\s|$)/g)) {
    out.push({ text: text.slice(start, m.index), start });
    start = m.index + 1;
  }
  if (start < text.length) out.push({ text: text.slice(start), start });
  return out;
}

function readClause(printed: string, offset: number, whole: string, offer: (f: ExtractionField, t: QuantityToken, rank: number) => void): void {
  // Footnote markers blanked ("18.0 (Note 2) V (17.10 V to 18.90 V)"), offsets kept.
  const clause = blankFootnotes(printed);
  const tokens = findQuantities(clause).filter((t) => t.kind);
  let primary: Primary | undefined;
  let labelStart = 0;
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    const before = clause.slice(i === 0 ? 0 : tokens[i - 1].end, t.index);
    const at = { ...t, index: t.index + offset, end: t.end + offset };
    // "(4.85 V to 5.36 V)" right after the nominal voltage: its limits.
    if (primary?.field === 'vzNom' && t.kind === 'voltage' && /^[^()0-9]{0,20}\(\s*$/.test(before)) {
      const next = tokens[i + 1];
      if (next?.kind === 'voltage' && /^\s*(?:to|…|–|-)\s*$/.test(clause.slice(t.end, next.index))) {
        offer('vzMin', at, 3);
        offer('vzMax', { ...next, index: next.index + offset, end: next.end + offset }, 3);
        i++;
        continue;
      }
    }
    // "UZ is 2.70 V nominal (2.57 V to 2.84 V)" with the nominal unread (a scan lost it): the
    // bracketed range is the Zener voltage's limits, never the nominal itself.
    const next = tokens[i + 1];
    if (t.kind === 'voltage' && /\(\s*$/.test(before) && next?.kind === 'voltage' && /^\s*(?:to|…|–|-)\s*$/.test(clause.slice(t.end, next.index))) {
      const named = fieldFor(clause.slice(labelStart, t.index), 'voltage')?.field;
      if (named === 'vzNom' || named === 'vzMin' || named === 'vzMax') {
        offer('vzMin', at, 2);
        offer('vzMax', { ...next, index: next.index + offset, end: next.end + offset }, 2);
      }
      primary = undefined;
      labelStart = next.end;
      i++;
      continue;
    }
    if (primary && CONDITION_BEFORE.test(before)) {
      const symbol = [...before.matchAll(CONDITION_SYMBOL)].pop();
      const field = symbol ? conditionField(symbol[1], t.kind, primary.field) : bareConditionField(t.kind, primary.field);
      if (field) offer(field, at, 1);
      labelStart = t.end;
      continue;
    }
    if (/=\s*$/.test(before)) {
      // "SYMBOL = value" with no value before it names a condition of the part, not a rating.
      labelStart = t.end;
      continue;
    }
    // After the number only a qualifier word belongs to its label ("12 V nominal", "0.1 µA maximum").
    const after = /^\s*(?:nom(?:inal)?|max(?:imum)?|min(?:imum)?|typ(?:ical(?:ly)?)?)\b/i.exec(clause.slice(t.end))?.[0] ?? '';
    const label = clause.slice(labelStart, t.index) + ' ' + after;
    const match = fieldFor(label, t.kind) ?? continuation(label, t, primary);
    labelStart = t.end;
    if (!match) {
      primary = undefined;
      continue;
    }
    // A limit of the coefficient alone is not the card's value; nor is a typical leakage the maximum.
    if ((match.field === 'tc' && match.rank === 0) || (match.qualifier === 'typ' && match.field !== 'tc')) continue;
    primary = { field: match.field, token: t };
    offer(match.field, at, 2);
  }
  void whole;
}

/**
 * A value whose words are only a connective, read from the value before it in the clause:
 * "its dynamic resistance there is at most 40 Ω and at most 170 Ω at 0.5 mA" — a second
 * impedance after the one at the test current is the knee impedance (its current follows as its
 * condition). "The current must stay below 10 mA" is the maximum current.
 */
function continuation(label: string, t: QuantityToken, primary: Primary | undefined): FieldMatch | undefined {
  const connective = /^\s*(?:,|and|or)?\s*(?:at\s+most|not\s+more\s+than|up\s+to|max(?:imum)?\.?)?\s*$/i;
  if (t.kind === 'resistance' && primary?.field === 'zzt' && /^\s*(?:,|and)\s*/i.test(label) && connective.test(label)) return { field: 'zzk', rank: 1 };
  if (
    t.kind === 'current' &&
    /\bcurrent\s+(?:must|should|shall)\s+(?:stay|remain|be\s+kept)\s+(?:below|under)\s*$|\bcurrent\s+must\s+not\s+exceed\s*$/i.test(label.trim())
  )
    return { field: 'izm', rank: 1 };
  return undefined;
}
