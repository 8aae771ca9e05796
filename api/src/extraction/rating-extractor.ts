import type { ExtractedFields, ExtractedValue, ExtractedVariant, ExtractionField, ExtractionResult } from '@shuntwise/contracts';
import { EXTRACTION_FIELDS, tcVoltsPerKelvin } from '@shuntwise/contracts';
import { readBlocks } from './block-reader';
import { covers, DeviceValues, readDeviceValues, specificity } from './device-values';
import { applyDecimalSeparator, DecimalSeparator, detectDecimalSeparator, printedNumber } from './number-style';
import { PdfText, readPdf } from './pdf-text';
import { readSentences } from './sentence-reader';
import { readTables } from './table-reader';
import { readTransposedTables } from './transposed-reader';
import { expandToleranceSuffixes, findToleranceLegends } from './tolerance-suffix';
import { pageLines } from './text-layout';
import { Candidate, VariantDraft, VariantDrafts } from './variant-drafts';
import { PLAUSIBLE } from './vocabulary';

/**
 * Candidate ratings from a datasheet's text: series tables, per-part blocks, and the
 * values printed once for the whole series. Suggestions for the engineer to accept or
 * correct; what cannot be read stays empty, nothing is guessed.
 */

export const NO_TEXT_WARNING =
  'No text found in this PDF: it looks like a scan (pages with images only). Enter the ratings by hand, or upload the vendor’s text PDF.';

const DEVICE_FIELDS = ['pdMax', 'tjMax', 'rthJA'] as const;

/** From the uploaded bytes to the extraction result. Throws the typed errors of readPdf. */
export async function extractDatasheet(buffer: Uint8Array): Promise<ExtractionResult> {
  return extractRatings(await readPdf(buffer));
}

export function extractRatings(pdf: PdfText): ExtractionResult {
  if (!pdf.hasText) return { variants: [], warnings: [NO_TEXT_WARNING], pages: pdf.pageCount, hasText: false };
  const warnings: string[] = [];
  const pages = pdf.pages.map(pageLines);
  const sep = detectDecimalSeparator(pages.flatMap((lines) => lines.map((l) => l.text)));
  applyDecimalSeparator(pages, sep);
  const drafts = new VariantDrafts();
  const used = readTables(pages, drafts, warnings);
  readTransposedTables(pages, drafts, used, warnings);
  readSentences(pages, used, drafts);
  readBlocks(pages, used, drafts);
  const withRatings = drafts.all().filter((d) => d.fields.size > 0);
  const device = readDeviceValues(
    pages,
    used,
    withRatings.map((d) => d.mpn),
    warnings,
  );
  const variants: ExtractedVariant[] = [];
  for (const draft of withRatings) {
    applyDevice(draft, device, warnings);
    variants.push(toVariant(draft, sep, warnings));
  }
  const expanded = expandToleranceSuffixes(variants, findToleranceLegends(pages), warnings);
  variants.splice(0, variants.length, ...expanded);
  if (variants.length === 0) {
    warnings.push('No part numbers with ratings were recognised in this PDF. Enter the ratings by hand.');
  }
  return { variants, warnings, pages: pdf.pageCount, hasText: true };
}

