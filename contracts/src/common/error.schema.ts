import { z } from 'zod';

/** The one error body every API route answers with. */
export const errorBodySchema = z.object({
  message: z.string(),
  errors: z
    .array(z.object({ path: z.string(), message: z.string() }))
    .optional(),
  correlationId: z.string(),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
