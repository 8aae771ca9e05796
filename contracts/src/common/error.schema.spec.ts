import { describe, expect, it } from 'vitest';
import { ratingCardConflictSchema } from '../parts/rating-card.schema';
import { errorBodySchema, isStaleConflict, staleConflictBodySchema } from './error.schema';

// The shape is this project's own API contract (no outside source: common practice for a 409 body).
describe('the stale-conflict body', () => {
  const stale = { message: 'Case #4 changed after you loaded it', code: 'stale', current: { version: 3 }, correlationId: 'c-1' };

  it('is an error body with code "stale" and, optionally, what is stored now', () => {
    expect(isStaleConflict(stale)).toBe(true);
    expect(errorBodySchema.safeParse(stale).success).toBe(true);
    expect(staleConflictBodySchema.parse({ ...stale, current: { version: 2, vendorPartId: 7 } }).current).toEqual({ version: 2, vendorPartId: 7 });
    expect(isStaleConflict({ message: 'x', code: 'stale', correlationId: 'c' })).toBe(true);
  });

  it('is not any other 409', () => {
    expect(isStaleConflict({ message: 'Already exists', correlationId: 'c' })).toBe(false);
    expect(isStaleConflict({ ...stale, code: 'duplicate' })).toBe(false);
    expect(isStaleConflict({ ...stale, current: { rev: 3 } })).toBe(false);
  });

  it('a rating-card conflict is one, with the card as current', () => {
    const card = { vendorPartId: 1, version: 2, fields: {}, note: null, updatedAt: null, updatedBy: null, issues: [] };
    const body = { message: 'm', code: 'stale', correlationId: 'c', current: card };
    expect(ratingCardConflictSchema.safeParse(body).success).toBe(true);
    expect(isStaleConflict(body)).toBe(true);
    expect(ratingCardConflictSchema.safeParse({ ...body, code: undefined }).success).toBe(false);
  });
});
