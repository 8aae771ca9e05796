import { z } from 'zod';
import { actorSchema } from './page.schema';
import { ratingCardFieldsInputSchema } from './rating-card.schema';
import { manufacturerNameSchema, mpnSchema, packageSchema } from './vendor-part.schema';

export const revisionLabelSchema = z.string().trim().min(1).max(40);

/** Multipart fields beside `file` on `POST /datasheets` (strings, as forms send them). */
export const uploadDatasheetFieldsSchema = z.object({
  // A form sends digits as text; anything else (true, "1e3", "") is refused, not coerced into an id.
  vendorPartId: z.preprocess((v) => (typeof v === 'string' && /^\d+$/.test(v.trim()) ? Number(v) : v), z.number().int().positive()).optional(),
  revision: revisionLabelSchema.optional(),
});
export type UploadDatasheetFields = z.infer<typeof uploadDatasheetFieldsSchema>;

/** Answer of an upload; `existing` is true when the same file (by sha256) was already stored. */
export const uploadDatasheetResponseSchema = z.object({
  id: z.number().int(),
  sha256: z.string(),
  pages: z.number().int(),
  sizeBytes: z.number().int(),
  fileName: z.string(),
  createdAt: z.string(),
  existing: z.boolean(),
});
export type UploadDatasheetResponse = z.infer<typeof uploadDatasheetResponseSchema>;

export const datasheetSchema = z.object({
  id: z.number().int(),
  sha256: z.string(),
  pages: z.number().int(),
  sizeBytes: z.number().int(),
  fileName: z.string(),
  revision: z.string().nullable(),
  createdAt: z.string(),
  uploadedBy: actorSchema.nullable(),
  vendorPartIds: z.array(z.number().int()),
  /** Variants and warnings the extraction found (details at /datasheets/:id/extraction). */
  variantCount: z.number().int(),
  warningCount: z.number().int(),
});
export type Datasheet = z.infer<typeof datasheetSchema>;

/** One reviewed variant of a series datasheet: becomes a vendor part (found or created) with its first card. */
export const datasheetVariantInputSchema = z.strictObject({
  mpn: mpnSchema,
  package: packageSchema.nullish(),
  lifecycleNote: z.string().trim().max(500).nullish(),
  fields: ratingCardFieldsInputSchema,
});
export type DatasheetVariantInput = z.input<typeof datasheetVariantInputSchema>;

/** `POST /datasheets/:id/variants`: every reviewed variant at once; all are written or none. */
export const createVariantsRequestSchema = z
  .strictObject({
    manufacturer: manufacturerNameSchema,
    variants: z.array(datasheetVariantInputSchema).min(1).max(500),
  })
  .superRefine((r, ctx) => {
    const seen = new Map<string, number>();
    r.variants.forEach((v, i) => {
      const key = v.mpn.toLowerCase();
      if (seen.has(key)) ctx.addIssue({ code: 'custom', path: ['variants', i, 'mpn'], message: `${v.mpn} is listed twice (also variant ${seen.get(key)})` });
      else seen.set(key, i);
    });
  });
export type CreateVariantsRequest = z.input<typeof createVariantsRequestSchema>;

export const createVariantsResponseSchema = z.object({
  datasheetId: z.number().int(),
  vendorParts: z.array(z.object({ vendorPartId: z.number().int(), mpn: z.string(), created: z.boolean(), cardVersion: z.number().int() })),
});
export type CreateVariantsResponse = z.infer<typeof createVariantsResponseSchema>;
