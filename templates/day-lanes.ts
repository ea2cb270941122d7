// A day's high and low waters as the month pages of the site and the book both print them: high waters
// on the day's upper line, low waters on its lower line, each in time order, so a column never changes
// meaning from one day to the next.
export interface Lanes<E> { high: E[]; low: E[] }

export function dayLanes<E extends { type: 'high' | 'low'; time: string }>(events: readonly E[]): Lanes<E> {
  const inOrder = [...events].sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
  return { high: inOrder.filter((e) => e.type === 'high'), low: inOrder.filter((e) => e.type === 'low') };
}
