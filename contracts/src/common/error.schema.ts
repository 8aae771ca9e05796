// zod/mini: every page parses error bodies, the sign-in page included (see auth.schema.ts).
import { z } from 'zod/mini';

/** The one error body every API route answers with. */
export const errorBodySchema = z.object({
  message: z.string(),
  errors: z.optional(z.array(z.object({ path: z.string(), message: z.string() }))),
  correlationId: z.string(),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;

/** The `code` of every stale-write conflict (409). */
export const STALE_CONFLICT_CODE = 'stale';

/**
 * The one 409 body of a stale write: a save based on a version that is no longer current
 * (a rating card, a house-part spec, a case, the variants of a datasheet, a CSV import
 * previewed before someone added a card). The usual error body plus `code: 'stale'` and,
 * where the server can say it, `current`: what is stored now, at least its `version`
 * (a rating card conflict sends the whole card view as it is now; the others send
 * `{version}` and, for a vendor part's card, `vendorPartId`). `errors` names the field or
 * row that went stale. Nothing was saved.
 */
export const staleConflictBodySchema = z.object({
  message: z.string(),
  code: z.literal(STALE_CONFLICT_CODE),
  errors: z.optional(z.array(z.object({ path: z.string(), message: z.string() }))),
  current: z.optional(z.looseObject({ version: z.number() })),
  correlationId: z.string(),
});
export type StaleConflictBody = z.infer<typeof staleConflictBodySchema>;

/** True when an error body is a stale-write conflict (parse it with staleConflictBodySchema for the details). */
export function isStaleConflict(body: unknown): body is StaleConflictBody {
  return staleConflictBodySchema.safeParse(body).success;
}
