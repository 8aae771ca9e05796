import type { ExtractedValue, ExtractedVariant, ExtractionField, ExtractionResult } from '@shuntwise/contracts';
import { readPdf, type PdfText, type PdfTextItem } from '../pdf-text';
import { seriesLetters } from '../part-numbers';
import { extractRatings } from '../rating-extractor';
import { pageLines } from '../text-layout';
import { TOLERANCE_LEGEND_CONTEXT } from '../vocabulary';
import type { OcrEngine } from './ocr-engine';
import { ocrPages } from './page-ocr';
import { capitalised, corroboratedSpelling, detachedPoint, oneEditApart, seriesOutliers, unnamedSeries } from './series-checks';

/**
 * The whole reading of one file: the text layer where there is one, OCR for the pages that
 * are only an image. OCR'd pages become ordinary text items, so the same extractor reads
 * both; every value read from an OCR'd page carries `ocr: true` and its page and box, and
 * values that do not hang together (VZ min > nom, a nominal voltage far from the one coded in
 * the part number) are dropped with a warning: no value rather than a doubtful one.
 */

export interface OcrExtractionOptions {
  /** Null switches OCR off: image-only pages are reported, not read. */
  engine: OcrEngine | null;
  dpi: number;
  /** At most this many pages are read by OCR per file; the rest are named in a warning. */
  maxOcrPages: number;
  onOcrPage?: (page: number) => void;
}

export function noOcrRatingsWarning(page: number): string {
  return `page ${page}: no text layer and OCR found no ratings. Enter that page's ratings by hand.`;
}

export async function extractWithOcr(buffer: Uint8Array, options: OcrExtractionOptions): Promise<ExtractionResult> {
  const text = await readPdf(buffer);
  const textless = text.pages.filter((p) => p.items.length === 0).map((p) => p.page);
  if (textless.length === 0) return extractRatings(text);

  const warnings: string[] = [];
  const budget = options.engine ? Math.max(0, options.maxOcrPages) : 0;
  const toRead = textless.slice(0, budget);
  const skipped = textless.slice(budget);
  if (skipped.length) {
    warnings.push(
      options.engine
        ? `${pageList(skipped)}: no text layer, and not read by OCR (at most ${budget} page${budget === 1 ? '' : 's'} per file are). Enter their ratings by hand.`
        : `${pageList(skipped)}: no text layer, and OCR is switched off on this server. Enter their ratings by hand.`,
    );
  }
  const read = options.engine && toRead.length ? await ocrPages(buffer, toRead, { engine: options.engine, dpi: options.dpi, onPage: options.onOcrPage }) : [];
  // Two readings of each scanned page (the engine's own, and cell by cell on the cleaned page)
  // go through the same extractor and the same checks, then are combined: a value both read
  // alike stands, a value only one read stands (it passed every check), two that differ are
  // both left out. Neither reading is trusted more.
  const wholeItems = new Map(read.filter((r) => r.hasImage).map((r) => [r.page, r.items]));
  const cellItems = new Map(read.filter((r) => r.hasImage).map((r) => [r.page, r.cellItems]));
  // A tolerance-letter legend either reading found holds for both: the other may have cut it up.
  const legendPage = toleranceLegendPage(text, wholeItems) ?? toleranceLegendPage(text, cellItems);
  const whole = readingOf(text, wholeItems, legendPage);
  const cells = readingOf(text, cellItems, legendPage);
  const best = valueCount(cells.variants) > valueCount(whole.variants) ? cells : whole;
  const other = best === whole ? cells : whole;
  const { ocrItems } = best;
  const variants = combineReadings(best.variants, other.variants, [best.lines, other.lines], legendPage, warnings);
  const named = new Set(variants.map((v) => v.mpn));
  // The other reading's remarks only where they concern a part it alone found, or none.
  const own = (w: string) => named.has(w.slice(0, Math.max(0, w.indexOf(':'))));
  warnings.push(
    ...best.warnings,
    ...other.warnings.filter((w) => !best.warnings.includes(w) && !(own(w) && best.variants.some((v) => w.startsWith(`${v.mpn}:`)))),
  );
  const result = best.result;

  const pagesWithValues = new Set(variants.flatMap((v) => Object.values(v.fields).map((f) => f.page)));
  for (const page of ocrItems.keys()) {
    // A page whose parts were read and then left out (a tolerance legend OCR could not read) has its own remark.
    const leftOut = warnings.some((w) => w.startsWith(`page ${page}: `) && /\bleft out\b/.test(w));
    if (!pagesWithValues.has(page) && !leftOut) warnings.push(noOcrRatingsWarning(page));
  }
  // The extractor's own "no text found" remark is replaced by the per-page ones above.
  const rest = result.warnings.filter((w) => !/^No text found/.test(w) && !(variants.length === 0 && /^No part numbers/.test(w)));
  if (variants.length === 0 && text.hasText) warnings.push('No part numbers with ratings were recognised in this PDF. Enter the ratings by hand.');
  return { variants, warnings: [...new Set([...warnings, ...rest])], pages: text.pageCount, hasText: text.hasText };
}

