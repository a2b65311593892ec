import { describe, expect, it } from 'vitest';
import { checkIsoDate } from '@/lib/validation/date';

// Source: ISO 8601 calendar dates (extended format YYYY-MM-DD) on the Gregorian calendar:
// a leap year is divisible by 4, except century years, which must be divisible by 400.

describe('checkIsoDate', () => {
  it('accepts real dates, trimming spaces', () => {
    expect(checkIsoDate('2026-12-25')).toEqual({ ok: true, date: '2026-12-25' });
    expect(checkIsoDate(' 2027-01-31 ')).toEqual({ ok: true, date: '2027-01-31' });
  });

  it('refuses days that do not exist', () => {
    // February has 28 days in 2026 (not divisible by 4); April has 30 days.
    for (const date of ['2026-02-29', '2026-02-30', '2026-04-31', '2026-01-32', '2026-01-00']) {
      expect(checkIsoDate(date), date).toMatchObject({ ok: false, message: expect.stringMatching(/does not exist/) });
    }
  });

  it('applies the Gregorian leap-year rule', () => {
    expect(checkIsoDate('2028-02-29').ok).toBe(true); // 2028 ÷ 4 = 507
    expect(checkIsoDate('2000-02-29').ok).toBe(true); // 2000 ÷ 400 = 5
    expect(checkIsoDate('2100-02-29').ok).toBe(false); // 2100 is a century year, 2100 ÷ 400 = 5.25
  });

  it('refuses months outside 01–12', () => {
    expect(checkIsoDate('2026-13-01').ok).toBe(false);
    expect(checkIsoDate('2026-00-10').ok).toBe(false);
  });

  it('refuses other date shapes', () => {
    for (const date of ['2026-1-5', '05/01/2026', '2026/01/05', '20260105', '2026-01-05T00:00', '']) {
      expect(checkIsoDate(date), date).toMatchObject({ ok: false, message: expect.stringMatching(/year, month and day/) });
    }
  });
});
