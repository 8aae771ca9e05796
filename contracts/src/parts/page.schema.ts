import { z } from 'zod';

/**
 * Server-side paging and sorting as the web's tables ask for them (mantine-react-table in
 * manual mode): a 0-based page index, a page size, and `sort` as a comma list of fields,
 * each optionally prefixed with `-` for descending ("manufacturer,-vzNom").
 */
export const PAGE_SIZE_MAX = 200;

export const pageQueryShape = {
  pageIndex: z.coerce.number().int().min(0).max(1_000_000).default(0),
  pageSize: z.coerce.number().int().min(1).max(PAGE_SIZE_MAX).default(50),
};

export interface SortTerm<F extends string> {
  field: F;
  desc: boolean;
}

/** `sort` for the given sortable fields; an unknown field is an error naming the allowed ones. */
export function sortQuerySchema<const F extends string>(fields: readonly [F, ...F[]], fallback: string) {
  return z
    .string()
    .trim()
    .max(200)
    .default(fallback)
    .transform((text, ctx): SortTerm<F>[] => {
      const terms: SortTerm<F>[] = [];
      for (const raw of text
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean)) {
        const desc = raw.startsWith('-');
        const field = (desc ? raw.slice(1) : raw) as F;
        if (!fields.includes(field)) {
          ctx.addIssue({ code: 'custom', message: `cannot sort by "${field}"; sortable: ${fields.join(', ')}` });
          return z.NEVER;
        }
        if (!terms.some((t) => t.field === field)) terms.push({ field, desc });
      }
      return terms;
    });
}

/** Query-string booleans: true/false/1/0. */
export const queryBooleanSchema = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/** One page of a list, with the total number of matching rows (for the pager). */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({
    items: z.array(item),
    total: z.number().int(),
    pageIndex: z.number().int(),
    pageSize: z.number().int(),
  });
}
export interface Page<T> {
  items: T[];
  total: number;
  pageIndex: number;
  pageSize: number;
}

/** Who did something, as lists and cards show it. */
export const actorSchema = z.object({ id: z.number().int(), name: z.string() });
export type Actor = z.infer<typeof actorSchema>;