/** Flags what came from OCR and drops OCR'd voltages that contradict each other or the part number. */
function markAndCheck(variant: ExtractedVariant, ocrPages: Map<number, unknown>, warnings: string[]): ExtractedVariant | undefined {
  const fields = { ...variant.fields };
  let fromOcr = false;
  for (const key of Object.keys(fields) as ExtractionField[]) {
    const value = fields[key]!;
    if (ocrPages.has(value.page)) {
      fields[key] = { ...value, ocr: true };
      fromOcr = true;
    }
  }
  if (!fromOcr) return variant;
  const dropped = leaveOut(fields, implausibleValues(variant.mpn, fields));
  if (dropped.length) {
    warnings.push(`${variant.mpn}: ${dropped.join(', ')} read by OCR did not agree with the other voltages or the part number; left empty, check the page.`);
  }
  if (Object.keys(fields).length === 0) return undefined;
  return { ...variant, fields };
}

/**
 * OCR values that cannot be right: a negative value of any field but the coefficient; a figure
 * with a leading zero and no separator; VZ min ≤ nom ≤ max must hold, VR must be below VZ, the
 * coefficient within ±0.15 %/K, the power rating near (Tj max − TA) / RthJA, the currents in
 * order (IZK < IZT ≤ IZM, IZT × VZ within the power rating), and the nominal
 * voltage coded in a regulator part number (…5V1 = 5.1 V) must be within 10 %
 * of the VZ read (common practice for regulator-diode part numbering, no source).
 */
