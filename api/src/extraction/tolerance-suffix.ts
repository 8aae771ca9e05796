import type { ExtractedValue, ExtractedVariant } from '@shuntwise/contracts';
import { flat } from './device-values';
import { Line, lineBox } from './text-layout';
import { TOLERANCE_LEGEND, TOLERANCE_LEGEND_CONTEXT } from './vocabulary';

/**
 * Tolerance given only by a letter after the part number, with a legend ("the letter after
 * the type number gives it: A ±1 %, B ±2 %, C ±5 %"). Each printed type becomes one variant
 * per letter, its VZ limits derived as VZnom × (1 ∓ tolerance) and marked so (common
 * practice, no source). Nothing is derived without a legend that says it is about tolerance.
 */

export interface ToleranceLegend {
  letters: Array<{ letter: string; pct: number }>;
  page: number;
  text: string;
  box: ExtractedValue['box'];
  /** Part-number letters of the example the legend gives, when it gives one ("Example: NJVC56A"). */
  prefix?: string;
}

export function findToleranceLegends(pages: Line[][]): ToleranceLegend[] {
  const out: ToleranceLegend[] = [];
  for (const lines of pages) {
    for (let i = 0; i < lines.length; i++) {
      // A legend may wrap: read each line together with the next. Beside another column (a
      // two-column page read as one), a cell is read with the cells at its own left edge above
      // and below it.
      const aligned = (line: Line | undefined, x0: number) => line?.cells.find((c) => Math.abs(c.x0 - x0) < 4)?.text ?? '';
      const readings = [
        { own: lines[i].text, next: lines[i + 1]?.text ?? '', previous: lines[i - 1]?.text ?? '' },
        ...lines[i].cells.slice(1).map((c) => ({ own: c.text, next: aligned(lines[i + 1], c.x0), previous: aligned(lines[i - 1], c.x0) })),
      ];
      const found = readings
        .map((r) => {
          const text = r.next ? `${r.own} ${r.next}` : r.own;
          if (!TOLERANCE_LEGEND_CONTEXT.test(`${r.previous} ${text}`)) return undefined;
          // Letters that start on this line, their percentage possibly wrapped to the next ("… B ±2 %, C / ±5 %).").
          const letters: ToleranceLegend['letters'] = [];
          for (const m of text.matchAll(TOLERANCE_LEGEND)) if (m.index < r.own.length) letters.push({ letter: m[1], pct: Number(m[2]) });
          return letters.length >= 2 && new Set(letters.map((l) => l.letter)).size === letters.length ? { text, letters } : undefined;
        })
        .filter((r) => r !== undefined)
        // The reading that holds the most letters: a whole line cut a wrapped "C ±5 / %)" short.
        .sort((a, b) => b.letters.length - a.letters.length)[0];
      if (!found) continue;
      const { text, letters } = found;
      const example = /\b(?:example|e\.g\.)[:,]?\s+([A-Z][A-Z0-9-]{2,})/i.exec(text);
      out.push({
        letters,
        page: lines[i].page,
        text: lines[i].printed,
        box: lineBox(lines[i]),
        prefix: example ? /^[A-Z]+/.exec(flat(example[1]))?.[0] : undefined,
      });
    }
  }
  return out;
}

/** One variant per tolerance letter for each type that has VZnom but no printed limits. */
export function expandToleranceSuffixes(variants: ExtractedVariant[], legends: ToleranceLegend[], warnings: string[]): ExtractedVariant[] {
  if (legends.length === 0) return variants;
  const out: ExtractedVariant[] = [];
  for (const v of variants) {
    const nom = v.fields.vzNom;
    if (v.fields.vzMin || v.fields.vzMax) {
      out.push(v);
      continue;
    }
    const prefix = /^[A-Z]+/.exec(flat(v.mpn))?.[0];
    const own = legends.filter((l) => l.prefix === prefix);
    const candidates = own.length ? own : legends.filter((l) => !l.prefix);
    const keys = new Set(candidates.map((l) => l.letters.map((x) => `${x.letter}${x.pct}`).join()));
    if (candidates.length === 0) {
      out.push(v);
      continue;
    }
    if (keys.size > 1) {
      warnings.push(`${v.mpn}: several tolerance legends could apply; the tolerance letters were not expanded.`);
      out.push(v);
      continue;
    }
    const legend = candidates[0];
    for (const { letter, pct } of legend.letters) {
      // Without VZnom the letters still name the parts; only their limits stay empty.
      if (!nom) {
        out.push({ ...v, mpn: `${v.mpn}${letter}` });
        continue;
      }
      const limit = (sign: number): ExtractedValue => {
        const si = Number((nom.si * (1 + (sign * pct) / 100)).toPrecision(12));
        return {
          value: String(si),
          unit: 'V',
          si,
          page: legend.page,
          text: legend.text,
          box: legend.box,
          method: 'sentence',
          derived: 'tolerance-suffix',
          note: `derived from VZnom = ${nom.value} ${nom.unit} and the tolerance letter ${letter} (±${pct} %)`,
        };
      };
      out.push({ ...v, mpn: `${v.mpn}${letter}`, fields: { ...v.fields, vzMin: limit(-1), vzMax: limit(1) } });
    }
  }
  return out;
}
