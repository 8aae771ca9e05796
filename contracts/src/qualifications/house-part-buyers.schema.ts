import { z } from 'zod';
import { actorSchema } from '../parts/page.schema';

/**
 * Buyers linked to a house part: they are mailed when a source of it is cleared, cleared
 * with conditions or revoked. Engineers and admins manage the links; a buyer may add or
 * remove only themself.
 */
export const housePartBuyerSchema = z.object({
  housePartId: z.number().int(),
  user: z.object({ id: z.number().int(), name: z.string(), email: z.string() }),
  addedBy: actorSchema.nullable(),
  createdAt: z.string(),
});
export type HousePartBuyer = z.infer<typeof housePartBuyerSchema>;

export const addHousePartBuyerRequestSchema = z.strictObject({ userId: z.number().int().positive() });
export type AddHousePartBuyerRequest = z.infer<typeof addHousePartBuyerRequestSchema>;