export function implausibleValues(mpn: string, fields: ExtractedVariant['fields']): ExtractionField[] {
  const vzRead = (['vzMin', 'vzNom', 'vzMax'] as const).filter((f) => fields[f]?.ocr);
  const coded = codedVoltage(mpn);
  const bad = new Set<ExtractionField>();
  // Only the temperature coefficient has a sign: a negative current, voltage, impedance or
  // rating is an equals sign the scan turned into a minus ("UR = 5.3 V" read as "UR -5.3V").
  for (const [f, v] of Object.entries(fields) as [ExtractionField, ExtractedVariant['fields'][ExtractionField]][]) {
    if (f !== 'tc' && v?.ocr && v.si < 0) bad.add(f);
  }
  if (coded !== undefined) {
    for (const f of vzRead) {
      const si = fields[f]!.si;
      const limit = f === 'vzNom' ? 0.1 : 0.25;
      if (Math.abs(si - coded) > limit * coded) bad.add(f);
    }
  }
  // The reverse (stand-off) voltage of a leakage test lies below the breakdown voltage (common practice, no source).
  // Without a VZ read, the one coded in the part number bounds it ("UR = 5.7 V" read as 57 V for an 8V2 part).
  const vzLow = fields.vzMin?.si ?? fields.vzNom?.si ?? coded;
  if (fields.vr?.ocr && vzLow !== undefined && fields.vr.si >= vzLow) bad.add('vr');
  // A regulator diode's coefficient stays within about ±0.15 %/K of VZ (common practice, no source): a
  // larger one is a decimal point the scan lost.
  // Without a VZ (read, or coded in the part number) nothing bounds it, and a decimal comma the
  // scan lost makes it ten times too large ("+8,7 mV/°C" read as "+87"): it is left out.
  const vz = fields.vzNom?.si ?? fields.vzMax?.si ?? coded;
  if (fields.tc?.ocr && (vz === undefined || Math.abs(fields.tc.si) > 0.0015 * vz)) bad.add('tc');
  // Reverse leakage at the test voltage is specified in nA or µA, a few hundred µA at most for
  // low-voltage power parts (common practice, from memory, no source): a milliampere or more is a
  // lost µ ("0,5 µA" under a units row read as "A").
  // Nor is it below a nanoampere: datasheets specify it in nA or µA (common practice, from memory,
  // no source), so picoamperes are a µ read as p ("1 µA" read as "1pA").
  if (fields.irMax?.ocr && (fields.irMax.si >= 1e-3 || fields.irMax.si < 1e-9)) bad.add('irMax');
  // A figure printed with a leading zero and no separator ("05" for 0,5 µA) is a decimal comma or
  // point the scan lost: ten times too large, or more. So may be one with a lone point before it.
  for (const [f, v] of Object.entries(fields) as [ExtractionField, ExtractedVariant['fields'][ExtractionField]][]) {
    if (v?.ocr && (/^[+\-−]?0\d/.test(v.value) || detachedPoint(v))) bad.add(f);
  }
  // The power rating at an ambient temperature is the junction's headroom over the thermal
  // resistance, Pd = (Tj max − TA) / RthJA (common practice for regulator-diode ratings, no
  // source): OCR'd figures far from it (2 W read as 1 W, "63" as "6.3") cannot all be right, and
  // which one is wrong is not known; the power and the resistance are left out, Tj max kept.
  const { pdMax, rthJA, tjMax } = fields;
  if (pdMax && rthJA && tjMax && (pdMax.ocr || rthJA.ocr) && !/\bT\s*(?:L|C|S|SP|lead|case|sold)/i.test(pdMax.text)) {
    const ambient = Number(/\bT\s*(?:A|amb)\w*\s*[=≤]\s*(\d+)/i.exec(pdMax.text)?.[1] ?? 25);
    const expected = (tjMax.si - ambient) / rthJA.si;
    const ratio = pdMax.si / expected;
    if (!(expected > 0) || ratio < 0.6 || ratio > 1 / 0.6) {
      if (pdMax.ocr) bad.add('pdMax');
      if (rthJA.ocr) bad.add('rthJA');
    }
  }
  // Currents in order: knee < test ≤ maximum, and the test current's power IZT × VZ within the
  // rating (common practice for regulator diodes, no source). "3,5 mA" read as "35" breaks them.
  const { izk, izt, izm } = fields;
  const outOfOrder = (low: typeof izt, high: typeof izt, strict: boolean) =>
    low && high && (low.ocr || high.ocr) && (strict ? low.si >= high.si : low.si > high.si);
  if (outOfOrder(izk, izt, true)) for (const f of ['izk', 'izt'] as const) if (fields[f]!.ocr) bad.add(f);
  if (outOfOrder(izt, izm, false)) for (const f of ['izt', 'izm'] as const) if (fields[f]!.ocr) bad.add(f);
  const vzAt = fields.vzNom?.si ?? fields.vzMax?.si ?? coded;
  // The dynamic impedance at the test current is a small part of the diode's resistance there:
  // ZZT × IZT stays well under VZ (a few tenths of a volt on a 5 V part; common practice, no
  // source). A product above VZ itself is a decimal point the scan lost ("3.5 Ω" read as 35).
  const { zzt } = fields;
  if (zzt?.ocr && izt && vzAt !== undefined && zzt.si * izt.si > vzAt) bad.add('zzt');
  if (izt?.ocr && vzAt !== undefined && pdMax && !bad.has('pdMax') && izt.si * vzAt > pdMax.si) bad.add('izt');
  // A part's VZ limits lie within its tolerance, at most about ±20 % of VZ (common practice for
  // regulator diodes, no source): a figure more than 1.25× from another is a separator the scan
  // lost ("15,3 V" read as 153). The one far from both others goes; two that disagree both go.
  const vzSeen = (['vzMin', 'vzNom', 'vzMax'] as const).filter((f) => fields[f] && !bad.has(f));
  const far = (a: ExtractionField, b: ExtractionField) => {
    const [x, y] = [fields[a]!.si, fields[b]!.si];
    return Math.max(x, y) > 1.25 * Math.min(x, y);
  };
  if (vzSeen.length >= 2) {
    const outliers = vzSeen.filter((f) => vzSeen.every((g) => g === f || far(f, g)));
    const drop = outliers.length === 1 && vzSeen.length === 3 ? outliers : outliers.length ? vzSeen : [];
    for (const f of drop) if (fields[f]!.ocr) bad.add(f);
  }
  const ordered = (['vzMin', 'vzNom', 'vzMax'] as const).filter((f) => fields[f] && !bad.has(f));
  for (let i = 1; i < ordered.length; i++) {
    if (fields[ordered[i - 1]]!.si > fields[ordered[i]]!.si) {
      for (const f of ordered) if (fields[f]!.ocr) bad.add(f);
      break;
    }
  }
  return [...bad];
}

