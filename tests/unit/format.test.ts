import { describe, expect, it } from 'vitest';
import { formatDate, formatDegrees } from '../../src/lib/format';

describe('how the pages write dates and angles (src/lib/format.ts)', () => {
  it('writes a calendar date alone as the same day, in the same form as a timestamp (the wheel log)', () => {
    // en-GB short month names from Node's ICU; the day must not slip to 31 Aug west of Greenwich.
    expect(formatDate('2026-09-01')).toBe(new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(Date.UTC(2026, 8, 1)));
    expect(formatDate('2026-09-01')).toMatch(/^1 Sept? 2026$/);
    expect(formatDate('2026-12-03T10:00:00.000Z')).toMatch(/^3 Dec 2026$/);
  });

  it('writes an angle with one precision, so the tool and the result agree (30.81° both)', () => {
    // Inclusive angle of 15.405° per side: 2 × 15.405 = 30.81.
    expect(formatDegrees(2 * 15.405)).toBe('30.81°');
    expect(formatDegrees(15)).toBe('15°');
  });
});
