import { z } from 'zod';
import { fieldWithValue as fw } from '../units/field-labels';
import { actorSchema, pageQueryShape, pageSchema, queryBooleanSchema, sortQuerySchema } from './page.schema';

export const manufacturerNameSchema = z.string().trim().min(1, 'Enter the manufacturer').max(120);
/** Manufacturer part number as printed on the datasheet. */
export const mpnSchema = z
  .string()
  .trim()
  .min(1, 'Enter the manufacturer part number')
  .max(80)
  .regex(/^[^\s,;"]+(?: [^\s,;"]+)*$/, 'no commas, semicolons, quotes or double spaces');
export const packageSchema = z.string().trim().min(1).max(40);

/** The card figures a list shows and sorts by (SI), null when the part has no card. */
export const cardSummarySchema = z.object({
  version: z.number().int(),
  vzNom: z.number(),
  izt: z.number(),
  pdMax: z.number().nullable(),
});
export type CardSummary = z.infer<typeof cardSummarySchema>;

export const vendorPartSchema = z.object({
  id: z.number().int(),
  manufacturer: z.string(),
  mpn: z.string(),
  package: z.string().nullable(),
  lifecycleNote: z.string().nullable(),
  card: cardSummarySchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type VendorPart = z.infer<typeof vendorPartSchema>;

export const vendorPartDatasheetSchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  revision: z.string().nullable(),
  pages: z.number().int(),
  createdAt: z.string(),
});

export const vendorPartDetailSchema = vendorPartSchema.extend({
  createdBy: actorSchema.nullable(),
  datasheets: z.array(vendorPartDatasheetSchema),
  /** House parts this vendor part is a source of. */
  sourceOf: z.array(z.object({ housePartId: z.number().int(), partNumber: z.string(), role: z.enum(['approved', 'alternate']) })),
});
export type VendorPartDetail = z.infer<typeof vendorPartDetailSchema>;

export const createVendorPartRequestSchema = z.strictObject({
  manufacturer: manufacturerNameSchema,
  mpn: mpnSchema,
  package: packageSchema.nullish(),
  lifecycleNote: z.string().trim().max(500).nullish(),
});
export type CreateVendorPartRequest = z.input<typeof createVendorPartRequestSchema>;

export const updateVendorPartRequestSchema = z
  .strictObject({
    manufacturer: manufacturerNameSchema.optional(),
    mpn: mpnSchema.optional(),
    package: packageSchema.nullable().optional(),
    lifecycleNote: z.string().trim().max(500).nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateVendorPartRequest = z.infer<typeof updateVendorPartRequestSchema>;

export const VENDOR_PART_SORTS = ['mpn', 'manufacturer', 'package', 'vzNom', 'izt', 'pdMax', 'updatedAt', 'createdAt'] as const;
export type VendorPartSort = (typeof VENDOR_PART_SORTS)[number];

const optionalNumber = z.coerce.number().finite().optional();

/** Filters narrow in SQL (indexed prefix and range conditions), never in memory. */
export const vendorPartListQuerySchema = z
  .object({
    ...pageQueryShape,
    sort: sortQuerySchema(VENDOR_PART_SORTS, 'mpn'),
    /** The table's global filter: a prefix of the mpn or of the manufacturer's name (case-insensitive). */
    q: z.string().trim().min(1).max(80).optional(),
    /** Manufacturer part number prefix (case-insensitive). */
    mpn: z.string().trim().min(1).max(80).optional(),
    /** Exact manufacturer name; several separated by commas. */
    manufacturer: z.string().trim().min(1).max(1000).optional(),
    package: z.string().trim().min(1).max(40).optional(),
    /** Nominal Zener voltage range (V). */
    vzNomMin: optionalNumber,
    vzNomMax: optionalNumber,
    hasCard: queryBooleanSchema.optional(),
    /** Only vendor parts that are (or are not) a source of this house part. */
    housePartId: z.coerce.number().int().positive().optional(),
  })
  .superRefine((q, ctx) => {
    if (q.vzNomMin !== undefined && q.vzNomMax !== undefined && q.vzNomMin > q.vzNomMax) {
      ctx.addIssue({ code: 'custom', path: ['vzNomMin'], message: `${fw('vzNomMin', q.vzNomMin)} is above ${fw('vzNomMax', q.vzNomMax)}` });
    }
  });
export type VendorPartListQuery = z.infer<typeof vendorPartListQuerySchema>;

export const vendorPartPageSchema = pageSchema(vendorPartSchema);
export type VendorPartPage = z.infer<typeof vendorPartPageSchema>;

export const manufacturerSchema = z.object({ id: z.number().int(), name: z.string(), vendorPartCount: z.number().int() });
export type Manufacturer = z.infer<typeof manufacturerSchema>;