/** A part number's shape without its trailing letters (tolerance and packing suffixes): letters as A, digits as 9 ("QHZ4V7AF" → "AAA9A9"). */
const shapeOf = (mpn: string) =>
  mpn
    .replace(/[\p{L}\s-]+$/u, '')
    .replace(/\p{L}/gu, 'A')
    .replace(/\d/g, '9');

/**
 * OCR'd part numbers whose shape no other part of their series shares while at least three
 * others share one ("QHZ4VT7A" among QHZ4V3A, QHZ5V1A, …): a character misread, so the part
 * would be a new, wrong one. Precision before recall: its values are left out.
 */
export function misreadPartNumbers(mpns: readonly string[]): string[] {
  const out: string[] = [];
  for (const m of mpns) {
    const siblings = mpns.filter((o) => o !== m && seriesLetters(o) === seriesLetters(m));
    // Two rows run together ("VLY-39VLY-43"): another part's number, or the series' letters again, inside it.
    const prefix = seriesLetters(m);
    if (siblings.some((o) => o.length >= 4 && m.indexOf(o) > 0) || (prefix.length >= 2 && m.toUpperCase().indexOf(prefix, prefix.length) > 0)) {
      out.push(m);
      continue;
    }
    // A part alone in its series whose letters are those of a series of two or more with one
    // letter lost or changed ("KM36" beside KJM39, KJM43): a misreading, not a new series.
    if (siblings.length === 0 && prefix.length >= 2) {
      const near = new Set(
        mpns.map(seriesLetters).filter((p) => p !== prefix && mpns.filter((o) => seriesLetters(o) === p).length >= 2 && oneEditApart(p, prefix)),
      );
      if (near.size) {
        out.push(m);
        continue;
      }
    }
    const shapes = new Map<string, number>();
    for (const o of siblings) shapes.set(shapeOf(o), (shapes.get(shapeOf(o)) ?? 0) + 1);
    // An O or I between two digits ("GJ0O91J"): a digit misread or read twice; part numbers keep
    // these letters away from digits (common practice, no source).
    if (/\d[OI]\d/.test(m)) {
      out.push(m);
      continue;
    }
    // A digit read as the letter it looks like, after the first digit ("SC1S" beside SC13, SC15,
    // SC16): with the letters read as digits it is another part of the list, or has the shape
    // of two or more of the series while its own shape is held by none.
    const digits = asDigits(m);
    if (digits !== m && (mpns.includes(digits) || (!shapes.has(shapeOf(m)) && (shapes.get(shapeOf(digits)) ?? 0) >= 2))) {
      out.push(m);
      continue;
    }
    // A separator lost or gained ("VPK270" beside VPK-180, VPK-200, VPK-220, …): the series' usual
    // shape but for a hyphen, held by fewer parts than that shape. Several parts may share the
    // misreading, so this is asked before "another part has my shape".
    const own = shapeOf(m);
    // Only the separator between the series' letters and its digits: a point or hyphen between
    // digits is the voltage code's own ("CBX3-10" beside CBX3-9.1 lost nothing).
    const bare = (shape: string) => shape.replace(/(?<=A)[-\s./]+|[-\s./]+(?=A)/g, '');
    const mine = (shapes.get(own) ?? 0) + 1;
    if ([...shapes.entries()].some(([shape, n]) => shape !== own && n >= 3 && n > mine && bare(shape) === bare(own))) {
      out.push(m);
      continue;
    }
    if (shapes.has(own)) continue;
    // Plain numbers and letter-for-point codes live side by side in a series (10 / 5V1): only a shape that
    // differs from a common one by one character inserted inside it is a misreading.
    const dominant = [...shapes.entries()].find(([shape, n]) => n >= 3 && shape.length === shapeOf(m).length - 1);
    if (dominant && isOneInsertion(shapeOf(m), dominant[0])) out.push(m);
  }
  return out;
}

