import type { Role } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { homeOf } from '../../apps/web/src/layout/home.ts';

const as = (...roles: Role[]) => roles.map((role) => ({ role }));

describe('where a person lands after signing in', () => {
  it('lands the warranty clerk on the claim queue', () => {
    expect(homeOf(as('warranty_clerk'))).toBe('claims');
    expect(homeOf(as('warranty_clerk', 'warranty_clerk'))).toBe('claims');
  });

  it('lands the owner and regional managers on the comparison of their locations, whatever else they do', () => {
    expect(homeOf(as('owner'))).toBe('compare');
    expect(homeOf(as('regional_manager'))).toBe('compare');
    expect(homeOf(as('location_lead', 'regional_manager'))).toBe('compare');
  });

  it("lands a lead on their shop's week and a technician on their bay", () => {
    expect(homeOf(as('location_lead'))).toBe('shop-week');
    expect(homeOf(as('technician', 'location_lead'))).toBe('shop-week');
    expect(homeOf(as('warranty_clerk', 'location_lead'))).toBe('shop-week');
    expect(homeOf(as('technician'))).toBe('my-bay');
  });

  it('lands the accountant on the month close, and a person without a role on the overview', () => {
    expect(homeOf(as('accountant'))).toBe('closes');
    expect(homeOf([])).toBe('overview');
  });
});
