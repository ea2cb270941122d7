// Indexed reads whose index the code itself guarantees (a neighbour in a sorted table, a slot of a
// fixed-size tuple). With noUncheckedIndexedAccess such a read is `T | undefined`; this names the
// broken guarantee instead of letting `undefined` travel on into a sum or a drawing call.

/** An index the program's own invariant says is inside its array turned out not to be: a bug, never a user's mistake. */
export class IndexOutOfRangeError extends Error {
  override name = 'IndexOutOfRangeError';
  constructor(
    readonly what: string,
    readonly index: number,
    readonly length: number,
  ) {
    super(`internal error: ${what}[${index}] read from a list of ${length}`);
  }
}

/** The item at `index` of a list that holds no `undefined`, or an IndexOutOfRangeError naming `what` when there is none. */
export function itemAt<T>(items: ArrayLike<T>, index: number, what: string): T {
  const item = items[index];
  if (item === undefined) throw new IndexOutOfRangeError(what, index, items.length);
  return item;
}

/** The first item, or an IndexOutOfRangeError naming `what` when the list is empty. */
export function firstOf<T>(items: ArrayLike<T>, what: string): T {
  return itemAt(items, 0, what);
}

/** The last item, or an IndexOutOfRangeError naming `what` when the list is empty. */
export function lastOf<T>(items: ArrayLike<T>, what: string): T {
  return itemAt(items, items.length - 1, what);
}

/** A key the program's own invariant says is in a table turned out not to be: a bug, never a user's mistake. */
export class MissingEntryError extends Error {
  override name = 'MissingEntryError';
  constructor(
    readonly what: string,
    readonly key: PropertyKey,
  ) {
    super(`internal error: ${what} has no entry ${JSON.stringify(String(key))}`);
  }
}

/** The value under `key` of a table that holds no `undefined`, or a MissingEntryError naming `what` when there is none. */
export function entryOf<K extends PropertyKey, T>(table: Readonly<Partial<Record<K, T>>>, key: K, what: string): T {
  const value = table[key];
  if (value === undefined) throw new MissingEntryError(what, key);
  return value as T;
}

/**
 * itemAt for the engine's Float64Array hot loops: one function for one kind of array, so the optimising
 * compiler sees a single element kind here (itemAt is called with every kind of list and would not).
 */
export function numberAt(values: Float64Array, index: number, what: string): number {
  const value = values[index];
  if (value === undefined) throw new IndexOutOfRangeError(what, index, values.length);
  return value;
}