/** Letters the engine reads for digits (S for 5, O for 0, B for 8 …), read back as digits after a part number's first digit. */
const DIGIT_LOOKALIKES: Record<string, string> = { S: '5', O: '0', o: '0', I: '1', l: '1', B: '8', Z: '2', G: '6' };
function asDigits(mpn: string): string {
  const first = mpn.search(/\d/);
  if (first < 0) return mpn;
  // Also the digit after a voltage code's V ("NA7VS" for NA7V5).
  return mpn.slice(0, first) + mpn.slice(first).replace(/(?<=\d|\dV)[SOoIlBZG](?=\d|$)/g, (c) => DIGIT_LOOKALIKES[c]);
}

/** Whether removing one letter of `longer` (not its first or last character) gives `shorter`: 100 among 10, 12, 15 is a real part, 4VT7 among 5V1, 5V6 is not. */
function isOneInsertion(longer: string, shorter: string): boolean {
  for (let i = 1; i < longer.length - 1; i++) if (longer[i] === 'A' && longer.slice(0, i) + longer.slice(i + 1) === shorter) return true;
  return false;
}

/** "BRZ05-5V1" → 5.1; undefined when the part number codes no voltage. */
export function codedVoltage(mpn: string): number | undefined {
  const v = /(\d{1,3})V(\d{1,2})(?!\d)/.exec(mpn);
  // Only the letter-for-point code: a plain number at the end means different things per vendor (033 = 3.3 V or 33 V).
  return v ? Number(`${v[1]}.${v[2]}`) : undefined;
}

function pageList(pages: number[]): string {
  if (pages.length === 1) return `page ${pages[0]}`;
  const contiguous = pages.every((p, i) => i === 0 || p === pages[i - 1] + 1);
  return contiguous ? `pages ${pages[0]}–${pages[pages.length - 1]}` : `pages ${pages.join(', ')}`;
}

interface Reading {
  variants: ExtractedVariant[];
  warnings: string[];
  /** The document's lines as this reading has them. */
  lines: string[];
  ocrItems: Map<number, PdfTextItem[]>;
  result: ExtractionResult;
}

/**
 * Removes the fields from a part, and with a nominal VZ the coefficient converted from %/K with
 * it (its figure rests on that VZ). Returns what was removed.
 */
export function leaveOut(fields: ExtractedVariant['fields'], drop: readonly ExtractionField[]): ExtractionField[] {
  const out = [...drop];
  if (drop.includes('vzNom') && !drop.includes('tc') && fields.tc?.derived === 'converted') out.push('tc');
  for (const f of out) delete fields[f];
  return out;
}

/** Two figures read for one field agree when their SI values are equal (to rounding). */
const sameFigure = (a: ExtractedValue, b: ExtractedValue) => Math.abs(a.si - b.si) <= 1e-9 * Math.max(Math.abs(a.si), Math.abs(b.si));

/**
 * The two readings' parts as one list: per part and field, a value both read alike (the first
 * reading's text and box), or read by one only; two different figures for a field are both
 * left out with a warning (which is right is not known). The combined parts go through the
 * value and document checks again: fields from two readings must still hang together, and a
 * part number one reading misread may now sit beside the other reading's right one.
 */
