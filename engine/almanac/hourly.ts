// Heights on every local hour of every day: 24 a day, 23 on the day the clocks go forward (that hour
// does not exist) and 25 when they go back (the repeated hour comes twice, with its two offsets).
import { clock, offsetString, type LocalDay } from '../localtime.js';
import type { EngineContext } from '../context.js';
import { predictorFor, type StationLookup } from '../tides.js';
import type { HourlyDay, HourlyYear, Station, TideEvent } from '../types.js';
import { windowMethod } from '../windows.js';
import { mm } from './format.js';
import { itemAt } from '../item.js';

const QUARTER_HOUR = 900_000; // every UTC offset in use is a whole number of quarter hours

/** The instants in [day.start, day.end) whose local clock reads a whole hour. */
export function localHours(day: Pick<LocalDay, 'start' | 'end'>, zone: string): number[] {
  const out: number[] = [];
  for (let t = day.start; t < day.end; t += QUARTER_HOUR) if (clock(t, zone).endsWith(':00')) out.push(t);
  return out;
}

/** Height of the half-cosine secondary curve at each instant (ascending), from the port's own events. */
function secondaryCurveAt(events: readonly TideEvent[], times: readonly number[]): number[] {
  const out: number[] = [];
  let j = 0;
  for (const t of times) {
    while (j < events.length - 2 && t >= itemAt(events, j + 1, 'events').time) j++;
    const a = itemAt(events, j, 'events');
    const b = itemAt(events, j + 1, 'events');
    if (!b || t < a.time || t > b.time) {
      out.push(Number.NaN);
      continue;
    }
    const x = (t - a.time) / (b.time - a.time);
    out.push(a.height + ((b.height - a.height) * (1 - Math.cos(Math.PI * x))) / 2);
  }
  return out;
}

/** The hourly heights of the year; `events` reach beyond the year (the almanac's padded list). */
export function hourlyHeights(
  station: Station, _set: StationLookup, days: readonly LocalDay[], events: readonly TideEvent[],
  ctx?: EngineContext,
): HourlyYear {
  const zone = station.timezone;
  const predictor = station.kind === 'reference' ? predictorFor(station, ctx) : null;
  const list = days.map((day): HourlyDay => {
    const times = localHours(day, zone);
    const heights = predictor ? times.map((t) => predictor.heightAt(t)) : secondaryCurveAt(events, times);
    return {
      date: day.date,
      clocks: times.map((t) => clock(t, zone)),
      offsets: times.map((t) => offsetString(t, zone)),
      heights: heights.map(mm),
    };
  });
  return { method: windowMethod(station), days: list };
}
