import type { ExtractedValue, ExtractedVariant, ExtractionField } from '@shuntwise/contracts';
import { E24 } from '../../engineering/e-series';
import { isPartNumber, seriesLetters } from '../part-numbers';

/**
 * Checks of OCR'd values against the other parts of their series: a scan that loses a decimal
 * separator ("3,5 mA" read as 35, "0,5 µA" as 5) or misreads a digit of one row leaves a figure
 * that no neighbour in the series comes near, though the figure alone is plausible. Pure: the
 * variants in, the fields to leave out per part number back.
 */

/**
 * Fields that change smoothly from one part of a series to the next by VZ (common practice for
 * regulator-diode series, no source): test and knee currents, leakage and its test voltage,
 * impedances, and the ratings shared by the series. Between adjacent parts they change by a few
 * times at most; a lost separator changes a figure ten times. Left out: the coefficient (it
 * changes sign near 5 V) and the maximum current (it falls as 1/VZ over the series).
 */
const SMOOTH: readonly ExtractionField[] = ['izt', 'izk', 'irMax', 'vr', 'zzt', 'zzk', 'pdMax', 'tjMax', 'rthJA'];
/** A figure this many times above or below both of its neighbours (or the two nearest on its only side) is not believed. */
const JUMP = 7;
/** A leakage test voltage whose share of VZ is this many times above or below both neighbours' is not believed. */
const SHARE_JUMP = 2.5;

/** The significant digits of a number: 8.2 → "82", 10 → "1", 0.33 → "33". */
function digitsOf(n: number): string {
  return String(n)
    .replace(/[.\-+]/g, '')
    .replace(/^0+/, '')
    .replace(/0+$/, '');
}

/**
 * The factor that turns a series' trailing numbers into its nominal VZ (1 for "TKV27" = 27 V, 0.1
 * for "TM-082" = 8.2 V), when two parts or more, and two thirds of those with a VZ, agree on one.
 */
function codeScale(coded: ReadonlyArray<{ v: ExtractedVariant; code: string }>): number | undefined {
  const withVz = coded.filter(({ v }) => v.fields.vzNom ?? v.fields.vzMin ?? v.fields.vzMax);
  let best: { scale: number; n: number } | undefined;
  // Never ten volts a unit: figures that all lost their decimal comma alike ("20,9" as 209 beside
  // "31,5" as 315) would otherwise agree on it. A number with a leading zero is never whole volts.
  for (const scale of [0.01, 0.1, 1]) {
    const n = withVz.filter(({ v, code }) => {
      if (scale === 1 && code.startsWith('0')) return false;
      const expected = Number(code) * scale;
      const { vzNom, vzMin, vzMax } = v.fields;
      if (vzNom) return digitsOf(vzNom.si) === digitsOf(Number(code)) && Math.abs(vzNom.si - expected) < 1e-9 * expected + 1e-12;
      return [vzMin, vzMax].every((f) => !f || Math.abs(f.si - expected) <= 0.1 * expected);
    }).length;
    if (!best || n > best.n) best = { scale, n };
  }
  return best && best.n >= 2 && best.n >= (2 / 3) * withVz.length ? best.scale : undefined;
}

/** Whether a part number's trailing number is an E24 value at some decade ("22", "082", "100", "560"). */
function isE24(code: string): boolean {
  const digits = digitsOf(Number(code));
  const mantissa = Number(`${digits[0]}.${digits.slice(1) || '0'}`);
  return digits.length <= 2 && E24.some((e) => Math.abs(e - mantissa) < 1e-9);
}

/** The number a part number ends with ("TM-082" → "082"), when it ends with one of two to four digits. */
function trailingNumber(mpn: string): string | undefined {
  // A letter or two after the number (a tolerance or package letter: "LCK12W", "GJ082J") keep it the part's code.
  return /(?:^|[^\d])(\d{2,4})\p{Lu}{0,2}$/u.exec(mpn)?.[1];
}

