/** A shop a run did not mark, and why, in the words the server gave. */
export interface Unmarked {
  locationId: number;
  reason: string;
}

/**
 * Marks shops one after another with `mark`, telling `onMarked` how many have gone after each,
 * until all have gone or `stopped` says to stop (the shop being marked finishes; those after it are
 * left as they are). A shop that fails is set down with its reason, and the run goes on.
 */
export async function markInTurn(
  locationIds: readonly number[],
  mark: (locationId: number) => Promise<void>,
  onMarked: (gone: number) => void,
  stopped: () => boolean,
  reasonOf: (failure: unknown) => string,
): Promise<{ marked: number; unmarked: Unmarked[] }> {
  const unmarked: Unmarked[] = [];
  let gone = 0;
  for (const locationId of locationIds) {
    if (stopped()) break;
    try {
      await mark(locationId);
    } catch (failure) {
      unmarked.push({ locationId, reason: reasonOf(failure) });
    }
    onMarked(++gone);
  }
  return { marked: gone - unmarked.length, unmarked };
}
