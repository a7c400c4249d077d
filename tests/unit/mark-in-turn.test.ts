import { describe, expect, it } from 'vitest';
import { markInTurn } from '../../apps/web/src/views/money/markInTurn.ts';

const reasonOf = (failure: unknown) => (failure instanceof Error ? failure.message : String(failure));

describe('marking shops final one after another', () => {
  it('marks each shop in order, one at a time, and counts them as they go', async () => {
    const started: number[] = [];
    let running = 0;
    let most = 0;
    const counts: number[] = [];
    const result = await markInTurn(
      [4, 2, 9],
      async (id) => {
        started.push(id);
        most = Math.max(most, ++running);
        await new Promise((resolve) => setTimeout(resolve, 5));
        running--;
      },
      (gone) => counts.push(gone),
      () => false,
      reasonOf,
    );
    expect(started).toEqual([4, 2, 9]);
    expect(most).toBe(1);
    expect(counts).toEqual([1, 2, 3]);
    expect(result).toEqual({ marked: 3, unmarked: [] });
  });

  it('sets down a shop that fails with its reason and goes on with the rest', async () => {
    const result = await markInTurn(
      [1, 2, 3],
      async (id) => {
        if (id === 2) throw new Error('May 2026 is already final at Boise');
      },
      () => undefined,
      () => false,
      reasonOf,
    );
    expect(result).toEqual({ marked: 2, unmarked: [{ locationId: 2, reason: 'May 2026 is already final at Boise' }] });
  });

  it('stops before the next shop once asked, leaving the rest unmarked and uncounted', async () => {
    const marked: number[] = [];
    let stop = false;
    const result = await markInTurn(
      [1, 2, 3, 4],
      async (id) => {
        marked.push(id);
        if (id === 2) stop = true;
      },
      () => undefined,
      () => stop,
      reasonOf,
    );
    expect(marked).toEqual([1, 2]);
    expect(result).toEqual({ marked: 2, unmarked: [] });
  });
});