/**
 * Per part number, the OCR'd fields its series says cannot be right:
 * - a smooth field (SMOOTH) JUMP times off both neighbours by VZ;
 * - in a series that prints VZ as its part numbers' digits ("TM-082" is 8.2 V beside TM-091 at
 *   9.1 V and TM-100 at 10 V; common practice for plain-number series, no source): a nominal VZ
 *   that is not the part's digits, limits more than 25 % from them, a leakage test voltage at or
 *   above them ("20,9 V" read as 209 V, "15,4" as 154).
 */
export function seriesOutliers(variants: readonly ExtractedVariant[]): Map<string, ExtractionField[]> {
  const out = new Map<string, ExtractionField[]>();
  const flag = (mpn: string, field: ExtractionField) => out.set(mpn, [...(out.get(mpn) ?? []).filter((f) => f !== field), field]);
  const bySeries = new Map<string, ExtractedVariant[]>();
  for (const v of variants) bySeries.set(seriesLetters(v.mpn), [...(bySeries.get(seriesLetters(v.mpn)) ?? []), v]);
  for (const series of bySeries.values()) {
    if (series.length < 3) continue;
    // In VZ order where VZ is known, else in the order read.
    const ordered = series.map((v, i) => ({ v, key: v.fields.vzNom?.si ?? v.fields.vzMax?.si ?? v.fields.vzMin?.si, i }));
    const known = ordered.filter((o) => o.key !== undefined);
    const sorted = known.length === ordered.length ? [...ordered].sort((a, b) => a.key! - b.key! || a.i - b.i) : ordered;
    /** Flags a part whose figure (by `figure`) is `jump` times above or below both of its neighbours holding one. */
    const unlikeNeighbours = (field: ExtractionField, figure: (v: ExtractedVariant) => number | undefined, jump: number) => {
      const holding = sorted.filter((o) => (figure(o.v) ?? 0) > 0);
      if (holding.length < 3) return;
      holding.forEach((o, k) => {
        if (!o.v.fields[field]?.ocr) return;
        const before = holding.slice(0, k).reverse();
        const after = holding.slice(k + 1);
        const near = before.length && after.length ? [before[0], after[0]] : (before.length ? before : after).slice(0, 2);
        if (near.length < 2) return;
        const ratios = near.map((n) => figure(o.v)! / figure(n.v)!);
        if (ratios.every((r) => r >= jump) || ratios.every((r) => r <= 1 / jump)) flag(o.v.mpn, field);
      });
    };
    for (const field of SMOOTH) unlikeNeighbours(field, (v) => v.fields[field]?.si, JUMP);
    // The leakage test voltage as a share of VZ changes slowly along a series (about 0.3 at 3 V to
    // 0.7–0.8 above 10 V; common practice, no source), so a digit misread in VR ("7,7" as 1.7
    // beside 7 and 8.4 V) shows as a share far from both neighbours' even where the figure alone does not.
    const vzOf = (v: ExtractedVariant) => v.fields.vzNom?.si ?? v.fields.vzMax?.si ?? v.fields.vzMin?.si;
    unlikeNeighbours('vr', (v) => (v.fields.vr && vzOf(v) ? v.fields.vr.si / vzOf(v)! : undefined), SHARE_JUMP);
    // VZ as the part number's digits, at the scale the series' own parts show ("TKV27" at 27 V,
    // "TM-082" at 8.2 V): learnt from the parts whose nominal VZ is exactly their digits, or whose
    // VZ limits sit within 10 % around them, when two thirds of the series (two parts or more)
    // agree on one scale.
    const coded = series.map((v) => ({ v, code: trailingNumber(v.mpn) })).filter((c): c is { v: ExtractedVariant; code: string } => c.code !== undefined);
    const scale = codeScale(coded);
    if (scale === undefined) {
      // No part read well enough to show the scale, but every number of the series (three or
      // more) is an E24 value, the voltages regulator diodes are made in (IEC 60063, from memory):
      // the numbers code VZ in volts or tenths of a volt ("22" 22 V, "082" 8.2 V, "100" 10 V),
      // and an OCR'd VZ near neither, or a test voltage above both, lost a separator. The nominal
      // is the coded value itself, at either scale ("GCNP56": 56 V, never 53.2 V, a minimum read
      // into the nominal's column).
      if (coded.length < 3 || !coded.every(({ code }) => isE24(code))) continue;
      for (const { v, code } of coded) {
        const ends = code.startsWith('0') ? [Number(code) / 10] : [Number(code), Number(code) / 10];
        const nom = v.fields.vzNom;
        if (nom?.ocr && digitsOf(nom.si) !== digitsOf(Number(code))) flag(v.mpn, 'vzNom');
        for (const field of ['vzMin', 'vzMax'] as const) {
          const value = v.fields[field];
          if (value?.ocr && !ends.some((e) => Math.abs(value.si - e) <= 0.25 * e)) flag(v.mpn, field);
        }
        if (v.fields.vr?.ocr && v.fields.vr.si >= Number(code)) flag(v.mpn, 'vr');
      }
      continue;
    }
    for (const { v, code } of coded) {
      const expected = Number(code) * scale;
      const off = (field: ExtractionField, share: number) => {
        const value = v.fields[field];
        if (value?.ocr && Math.abs(value.si - expected) > share * expected) flag(v.mpn, field);
      };
      const nom = v.fields.vzNom;
      if (nom?.ocr && digitsOf(nom.si) !== digitsOf(Number(code))) flag(v.mpn, 'vzNom');
      off('vzMin', 0.25);
      off('vzMax', 0.25);
      // The leakage test voltage lies below the breakdown voltage (common practice, no source).
      if (v.fields.vr?.ocr && v.fields.vr.si >= expected) flag(v.mpn, 'vr');
    }
  }
  return out;
}