/** The device-wide values that cover this part: the most specific scope first, the best label next; a disagreement leaves the field empty. */
function applyDevice(draft: VariantDraft, device: DeviceValues, warnings: string[]): void {
  if (!draft.package) {
    let best: DeviceValues['packages'][number] | undefined;
    const covering = device.packages.filter((p) => covers(p.scope, draft.mpn, undefined));
    for (const p of covering) {
      if (!best || specificity(p.scope) > specificity(best.scope) || (specificity(p.scope) === specificity(best.scope) && p.score > best.score)) best = p;
    }
    // Two packages named as closely for this part (by scope; a heading's wording does not tell
    // them apart: "Package outline SOD-323" beside "Maximum ratings, SOD-523 package"): which
    // one it comes in is not known.
    const tie = covering.some((p) => specificity(p.scope) === specificity(best!.scope) && p.candidate.value !== best!.candidate.value);
    // The value shown where it is printed most plainly ("Package: SMB" rather than an ordering row).
    const shown = best && covering.filter((p) => p.candidate.value === best!.candidate.value).sort((a, b) => b.score - a.score)[0];
    if (shown && !tie) draft.offerPackage(shown.candidate);
  }
  for (const f of DEVICE_FIELDS) {
    if (draft.fields.has(f)) continue;
    // A value no such part can have (a −55 °C lower end read as the junction's limit) takes no part in the choice.
    const [lo, hi] = PLAUSIBLE[f];
    const applicable = device.values.filter(
      (v) => v.field === f && covers(v.scope, draft.mpn, draft.package?.value) && v.candidate.si >= lo && v.candidate.si <= hi,
    );
    if (!applicable.length) continue;
    const spec = Math.max(...applicable.map((v) => specificity(v.scope)));
    const mostSpecific = applicable.filter((v) => specificity(v.scope) === spec);
    const score = Math.max(...mostSpecific.map((v) => v.score));
    const top = mostSpecific.filter((v) => v.score === score);
    const first = top[0].candidate;
    const other = top.find((v) => Math.abs(v.candidate.si - first.si) > 1e-9 * Math.max(1e-12, Math.abs(first.si)));
    if (other) {
      warnings.push(
        `${draft.mpn}: ${f} left empty: "${first.text}" (page ${first.page}) and "${other.candidate.text}" (page ${other.candidate.page}) disagree and neither names this part's series or package.`,
      );
      continue;
    }
    draft.offer(f, first);
  }
}

function toVariant(draft: VariantDraft, sep: DecimalSeparator, warnings: string[]): ExtractedVariant {
  const fields: ExtractedFields = {};
  for (const f of EXTRACTION_FIELDS) {
    const c = draft.fields.get(f);
    const conflict = draft.conflicts.get(f);
    if (conflict) {
      warnings.push(`${draft.mpn}: ${f} left empty: ${conflict}.`);
      continue;
    }
    if (!c) continue;
    const value = f === 'tc' ? tcValue(draft, c, sep, warnings) : plain(c, sep);
    if (value) fields[f as ExtractionField] = value;
  }
  const p = draft.package;
  return { mpn: draft.mpn, ...(p ? { package: { value: p.value, page: p.page, text: p.text, ...(p.box ? { box: p.box } : {}) } } : {}), fields };
}

function plain(c: Candidate, sep: DecimalSeparator): ExtractedValue {
  const v: ExtractedValue = { value: printedNumber(c.value, sep), unit: c.unit, si: tidy(c.si), page: c.page, text: c.text, method: c.method };
  if (c.box) v.box = c.box;
  if (c.note) v.note = c.note;
  if (c.derived) v.derived = c.derived;
  return v;
}

/** The coefficient in V/K; a %/K figure is relative to the nominal voltage of the same variant. */
function tcValue(draft: VariantDraft, c: Candidate, sep: DecimalSeparator, warnings: string[]): ExtractedValue | undefined {
  if (c.kind !== 'tempCoPercent') return plain(c, sep);
  const vz = draft.fields.get('vzNom');
  if (!vz) {
    warnings.push(`${draft.mpn}: the temperature coefficient is given in ${c.unit} but no nominal Zener voltage was found to convert it; tc left empty.`);
    return undefined;
  }
  const value = printedNumber(c.value, sep);
  const vzValue = printedNumber(vz.value, sep);
  return {
    ...plain(c, sep),
    si: tidy(tcVoltsPerKelvin({ value: c.si, unit: '%/K' }, vz.si)),
    note: `converted from ${value} ${c.unit} with VZnom = ${vzValue} ${vz.unit}: ${value} % of ${vzValue} V per kelvin`,
    derived: 'converted',
  };
}

/** 0.043000000000000003 → 0.043: parsing multiplies by prefixes; keep 12 significant digits. */
function tidy(x: number): number {
  return Number(x.toPrecision(12));
}
