// The model's access windows: for each window of the station file, its open intervals over the year
// and, per local day, the pieces printed on that day (an interval across midnight shows on both days).
import { clock, isoLocal, isoUtc, roundToMinute, type LocalDay } from '../localtime.js';
import type { EngineContext } from '../context.js';
import type { StationLookup } from '../tides.js';
import type {
  ModelWarning, Station, TideEvent, WindowDay, WindowInterval, WindowPiece, WindowSpec, WindowYear,
} from '../types.js';
import { openIntervalsOf, windowMethod, type OpenInterval } from '../windows.js';
import { mm } from './format.js';
import { firstOf, itemAt, lastOf } from '../item.js';

/** The side and level of a station file's window (the schema guarantees exactly one of the two). */
export function sideAndLevel(spec: WindowSpec): { side: 'above' | 'below'; level: number } {
  return spec.above !== undefined ? { side: 'above', level: spec.above } : { side: 'below', level: spec.below! };
}

/**
 * Every window of the station over the year's local days. `events` are the station's high and low
 * waters reaching at least two days beyond the year (the almanac's padded list).
 */
export function yearWindows(
  station: Station, set: StationLookup, days: readonly LocalDay[], events: readonly TideEvent[],
  yearEvents: readonly TideEvent[], ctx?: EngineContext,
): WindowYear[] {
  const zone = station.timezone;
  const from = firstOf(days, 'days').start;
  const to = lastOf(days, 'days').end;
  const specs = station.windows ?? [];
  const all = openIntervalsOf(station, set, specs.map(sideAndLevel), from, to, events, ctx);
  return specs.map((spec, k): WindowYear => {
    const { side, level } = sideAndLevel(spec);
    const exact = itemAt(all, k, 'all');
    const byDay = splitByDay(exact, days, zone);
    return {
      id: spec.id,
      name: spec.name,
      side,
      level,
      method: windowMethod(station),
      intervals: exact.map((w): WindowInterval => ({
        start: isoUtc(w.start), end: isoUtc(w.end), startLocal: isoLocal(w.start, zone), endLocal: isoLocal(w.end, zone),
      })),
      days: byDay,
      openDays: byDay.filter((d) => d.state !== 'closed').length,
      outOfRange: outOfRange(side, level, yearEvents),
    };
  });
}

function outOfRange(side: 'above' | 'below', level: number, events: readonly TideEvent[]): WindowYear['outOfRange'] {
  let lowest = Infinity;
  let highest = -Infinity;
  for (const e of events) {
    lowest = Math.min(lowest, e.height);
    highest = Math.max(highest, e.height);
  }
  const never = side === 'above' ? level > highest : level < lowest;
  const always = side === 'above' ? level <= lowest : level >= highest;
  if (!never && !always) return null;
  return { code: never ? 'window-never-opens' : 'window-never-closes', lowest: mm(lowest), highest: mm(highest) };
}

/**
 * Pieces per local day. Crossings are printed to the minute, so the cut uses their nearest minute: a
 * window that opens at 23:59:40 opens at 00:00 of the next day and gives no piece on the first.
 */
export function splitByDay(intervals: readonly OpenInterval[], days: readonly LocalDay[], zone: string): WindowDay[] {
  const rounded = intervals
    .map((w) => ({ start: roundToMinute(w.start), end: roundToMinute(w.end) }))
    .filter((w) => w.end > w.start);
  let j = 0;
  return days.map((day): WindowDay => {
    while (j < rounded.length && itemAt(rounded, j, 'rounded').end <= day.start) j++;
    const pieces: WindowPiece[] = [];
    for (let k = j; k < rounded.length && itemAt(rounded, k, 'rounded').start < day.end; k++) {
      const w = itemAt(rounded, k, 'rounded');
      const start = Math.max(w.start, day.start);
      const end = Math.min(w.end, day.end);
      if (end <= start) continue;
      const fromPreviousDay = w.start <= day.start;
      const intoNextDay = w.end >= day.end;
      pieces.push({
        start: isoUtc(start), end: isoUtc(end), startLocal: isoLocal(start, zone), endLocal: isoLocal(end, zone),
        startClock: fromPreviousDay ? '00:00' : clock(start, zone),
        endClock: intoNextDay ? '24:00' : clock(end, zone),
        fromPreviousDay, intoNextDay,
      });
    }
    const allDay = pieces.length === 1 && firstOf(pieces, 'pieces').fromPreviousDay && firstOf(pieces, 'pieces').intoNextDay;
    return { date: day.date, state: pieces.length === 0 ? 'closed' : allDay ? 'open' : 'some', pieces };
  });
}

/** One line of plain words for a window whose level lies outside the year's range. */
/** A window whose level the year's water never crosses, as a warning code with its numbers (the level may be wrong). */
export function outOfRangeWarning(w: WindowYear, year: number): ModelWarning | null {
  if (!w.outOfRange) return null;
  const { code, lowest, highest } = w.outOfRange;
  return { code, window: w.name, side: w.side, level: w.level, lowest, highest, year };
}
