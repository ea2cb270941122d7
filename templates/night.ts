// The dark spans of a day for both renderers' day curves: from every sunset to the sunrise that
// follows it, inside the day (the model lists every sun rise and set of the day in time order).
import type { DayEntry } from '../engine/index.js';

/** Dark spans [from, to] on a scale where the day runs 0 … `end`; `at` places an ISO instant on it. */
export function darkSpans(day: DayEntry, at: (iso: string) => number, end: number): [number, number][] {
  if (day.sunNote === 'sun-down-all-day') return [[0, end]];
  if (day.sunNote === 'sun-up-all-day') return [];
  const sun = day.sky.filter((e) => e.body === 'sun');
  const spans: [number, number][] = [];
  let darkFrom: number | null = sun[0]?.type === 'rise' ? 0 : null; // a day that starts with a rise starts dark
  for (const e of sun) {
    const x = Math.min(end, Math.max(0, at(e.time)));
    if (e.type === 'set') darkFrom = x;
    else if (darkFrom !== null) {
      spans.push([darkFrom, x]);
      darkFrom = null;
    }
  }
  if (darkFrom !== null) spans.push([darkFrom, end]);
  return spans;
}

export interface SunTime {
  type: 'rise' | 'set';
  time: string | null; // ISO UTC; null: the day has no such event
  clock: string | null;
}

/** The sun's rises and sets of a day in time order; a kind the day lacks is listed as null (rise first, set last). */
export function sunTimes(day: DayEntry): SunTime[] {
  const sun: SunTime[] = day.sky.filter((e) => e.body === 'sun').map((e) => ({ type: e.type, time: e.time, clock: e.clock }));
  if (!sun.some((e) => e.type === 'rise')) sun.unshift({ type: 'rise', time: null, clock: null });
  if (!sun.some((e) => e.type === 'set')) sun.push({ type: 'set', time: null, clock: null });
  return sun;
}
