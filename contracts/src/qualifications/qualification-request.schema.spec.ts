import { describe, expect, it } from 'vitest';
import {
  createQualificationRequestRequestSchema,
  declineQualificationRequestSchema,
  qualificationRequestListQuerySchema,
} from './qualification-request.schema';

describe('qualification request contracts', () => {
  it('needs the vendor part and a note on the application; the house part and date are optional', () => {
    const ok = createQualificationRequestRequestSchema.parse({ vendorPartId: 4, note: '  Bias clamp for the new sensor board, needed for the pilot run  ' });
    expect(ok).toEqual({ vendorPartId: 4, note: 'Bias clamp for the new sensor board, needed for the pilot run' });
    const bad = createQualificationRequestRequestSchema.safeParse({ vendorPartId: 'four', note: '   ' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path.join('.'))).toEqual(['vendorPartId', 'note']);
    expect(bad.error?.issues[1].message).toBe('Say what it is for: the design, why this part, by when');
    // strict: a misspelt field is named rather than dropped
    const extra = createQualificationRequestRequestSchema.safeParse({ vendorPartId: 4, note: 'x', housePart: 3 });
    expect(extra.error?.issues[0].code).toBe('unrecognized_keys');
  });

  it('reads the date as a calendar date (Gregorian calendar, common practice, no source)', () => {
    const date = (neededBy: string) => createQualificationRequestRequestSchema.safeParse({ vendorPartId: 1, note: 'x', neededBy });
    expect(date('2027-02-28').success).toBe(true);
    // 2028 is a leap year, 2027 is not
    expect(date('2028-02-29').success).toBe(true);
    expect(date('2027-02-29').error?.issues[0]).toMatchObject({ path: ['neededBy'], message: 'not a calendar date' });
    expect(date('2027-04-31').success).toBe(false);
    expect(date('31.03.2027').error?.issues[0].message).toBe('a date as YYYY-MM-DD');
  });

  it('lists open requests unless asked for all, and needs a written reply to decline', () => {
    expect(qualificationRequestListQuerySchema.parse({})).toMatchObject({ status: 'open', pageIndex: 0, pageSize: 50 });
    expect(qualificationRequestListQuerySchema.parse({ status: 'all', mine: 'true' })).toMatchObject({ status: 'all', mine: true });
    expect(qualificationRequestListQuerySchema.safeParse({ status: 'closed' }).error?.issues[0].path).toEqual(['status']);
    expect(declineQualificationRequestSchema.safeParse({ reply: ' ' }).error?.issues[0].path).toEqual(['reply']);
  });
});
