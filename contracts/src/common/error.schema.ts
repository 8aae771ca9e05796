// zod/mini: every page parses error bodies, the sign-in page included (see auth.schema.ts).
import { z } from 'zod/mini';

/** The one error body every API route answers with. */
export const errorBodySchema = z.object({
  message: z.string(),
  errors: z.optional(z.array(z.object({ path: z.string(), message: z.string() }))),
  correlationId: z.string(),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