export function combineReadings(
  first: ExtractedVariant[],
  second: ExtractedVariant[],
  readings: string[][],
  legendPage: number | undefined,
  warnings: string[],
): ExtractedVariant[] {
  const others = new Map(second.map((v) => [v.mpn, v]));
  const combined: ExtractedVariant[] = [];
  for (const v of first) {
    const o = others.get(v.mpn);
    others.delete(v.mpn);
    if (!o) {
      combined.push(v);
      continue;
    }
    const fields: ExtractedVariant['fields'] = { ...o.fields, ...v.fields };
    const differ = (Object.keys(fields) as ExtractionField[]).filter((key) => {
      const [a, b] = [v.fields[key], o.fields[key]];
      return a && b && !sameFigure(a, b);
    });
    leaveOut(fields, differ);
    if (differ.length) warnings.push(`${v.mpn}: two OCR readings of the page gave different figures for ${differ.join(', ')}; left empty, check the page.`);
    const dropped = leaveOut(fields, implausibleValues(v.mpn, fields));
    if (dropped.length) {
      warnings.push(`${v.mpn}: ${dropped.join(', ')} read by OCR did not agree with the other voltages or the part number; left empty, check the page.`);
    }
    if (Object.keys(fields).length) combined.push({ ...v, package: v.package ?? o.package, fields });
  }
  combined.push(...others.values());
  return documentChecks(combined, readings, readings.flat(), legendPage, warnings);
}

const valueCount = (variants: ExtractedVariant[]) => variants.reduce((n, v) => n + Object.keys(v.fields).length, 0);

/** One reading of the scanned pages through the extractor and the OCR checks. */
/** The text layer with one reading's OCR'd words on its scanned pages. */
function mergedText(text: PdfText, ocrItems: Map<number, PdfTextItem[]>): PdfText {
  return {
    pageCount: text.pageCount,
    hasText: text.hasText || [...ocrItems.values()].some((items) => items.length > 0),
    pages: text.pages.map((p) => (ocrItems.has(p.page) ? { ...p, items: ocrItems.get(p.page)! } : p)),
  };
}

/** The first scanned page that says the tolerance is a letter after the part number, in this reading. */
function toleranceLegendPage(text: PdfText, ocrItems: Map<number, PdfTextItem[]>): number | undefined {
  const merged = mergedText(text, ocrItems);
  return [...ocrItems.keys()].find((page) => pageLines(merged.pages[page - 1]).some((l) => TOLERANCE_LEGEND_CONTEXT.test(l.text)));
}

function readingOf(text: PdfText, ocrItems: Map<number, PdfTextItem[]>, legendPage: number | undefined): Reading {
  const warnings: string[] = [];
  const merged = mergedText(text, ocrItems);
  const result = extractRatings(merged);
  const marked = result.variants.map((v) => markAndCheck(v, ocrItems, warnings)).filter((v): v is ExtractedVariant => v !== undefined);
  const lines = merged.pages.flatMap((p) => pageLines(p).map((l) => l.text));
  // Parts of a series no other line names are judged once the readings are combined (the other may name it).
  const variants = documentChecks(marked, null, lines, legendPage, warnings);
  return { variants, warnings, lines, ocrItems, result };
}

const isOcr = (v: ExtractedVariant) => Object.values(v.fields).some((f) => f.ocr);

/**
 * The checks that judge OCR'd parts against the rest of the document (part-number shapes,
 * series neighbours, names no other line carries, the tolerance legend): run on each reading,
 * and again on the two readings combined, since a part one reading misread may sit beside the
 * other reading's right one.
 */
