import { z } from 'zod';
import { actorSchema } from './page.schema';

/**
 * A vendor part linked to a house part as a source. The role is read, never written: it is
 * `approved` when a second engineer's decision on a qualification case made the part the
 * house part's approved source (see qualifications/source-standing.ts), else `alternate`.
 * A link itself only makes the part a candidate.
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
  /** Derived from the decisions on the pair's cases; no route sets it. */
  role: sourceRoleSchema,
  note: z.string().nullable(),
  /** The vendor part's current card version, null when it has no card. */
  cardVersion: z.number().int().nullable(),
  addedBy: actorSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Source = z.infer<typeof sourceSchema>;

/** Said when a request tries to set a source's standing through the sources routes. */
export const SOURCE_ROLE_REFUSAL =
  "a source's role is not set here: a link makes the part a candidate alternate; it becomes the approved source or a cleared alternate only by a second engineer's decision on its qualification case (approve, clear)";

/** `role` may be sent only as what every link is, an alternate; anything else is refused naming the field. */
const linkRoleSchema = z.literal('alternate', { error: SOURCE_ROLE_REFUSAL }).optional();

/** `POST /house-parts/:id/sources`: links a vendor part as a candidate alternate. */
export const addSourceRequestSchema = z.strictObject({
  vendorPartId: z.number().int().positive(),
  role: linkRoleSchema,
  note: z.string().trim().max(500).nullish(),
});
export type AddSourceRequest = z.input<typeof addSourceRequestSchema>;

/** `PATCH /house-parts/:id/sources/:vendorPartId`: the link's note only; a role is refused, whatever its value. */
export const updateSourceRequestSchema = z
  .strictObject({
    role: z.never({ error: SOURCE_ROLE_REFUSAL }).optional(),
    note: z.string().trim().max(500).nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateSourceRequest = z.infer<typeof updateSourceRequestSchema>;
