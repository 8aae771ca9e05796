import { z } from 'zod';
import { housePartStatusSchema } from '../parts/house-part.schema';
import { actorSchema, pageQueryShape, pageSchema, queryBooleanSchema } from '../parts/page.schema';
import { sourceRoleSchema } from '../parts/source.schema';
import { qualificationStateSchema, qualificationVerdictSchema, QUALIFICATION_STATES } from './qualification-state.schema';
import { vendorPartRefSchema } from './qualification.schema';

/** A source's place on the Board: the state of its latest case, or `none` before any case. */
export const BOARD_STATES = [...QUALIFICATION_STATES, 'none'] as const;
export const boardStateSchema = z.enum(BOARD_STATES);
export type BoardState = z.infer<typeof boardStateSchema>;

export const boardQuerySchema = z.object({
  ...pageQueryShape,
  /** Part-number prefix or words of the description. */
  q: z.string().trim().max(100).optional(),
  /** Comma list of board states, e.g. `in-review,none`. */
  state: z
    .string()
    .trim()
    .max(200)
    .transform((text, ctx) => {
      const parsed = z.array(boardStateSchema).safeParse(
        text
          .split(',')
          .map((s) => s.trim())
          .filter(Boolean),
      );
      if (!parsed.success) {
        ctx.addIssue({ code: 'custom', message: `unknown state in "${text}"; states: ${BOARD_STATES.join(', ')}` });
        return z.NEVER;
      }
      return [...new Set(parsed.data)];
    })
    .optional(),
  /** Sources whose latest case this engineer prepared or decided. */
  engineerId: z.coerce.number().int().positive().optional(),
  /** Sources whose latest case has not changed for at least this many days. */
  minAgeDays: z.coerce.number().min(0).max(36500).optional(),
  needsRecheck: queryBooleanSchema.optional(),
});
export type BoardQuery = z.infer<typeof boardQuerySchema>;

export const boardCaseSchema = z.object({
  id: z.number().int(),
  revision: z.number().int(),
  state: qualificationStateSchema,
  overall: qualificationVerdictSchema,
  preparedBy: actorSchema,
  decidedBy: actorSchema.nullable(),
  needsRecheck: z.boolean(),
  updatedAt: z.string(),
  /** Whole days since the case last changed. */
  ageDays: z.number().int(),
});
export type BoardCase = z.infer<typeof boardCaseSchema>;

export const boardSourceSchema = z.object({
  vendorPart: vendorPartRefSchema,
  role: sourceRoleSchema,
  cardVersion: z.number().int().nullable(),
  state: boardStateSchema,
  latestCase: boardCaseSchema.nullable(),
});
export type BoardSource = z.infer<typeof boardSourceSchema>;

/** One house part on the Board. With a filter, only its matching sources are listed. */
export const boardRowSchema = z.object({
  housePart: z.object({
    id: z.number().int(),
    partNumber: z.string(),
    description: z.string(),
    status: housePartStatusSchema,
    specVersion: z.number().int().nullable(),
  }),
  sources: z.array(boardSourceSchema),
});
export type BoardRow = z.infer<typeof boardRowSchema>;

/**
 * `GET /api/qualification-views/board`: a page of house parts; `counts` tallies the sources that
 * match every filter but the state filter, by state (so a state left out still shows its
 * count); `engineers` are everyone the engineer filter can name (every engineer, and whoever
 * prepared or decided a case), not only those on this page.
 */
export const boardPageSchema = pageSchema(boardRowSchema).extend({
  counts: z.record(boardStateSchema, z.number().int()),
  engineers: z.array(z.object({ id: z.number().int(), name: z.string() })),
});
export type BoardPage = z.infer<typeof boardPageSchema>;