function documentChecks(
  read: ExtractedVariant[],
  readings: string[][] | null,
  lines: readonly string[],
  legendPage: number | undefined,
  warnings: string[],
): ExtractedVariant[] {
  // A 0 or 1 read as a letter beside a digit ("GCAO033", "GJ0o91J"): spelled as another line of
  // the document names the part, where exactly one line's spelling fits.
  // A part the same reading also found under that spelling is left to that one.
  const asRead = new Set(read.map((v) => v.mpn));
  const marked = read.flatMap((v) => {
    const spelled = isOcr(v) ? corroboratedSpelling(v.mpn, lines) : undefined;
    if (!spelled) return [v];
    if (!asRead.has(spelled)) return [{ ...v, mpn: spelled }];
    warnings.push(`${v.mpn}: read by OCR as well as ${spelled}; left out, check the page.`);
    return [];
  });
  // Small letters among capitals: mended where the letter has the capital's shape, else a misreading.
  const names = marked.map((v) => v.mpn);
  const checked: ExtractedVariant[] = [];
  for (const v of marked) {
    const mended = isOcr(v) && /\p{Ll}/u.test(v.mpn) ? capitalised(v.mpn, names) : undefined;
    if (mended === undefined) checked.push(v);
    else if (mended === null)
      warnings.push(`${v.mpn}: this part number read by OCR has small letters among capitals (a misread character?); its values are left out, check the page.`);
    else if (names.includes(mended)) warnings.push(`${v.mpn}: read by OCR as well as ${mended}; left out, check the page.`);
    else checked.push({ ...v, mpn: mended });
  }
  const misread = misreadPartNumbers(checked.filter(isOcr).map((v) => v.mpn));
  for (const mpn of misread) {
    warnings.push(`${mpn}: this part number read by OCR is unlike the others of its series (a misread character?); its values are left out, check the page.`);
  }
  let variants = checked.filter((v) => !misread.includes(v.mpn));
  // Figures no neighbour in the series comes near (a separator lost on one row).
  const outliers = seriesOutliers(variants);
  variants = variants.flatMap((v) => {
    const off = outliers.get(v.mpn);
    if (!off) return [v];
    const fields = { ...v.fields };
    warnings.push(`${v.mpn}: ${leaveOut(fields, off).join(', ')} read by OCR far from the other parts of the series; left empty, check the page.`);
    return Object.keys(fields).length ? [{ ...v, fields }] : [];
  });
  // Parts of a series no line but their own rows names (a letter lost or misread alike on every row).
  // Only on the combined readings (`readings`, the lines of each): a part one reading found alone may be named by the other.
  const lone =
    readings === null
      ? []
      : unnamedSeries(
          variants.map((v) => ({ mpn: v.mpn, ocr: isOcr(v) })),
          readings,
        );
  for (const mpn of lone) {
    warnings.push(
      `${mpn}: read by OCR, but no line of the document besides its series' own rows names the series (a misread character?); its values are left out, check the page.`,
    );
  }
  variants = variants.filter((v) => !lone.includes(v.mpn));
  // A scanned page that says the tolerance is a letter after the part number: an OCR'd part with
  // no VZ limits, printed or derived from a letter, is one the legend did not expand (a legend OCR
  // could not read, or read only for another series: "C %" with its figure lost), a base number
  // the vendor does not sell as such.
  if (legendPage !== undefined) {
    // Parts the legend did expand stay when their VZnom was unreadable: their full numbers are
    // known (the same type under two or more of the legend's letters), only their limits are not.
    const typeOf = (mpn: string) => (/\d\p{Lu}$/u.test(mpn) ? mpn.slice(0, -1) : undefined);
    const letters = new Map<string, number>();
    for (const v of variants) {
      const type = typeOf(v.mpn);
      if (type) letters.set(type, (letters.get(type) ?? 0) + 1);
    }
    const expanded = (v: ExtractedVariant) => (letters.get(typeOf(v.mpn) ?? '') ?? 0) >= 2;
    const bases = variants.filter((v) => isOcr(v) && !v.fields.vzMin && !v.fields.vzMax && !expanded(v));
    if (bases.length) {
      warnings.push(
        `page ${legendPage}: the tolerance is given by a letter after the part number, but OCR could not read the legend of the letters for ${bases.map((v) => v.mpn).join(', ')}; they are left out (their full part numbers are not known). Enter them by hand.`,
      );
      variants = variants.filter((v) => !bases.includes(v));
    }
  }
  return variants;
}
