import { z } from 'zod';
import { actorSchema } from './page.schema';

/**
 * A vendor part linked to a house part as a source. `approved` is a source already on the
 * approved-source list (the reference the spec was written from); `alternate` is a
 * candidate second source. Whether an alternate is cleared is the qualification's to say.
 */
export const SOURCE_ROLES = ['approved', 'alternate'] as const;
export const sourceRoleSchema = z.enum(SOURCE_ROLES);
export type SourceRole = z.infer<typeof sourceRoleSchema>;

export const sourceSchema = z.object({
  housePartId: z.number().int(),
  vendorPartId: z.number().int(),
  manufacturer: z.string(),
  mpn: z.string(),
  package: z.string().nullable(),
  lifecycleNote: z.string().nullable(),
  role: sourceRoleSchema,
  note: z.string().nullable(),
  /** The vendor part's current card version, null when it has no card. */
  cardVersion: z.number().int().nullable(),
  addedBy: actorSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Source = z.infer<typeof sourceSchema>;

export const addSourceRequestSchema = z.strictObject({
  vendorPartId: z.number().int().positive(),
  role: sourceRoleSchema.default('alternate'),
  note: z.string().trim().max(500).nullish(),
});
export type AddSourceRequest = z.input<typeof addSourceRequestSchema>;

export const updateSourceRequestSchema = z
  .strictObject({
    role: sourceRoleSchema.optional(),
    note: z.string().trim().max(500).nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateSourceRequest = z.infer<typeof updateSourceRequestSchema>;