/**
 * A value with a lone point just before it on its OCR'd line (". 15W" for 1.5 W): the decimal
 * point of the figure, read apart from it, or a leader's last dot; which one is not known.
 */
export function detachedPoint(value: Pick<ExtractedValue, 'value' | 'text'>): boolean {
  const escaped = value.value.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return new RegExp(`(?:^|[^.])\\.\\s+${escaped}(?![\\d.,])`).test(value.text);
}

/**
 * The spelling another line of the document gives an OCR'd part number that holds a letter
 * touching a digit where the engine often sees a 0 or a 1 ("GCAO033", "GJ0o91J"): each such
 * letter is either dropped (a digit read twice, "0" as "O0") or read as the digit, and a spelling
 * stands only when some line of the document names it (its ordering code "GCA033-T7", the
 * legend's example "GJ091J", another heading) and no other spelling is also named. Undefined
 * otherwise: the part is then judged as read. The tolerance or suffix letters after the last
 * digit may differ from the line that names it.
 */
export function corroboratedSpelling(mpn: string, lines: readonly string[]): string | undefined {
  const found = new Set<string>();
  for (let i = 0; i < mpn.length; i++) {
    const digit = /[Oo]/.test(mpn[i]) ? '0' : /[Il|]/.test(mpn[i]) ? '1' : undefined;
    if (!digit || !(/\d/.test(mpn[i - 1] ?? '') || /\d/.test(mpn[i + 1] ?? ''))) continue;
    for (const edit of ['', digit]) {
      const spelled = mpn.slice(0, i) + edit + mpn.slice(i + 1);
      if (/\p{Ll}/u.test(spelled) || !isPartNumber(spelled)) continue;
      const stem = spelled.replace(/(?<=\d)\p{Lu}+$/u, '');
      if (stem.length <= i) continue;
      const named = new RegExp(`(?<![\\p{L}\\d])${stem.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?!\\d)`, 'u');
      if (lines.some((line) => named.test(line))) found.add(spelled);
    }
  }
  return found.size === 1 ? [...found][0] : undefined;
}

/** Letters whose small and capital forms differ only in size, which OCR confuses on a scan. */
const SAME_SHAPE = /[cjkopsuvwxz]/g;

/**
 * An OCR'd part number with small letters among parts printed in capitals ("FjJF300" beside
 * FJJF330, FSDT330): capitals where the small letter has the capital's shape; null when a small
 * letter of another shape is left (a misreading of some other kind); undefined when the part
 * number has no small letter or too few other parts are printed in capitals to judge.
 */
