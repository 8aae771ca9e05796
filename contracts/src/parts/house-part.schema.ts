import { z } from 'zod';
import { actorSchema, pageQueryShape, pageSchema, sortQuerySchema } from './page.schema';

/** A house part's life in the parts list: being specified, in use, kept for existing designs only, retired. */
export const HOUSE_PART_STATUSES = ['draft', 'active', 'not-for-new-designs', 'end-of-life'] as const;
export const housePartStatusSchema = z.enum(HOUSE_PART_STATUSES);
export type HousePartStatus = z.infer<typeof housePartStatusSchema>;

/**
 * The house parts designers are offered (Find parts' picker, the house part of a request): a
 * draft is still being specified by engineers, so it is neither chosen nor asked for.
 */
export const DESIGNER_HOUSE_PART_STATUSES = ['active', 'not-for-new-designs', 'end-of-life'] as const satisfies readonly HousePartStatus[];

export function isOfferedToDesigners(status: HousePartStatus): boolean {
  return (DESIGNER_HOUSE_PART_STATUSES as readonly string[]).includes(status);
}

/** Internal part numbers: letters, digits and - . / _ (no spaces), as the parts list writes them. */
export const partNumberSchema = z
  .string()
  .trim()
  .min(1, 'Enter a part number')
  .max(64)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._/-]*$/, 'letters, digits and - . / _ only, starting with a letter or digit');

export const housePartSchema = z.object({
  id: z.number().int(),
  partNumber: z.string(),
  description: z.string(),
  status: housePartStatusSchema,
  /** The current spec version; null until a spec is written. */
  specVersion: z.number().int().nullable(),
  sourceCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  createdBy: actorSchema.nullable(),
});
export type HousePart = z.infer<typeof housePartSchema>;

export const createHousePartRequestSchema = z.strictObject({
  partNumber: partNumberSchema,
  description: z.string().trim().max(500).default(''),
  status: housePartStatusSchema.default('draft'),
});
export type CreateHousePartRequest = z.input<typeof createHousePartRequestSchema>;

export const updateHousePartRequestSchema = z
  .strictObject({
    partNumber: partNumberSchema.optional(),
    description: z.string().trim().max(500).optional(),
    status: housePartStatusSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateHousePartRequest = z.infer<typeof updateHousePartRequestSchema>;

export const HOUSE_PART_SORTS = ['partNumber', 'status', 'updatedAt', 'createdAt'] as const;
export type HousePartSort = (typeof HOUSE_PART_SORTS)[number];

export const housePartListQuerySchema = z.object({
  ...pageQueryShape,
  sort: sortQuerySchema(HOUSE_PART_SORTS, 'partNumber'),
  /** Part number prefix or words of the description. */
  q: z.string().trim().max(100).optional(),
  status: housePartStatusSchema.optional(),
});
export type HousePartListQuery = z.infer<typeof housePartListQuerySchema>;

export const housePartPageSchema = pageSchema(housePartSchema);
export type HousePartPage = z.infer<typeof housePartPageSchema>;
