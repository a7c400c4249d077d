import { dayOfIso, isoDay, localDay, localMoment, weekday } from '@busbar/calc';
import { describe, expect, it } from 'vitest';

const at5pm = (zone: string, date: string) => new Date(localMoment(zone, dayOfIso(date), 17 * 60)).toISOString();

// Source: US Uniform Time Act as amended by the Energy Policy Act of 2005 (15 U.S.C. § 260a):
// daylight time runs from 2 a.m. on the second Sunday of March to 2 a.m. on the first Sunday of
// November; Arizona keeps standard time all year. Standard offsets: Eastern −5, Central −6,
// Mountain −7 hours (49 CFR part 71).
describe('local time of a location', () => {
  it('keeps Mountain standard time before the second Sunday of March 2025 and daylight time after', () => {
    expect(isoDay(dayOfIso('2025-03-09'))).toBe('2025-03-09');
    expect(weekday(dayOfIso('2025-03-09'))).toBe(0); // a Sunday, the second of March 2025
    expect(at5pm('America/Denver', '2025-03-08')).toBe('2025-03-09T00:00:00.000Z'); // MST, UTC−7
    expect(at5pm('America/Denver', '2025-03-10')).toBe('2025-03-10T23:00:00.000Z'); // MDT, UTC−6
  });

  it('keeps Arizona on standard time in summer', () => {
    expect(at5pm('America/Phoenix', '2025-07-04')).toBe('2025-07-05T00:00:00.000Z');
  });

  it('returns to Eastern standard time after the first Sunday of November 2025', () => {
    expect(weekday(dayOfIso('2025-11-02'))).toBe(0);
    expect(at5pm('America/New_York', '2025-11-01')).toBe('2025-11-01T21:00:00.000Z'); // EDT, UTC−4
    expect(at5pm('America/New_York', '2025-11-03')).toBe('2025-11-03T22:00:00.000Z'); // EST, UTC−5
  });

  it('cuts the day at local midnight, not at UTC midnight', () => {
    // 03:30 UTC on 15 June is still the evening of 14 June in Chicago (CDT, UTC−5).
    expect(isoDay(localDay('America/Chicago', Date.parse('2025-06-15T03:30:00Z')))).toBe('2025-06-14');
    expect(isoDay(localDay('America/Chicago', Date.parse('2025-06-15T05:30:00Z')))).toBe('2025-06-15');
  });
});
