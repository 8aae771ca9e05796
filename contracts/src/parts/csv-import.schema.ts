import { z } from 'zod';
import { CARD_FIELDS } from './rating-card.schema';
import { manufacturerNameSchema } from './vendor-part.schema';

/**
 * CSV import of a vendor series: one row per part. Columns are `manufacturer` (or the
 * request's `manufacturer` for the whole file), `mpn`, `package`, `lifecycleNote`, and
 * the card fields by name (`vzNom`, `izt`, `tc`, …). A unit goes in the header
 * (`izt (mA)`, `izt [mA]`) or in each cell (`5 mA`). Nothing is written by the preview;
 * the confirm call re-reads the same text and writes every row or none.
 */
export const csvImportRequestSchema = z.strictObject({
  csv: z.string().min(1, 'The CSV is empty').max(2_000_000),
  /** Manufacturer for rows without a manufacturer column. */
  manufacturer: manufacturerNameSchema.optional(),
  /** Datasheet the values come from (recorded in each value's provenance). */
  datasheetId: z.number().int().positive().optional(),
});
export type CsvImportRequest = z.infer<typeof csvImportRequestSchema>;

export const CSV_ROW_ACTIONS = ['create', 'add-card', 'unchanged', 'conflict'] as const;
export const csvRowActionSchema = z.enum(CSV_ROW_ACTIONS);
export type CsvRowAction = z.infer<typeof csvRowActionSchema>;

/** A problem in one cell: `row` is the line number in the file (the header is row 1). */
export const csvCellErrorSchema = z.object({ row: z.number().int(), column: z.string(), message: z.string() });
export type CsvCellError = z.infer<typeof csvCellErrorSchema>;

export const csvColumnSchema = z.object({
  header: z.string(),
  /** What the column was read as; null when it is not used (it is listed in warnings). */
  field: z.union([z.enum(CARD_FIELDS), z.enum(['manufacturer', 'mpn', 'package', 'lifecycleNote'])]).nullable(),
  unit: z.string().nullable(),
});

export const csvPreviewRowSchema = z.object({
  row: z.number().int(),
  manufacturer: z.string().nullable(),
  mpn: z.string().nullable(),
  package: z.string().nullable(),
  /** create: new vendor part and card; add-card: the part exists without a card; unchanged: same card already there; conflict: the part has a different card, which the import never overwrites. */
  action: csvRowActionSchema.nullable(),
  vendorPartId: z.number().int().nullable(),
  values: z.record(z.string(), z.object({ value: z.number(), printed: z.string(), unit: z.string().optional() })),
  errors: z.array(csvCellErrorSchema),
});
export type CsvPreviewRow = z.infer<typeof csvPreviewRowSchema>;

export const csvImportPreviewSchema = z.object({
  columns: z.array(csvColumnSchema),
  rows: z.array(csvPreviewRowSchema),
  /** Every cell error of every row, in file order. */
  errors: z.array(csvCellErrorSchema),
  warnings: z.array(z.string()),
  summary: z.object({
    rows: z.number().int(),
    withErrors: z.number().int(),
    create: z.number().int(),
    addCard: z.number().int(),
    unchanged: z.number().int(),
    conflict: z.number().int(),
  }),
});
export type CsvImportPreview = z.infer<typeof csvImportPreviewSchema>;

export const csvImportResultSchema = z.object({
  created: z.number().int(),
  cardsAdded: z.number().int(),
  unchanged: z.number().int(),
  /** Rows left alone because the part already has a different card. */
  conflicts: z.array(z.object({ row: z.number().int(), mpn: z.string(), vendorPartId: z.number().int() })),
  vendorPartIds: z.array(z.number().int()),
});
export type CsvImportResult = z.infer<typeof csvImportResultSchema>;
