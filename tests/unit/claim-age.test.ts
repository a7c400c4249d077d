import { describe, expect, it } from 'vitest';
import { claimAge } from '../../apps/web/src/views/claims/columns.ts';

const at = (iso: string) => Date.parse(iso);

describe("a claim's age in the queue, in days at its location", () => {
  it('counts a day once midnight passes at the location, not 24 hours after logging', () => {
    // Logged 9:30 PM on June 1 in Denver (03:30 UTC on June 2); 7:00 AM on June 2 there is the next day.
    expect(claimAge('2026-06-02T03:30:00.000Z', 'America/Denver', at('2026-06-02T13:00:00.000Z'))).toBe('1 day');
    expect(claimAge('2026-06-02T03:30:00.000Z', 'America/Denver', at('2026-06-02T05:59:00.000Z'))).toBe('0 days');
  });

  it('keeps the day a claim was logged at its location though UTC has moved on', () => {
    // 5:00 PM and 11:00 PM on June 1 in Phoenix are 00:00 and 06:00 UTC on June 2: still the same day there.
    expect(claimAge('2026-06-02T00:00:00.000Z', 'America/Phoenix', at('2026-06-02T06:00:00.000Z'))).toBe('0 days');
    expect(claimAge('2026-06-01T15:00:00.000Z', 'America/Phoenix', at('2026-06-02T06:00:00.000Z'))).toBe('0 days');
  });

  it('counts whole days across a change of clocks, and never below zero', () => {
    // Denver moves its clocks forward on March 8, 2026: March 7 to March 9 is still two days.
    expect(claimAge('2026-03-07T19:00:00.000Z', 'America/Denver', at('2026-03-09T19:00:00.000Z'))).toBe('2 days');
    expect(claimAge('2026-06-10T16:00:00.000Z', 'America/Denver', at('2026-06-09T16:00:00.000Z'))).toBe('0 days');
  });
});
