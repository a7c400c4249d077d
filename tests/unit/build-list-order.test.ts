import { describe, expect, it } from 'vitest';
import { readBuildFilters } from '../../apps/web/src/views/builds/buildFilters.ts';

describe('the order of the build list as the address bar holds it', () => {
  it('reads a list narrowed to days of delivery by delivery day, latest first, unless another order is asked', () => {
    expect(readBuildFilters({ status: 'delivered', deliveredFrom: '2026-05-01', deliveredTo: '2026-05-31' })).toMatchObject({ sort: 'deliveredOn', order: 'desc' });
    expect(readBuildFilters({ deliveredTo: '2026-05-31' }).sort).toBe('deliveredOn');
    expect(readBuildFilters({ deliveredFrom: '2026-05-01', sort: 'number', order: 'asc' })).toMatchObject({ sort: 'number', order: 'asc' });
  });

  it('falls back to the last change once the days of delivery are taken away, or are not days', () => {
    expect(readBuildFilters({ sort: 'deliveredOn' }).sort).toBe('updatedAt');
    expect(readBuildFilters({ sort: 'deliveredOn', deliveredFrom: 'May' }).sort).toBe('updatedAt');
    expect(readBuildFilters({}).sort).toBe('updatedAt');
  });
});