export function capitalised(mpn: string, others: readonly string[]): string | null | undefined {
  if (!/\p{Ll}/u.test(mpn)) return undefined;
  // A small o or l touching a digit is a digit misread ("GJ0o91" for GJ091), never a capital's shape.
  if (/\d[ol]|[ol]\d/.test(mpn)) return null;
  if (others.filter((o) => o !== mpn && /\p{Lu}/u.test(o) && !/\p{Ll}/u.test(o)).length < 2) return undefined;
  const mended = mpn.replace(SAME_SHAPE, (c) => c.toUpperCase());
  return /\p{Ll}/u.test(mended) ? null : mended;
}

/**
 * OCR'd parts of a series the document names nowhere else: no line but the parts' own mentions
 * the letters their numbers start with ("TK-16" alone, where the page's title and every other
 * row say TJK: a letter lost; "NKVO043, NKVO047, NKVO051" where the title says "NKV series": a
 * zero read as an O, alike on every row). A datasheet names its series in its title, headings
 * or ordering table, so the letters of a real series are mentioned more often than it has
 * parts. Precision before recall: such parts are left out. `readings`: the document's lines as
 * each OCR reading has them (mentions are counted per reading).
 */
export function unnamedSeries(variants: ReadonlyArray<{ mpn: string; ocr: boolean }>, readings: ReadonlyArray<readonly string[]>): string[] {
  const members = new Map<string, number>();
  for (const v of variants) members.set(seriesLetters(v.mpn), (members.get(seriesLetters(v.mpn)) ?? 0) + 1);
  // Per reading of the document (its lines): the mentions of the letters beyond one for each of
  // the series' parts whose number that reading holds (its own row). A reading may hold only some.
  const namedElsewhere = (letters: string) => {
    const word = new RegExp(`(?<![\\p{L}\\d])${letters}(?!\\p{L})`, 'giu');
    const series = variants.filter((v) => seriesLetters(v.mpn) === letters).map((v) => v.mpn.toUpperCase());
    return readings.some((lines) => {
      const mentions = lines.reduce((n, line) => n + (line.match(word)?.length ?? 0), 0);
      const rows = series.filter((mpn) => lines.some((line) => line.toUpperCase().includes(mpn))).length;
      return mentions > rows;
    });
  };
  // Series named as a word (capitals not followed by a number: "KPB and KJM series"), per reading.
  const namedWords = new Set(readings.flatMap((lines) => lines.flatMap((line) => line.match(/(?<![\p{L}\d\-/])\p{Lu}{2,}(?![\p{L}\d]|[-\s.]?\d)/gu) ?? [])));
  // Letters one off a series the document names ("KIM30" or "NKVO043" where the title says KJM or
  // NKV): a misreading, however many rows share it. The named word has three letters or more: two
  // capitals are as often a unit, a symbol or an abbreviation ("CB" on a page of the CBX3 series).
  const misreadOfNamed = (letters: string) => [...namedWords].some((w) => w !== letters && w.length >= 3 && oneEditApart(w, letters));
  // A series of two or more parts named nowhere else is kept otherwise: a scan of the table page
  // alone may name its series only in its rows.
  const doubtful = new Map(
    [...members.entries()].map(([letters, n]) => [letters, !namedWords.has(letters) && (misreadOfNamed(letters) || (n === 1 && !namedElsewhere(letters)))]),
  );
  return variants
    .filter((v) => {
      const letters = seriesLetters(v.mpn);
      return v.ocr && letters.length >= 2 && doubtful.get(letters);
    })
    .map((v) => v.mpn);
}

/** Whether two series' letters differ by one letter dropped or changed (KJM / KM, KJM / KIM). */
export function oneEditApart(a: string, b: string): boolean {
  if (a.length === b.length) return [...a].filter((c, i) => c !== b[i]).length === 1;
  const [long, short] = a.length > b.length ? [a, b] : [b, a];
  if (long.length !== short.length + 1) return false;
  for (let i = 0; i < long.length; i++) if (long.slice(0, i) + long.slice(i + 1) === short) return true;
  return false;
}
