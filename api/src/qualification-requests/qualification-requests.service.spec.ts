import { BadRequestException } from '@nestjs/common';
import { checkNeededBy } from './qualification-requests.service';

describe('checkNeededBy', () => {
  const now = new Date('2026-12-01T08:00:00Z');
  const refused = (date: string) => {
    try {
      checkNeededBy(date, now);
      return null;
    } catch (error) {
      return error as BadRequestException;
    }
  };

  it('takes today, later dates and none', () => {
    expect(refused('2026-12-01')).toBeNull();
    expect(refused('2027-06-30')).toBeNull();
    expect(() => checkNeededBy(null, now)).not.toThrow();
  });

  it("allows yesterday (the requester's day may still be the server's yesterday) but not earlier, naming the field", () => {
    expect(refused('2026-11-30')).toBeNull();
    const error = refused('2026-11-29');
    expect(error).toBeInstanceOf(BadRequestException);
    expect(error!.getResponse()).toEqual({
      message: 'neededBy (2026-11-29) is in the past: give the date the design needs the part by, or leave it out',
      errors: [{ path: 'neededBy', message: 'in the past' }],
    });
  });
});
