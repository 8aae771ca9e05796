import { z } from 'zod';
import { CARD_FIELDS, type CardField } from '../parts/rating-card.schema';

/**
 * What the datasheet extraction found: candidate ratings per variant, each traceable to
 * its page and printed text. Returned by `GET /api/datasheets/:id/extraction`. Suggestions
 * only: an engineer accepts or corrects each one on the rating card.
 */

/** The card fields extraction looks for: all of the rating card's except pdRefC, which datasheets state as a condition of pdMax. */
export const EXTRACTION_FIELDS = CARD_FIELDS.filter((f): f is Exclude<CardField, 'pdRefC'> => f !== 'pdRefC');
export const extractionFieldSchema = z.enum(EXTRACTION_FIELDS);
export type ExtractionField = z.infer<typeof extractionFieldSchema>;

/** Where on the page the text sits, in PDF points from the page's bottom-left corner. */
export const extractionBoxSchema = z.object({
  x: z.number(),
  y: z.number(),
  width: z.number(),
  height: z.number(),
});
export type ExtractionBox = z.infer<typeof extractionBoxSchema>;

export const extractedValueSchema = z.object({
  /** The number as printed, e.g. "−2.1" or "0.5". */
  value: z.string(),
  /** The unit as printed, from the cell or from the column header, e.g. "mV/°C", "uA", "ohm". */
  unit: z.string(),
  /** SI value: V, A, Ω, W, °C, K/W; the temperature coefficient in V/K. */
  si: z.number(),
  /** 1-based page number. */
  page: z.number().int().positive(),
  /** The line or table row the value was read from. */
  text: z.string(),
  /** The cell or line on the page, for highlighting in the viewer. */
  box: extractionBoxSchema.optional(),
  /** How the value was derived when not read directly (e.g. a %/K figure converted with VZnom). */
  note: z.string().optional(),
  /** Where on the page it was found: a table cell, a key–value (leader) list, or a sentence of prose. */
  method: z.enum(['table', 'list', 'sentence']).optional(),
  /** True when the page had no text layer and the value was read by OCR: check it against the page. */
  ocr: z.boolean().optional(),
  /** Set when the value was not printed as such: derived from a part-number suffix's tolerance
   * legend, or converted (a %/K coefficient to V/K with VZnom). The editor asks for these first. */
  derived: z.enum(['tolerance-suffix', 'converted']).optional(),
});
export type ExtractedValue = z.infer<typeof extractedValueSchema>;

export const extractedPackageSchema = z.object({
  value: z.string(),
  page: z.number().int().positive(),
  text: z.string(),
  box: extractionBoxSchema.optional(),
});
export type ExtractedPackage = z.infer<typeof extractedPackageSchema>;

export const extractedFieldsSchema = z.object({
  vzMin: extractedValueSchema.optional(),
  vzNom: extractedValueSchema.optional(),
  vzMax: extractedValueSchema.optional(),
  izt: extractedValueSchema.optional(),
  zzt: extractedValueSchema.optional(),
  izk: extractedValueSchema.optional(),
  zzk: extractedValueSchema.optional(),
  irMax: extractedValueSchema.optional(),
  vr: extractedValueSchema.optional(),
  tc: extractedValueSchema.optional(),
  pdMax: extractedValueSchema.optional(),
  tjMax: extractedValueSchema.optional(),
  rthJA: extractedValueSchema.optional(),
  izm: extractedValueSchema.optional(),
});
export type ExtractedFields = z.infer<typeof extractedFieldsSchema>;

export const extractedVariantSchema = z.object({
  mpn: z.string(),
  package: extractedPackageSchema.optional(),
  fields: extractedFieldsSchema,
});
export type ExtractedVariant = z.infer<typeof extractedVariantSchema>;

export const extractionResultSchema = z.object({
  variants: z.array(extractedVariantSchema),
  /** Plain-language remarks: no text layer, a value that could not be read, a %/K figure without VZnom… */
  warnings: z.array(z.string()),
  /** Page count of the PDF. */
  pages: z.number().int().nonnegative(),
  /** False for a scan: pages with images only. */
  hasText: z.boolean(),
  /**
   * True when the stored reading was made by an earlier version of the datasheet reader
   * (set by `GET …/extraction`): reading the file again may find more, and leaves out figures
   * the earlier version got wrong. `POST …/extraction` reads it again.
   */
  outdated: z.boolean().optional(),
});
export type ExtractionResult = z.infer<typeof extractionResultSchema>;
