import type { ExtractedFields, ExtractedValue, ExtractedVariant, ExtractionField, ExtractionResult } from '@shuntwise/contracts';
import { EXTRACTION_FIELDS } from '@shuntwise/contracts';
import { readBlocks } from './block-reader';
import { readDeviceValues } from './device-values';
import { PdfText, readPdf } from './pdf-text';
import { readTables } from './table-reader';
import { pageLines } from './text-layout';
import { Candidate, VariantDraft, VariantDrafts } from './variant-drafts';

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
  const drafts = new VariantDrafts();
  const used = readTables(pages, drafts, warnings);
  readBlocks(pages, used, drafts);
  const device = readDeviceValues(pages, used);
  const variants: ExtractedVariant[] = [];
  for (const draft of drafts.all()) {
    if (draft.fields.size === 0) continue;
    for (const f of DEVICE_FIELDS) {
      const c = device[f];
      if (c) draft.offer(f, c);
    }
    if (device.package) draft.offerPackage(device.package);
    variants.push(toVariant(draft, warnings));
  }
  if (variants.length === 0) {
    warnings.push('No part numbers with ratings were recognised in this PDF. Enter the ratings by hand.');
  }
  return { variants, warnings, pages: pdf.pageCount, hasText: true };
}

function toVariant(draft: VariantDraft, warnings: string[]): ExtractedVariant {
  const fields: ExtractedFields = {};
  for (const f of EXTRACTION_FIELDS) {
    const c = draft.fields.get(f);
    if (!c) continue;
    const value = f === 'tc' ? tcValue(draft, c, warnings) : plain(c);
    if (value) fields[f as ExtractionField] = value;
  }
  const p = draft.package;
  return { mpn: draft.mpn, ...(p ? { package: { value: p.value, page: p.page, text: p.text, ...(p.box ? { box: p.box } : {}) } } : {}), fields };
}

function plain(c: Candidate): ExtractedValue {
  const v: ExtractedValue = { value: c.value, unit: c.unit, si: tidy(c.si), page: c.page, text: c.text };
  if (c.box) v.box = c.box;
  if (c.note) v.note = c.note;
  return v;
}

/** The coefficient in V/K; a %/K figure is relative to the nominal voltage of the same variant. */
function tcValue(draft: VariantDraft, c: Candidate, warnings: string[]): ExtractedValue | undefined {
  if (c.kind !== 'tempCoPercent') return plain(c);
  const vz = draft.fields.get('vzNom');
  if (!vz) {
    warnings.push(`${draft.mpn}: the temperature coefficient is given in ${c.unit} but no nominal Zener voltage was found to convert it; tc left empty.`);
    return undefined;
  }
  return {
    ...plain(c),
    si: tidy((c.si / 100) * vz.si),
    note: `converted from ${c.value} ${c.unit} with VZnom = ${vz.value} ${vz.unit}: ${c.value} % of ${vz.value} V per kelvin`,
  };
}

/** 0.043000000000000003 → 0.043: parsing multiplies by prefixes; keep 12 significant digits. */
function tidy(x: number): number {
  return Number(x.toPrecision(12));
}
