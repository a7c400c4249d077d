import { describe, expect, it } from 'vitest';
import { addSums, NO_UNITS } from '../../apps/api/src/reliability/figures.ts';

describe('adding cell sums', () => {
  it('adds every field of the sums, each on its own', () => {
    const keys = Object.keys(NO_UNITS) as (keyof typeof NO_UNITS)[];
    // Each field of each row a different power of two: a field left out or mixed with another shows.
    const rows = [0, 1, 2].map((row) => Object.fromEntries(keys.map((key, i) => [key, 2 ** (row * keys.length + i)])) as unknown as typeof NO_UNITS);
    const total = addSums(rows);
    expect(Object.keys(total).sort()).toEqual([...keys].sort());
    const n = keys.length;
    for (const [i, key] of keys.entries()) expect(total[key], key).toBe(2 ** i + 2 ** (n + i) + 2 ** (2 * n + i));
  });

  it('adds nothing up to no units, and leaves the rows as they were', () => {
    expect(addSums([])).toEqual(NO_UNITS);
    const row = { ...NO_UNITS, units: 3, failures: 1 };
    expect(addSums([row, row])).toMatchObject({ units: 6, failures: 2 });
    expect(row).toEqual({ ...NO_UNITS, units: 3, failures: 1 });
  });
});
