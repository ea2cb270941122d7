// Sun and moon rise and set for each local day of a station, from suncalc, plus the Moon's
// illuminated fraction at local noon. suncalc answers per solar day (getTimes) and per UTC
// calendar day (getMoonTimes); neither is the station's local day, so every crossing of the days
// around the range is collected once and each local day keeps those whose printed minute lies
// inside [start, end) (the rounding rule of ../localtime.ts).
// A day may therefore print a sunset before its sunrise (high latitudes, far-off zones): that is
// the order in which they happen on that local day. Moonrise and moonset use suncalc's Moon
// position with getMoonTimes' own criterion (moonCrossings says why its search is not used as is).

import { DateTime } from 'luxon';
import { getMoonIllumination, getPosition, getTimes } from 'suncalc';
import { roundToMinute } from '../localtime.js';
import { moonHeightAt, moonHeightsOnGrid, observer, type Observer } from './moon-grid.js';
import type { Position } from '../types.js';

const DAY = 86_400_000;
const MARGIN = DAY; // crossings are collected a day beyond the range, then cut to each local day

export type SunNote = null | 'sun-up-all-day' | 'sun-down-all-day';
export type MoonNote = null | 'moon-up-all-day' | 'moon-down-all-day';

/** A local day as localDays() gives it (only these fields are read). */
export interface DaySpan {
  date: string; // "YYYY-MM-DD" in the zone
  start: number; // UTC ms
  end: number; // UTC ms, exclusive
}

/** Sun and moon for one local day. Times are UTC ms; null when the event does not happen that day. */
export interface SkyDay {
  sunrise: number | null; // the day's first sunrise
  sunset: number | null; // the day's first sunset
  sunNote: SunNote; // set only when the day has neither sunrise nor sunset
  moonrise: number | null;
  moonset: number | null;
  moonNote: MoonNote; // set only when the day has neither moonrise nor moonset
  moonIllumination: number; // illuminated fraction 0..1 at local noon, to 0.001
}

/** A crossing of the rise/set altitude: +1 rising, −1 setting. */
export interface Crossing {
  time: number;
  direction: 1 | -1;
}

/** Sun and moon for each local day, at the station's position (east longitude positive). */
export function skyForDays(days: readonly DaySpan[], position: Position, zone: string): SkyDay[] {
  if (days.length === 0) return [];
  const from = days[0].start - MARGIN;
  const to = days[days.length - 1].end + MARGIN;
  const sun = sunCrossings(from, to, position);
  const moon = moonCrossings(from, to, position);
  return days.map((day) => {
    const s = pickDay(sun, day);
    const m = pickDay(moon, day);
    const noon = DateTime.fromISO(day.date, { zone }).set({ hour: 12 }).toMillis();
    const fraction = getMoonIllumination(new Date(noon)).fraction;
    return {
      sunrise: s.rise,
      sunset: s.set,
      sunNote: s.rise === null && s.set === null ? (sunUpAt(day, position) ? 'sun-up-all-day' : 'sun-down-all-day') : null,
      moonrise: m.rise,
      moonset: m.set,
      moonNote: m.rise === null && m.set === null ? (moonUpAt(day, position) ? 'moon-up-all-day' : 'moon-down-all-day') : null,
      moonIllumination: Number.isFinite(fraction) ? Math.round(Math.min(1, Math.max(0, fraction)) * 1000) / 1000 : 0,
    };
  });
}

/** Every sunrise and sunset between two instants, in time order (suncalc getTimes, one call per solar day). */
export function sunCrossings(fromMs: number, toMs: number, position: Position): Crossing[] {
  const out: Crossing[] = [];
  // getTimes answers for the solar day nearest the instant given; stepping by exactly one day
  // from half a day before the range visits every solar day whose events can fall inside it.
  for (let t = fromMs - DAY / 2; t <= toMs + DAY / 2; t += DAY) {
    const r = getTimes(new Date(t), position.latitude, position.longitude);
    pushIfIn(out, r.sunrise, 1, fromMs, toMs);
    pushIfIn(out, r.sunset, -1, fromMs, toMs);
  }
  return out.sort((a, b) => a.time - b.time);
}

/**
 * Every moonrise and moonset between two instants, in time order. suncalc's getMoonTimes stops at
 * the first rise and set of each UTC day, which loses the second moonrise of a day at high
 * latitudes; so the same criterion (upper limb on the horizon, suncalc's own moon height) is
 * scanned here every 20 minutes and each sign change refined to about a second.
 */
export function moonCrossings(fromMs: number, toMs: number, position: Position): Crossing[] {
  const out: Crossing[] = [];
  if (!(fromMs < toMs)) return out;
  const o = observer(position.latitude, position.longitude);
  // The 20-minute points come from the grid shared by all stations (moon-grid.ts); the last step,
  // cut short at toMs, and any range not on whole milliseconds are computed directly.
  const n = Math.ceil((toMs - fromMs) / MOON_STEP);
  const shared = Number.isInteger(fromMs) && n < 1e6 ? moonHeightsOnGrid(fromMs, MOON_STEP, n + 1, o) : null;
  let t0 = fromMs;
  let h0 = shared ? shared(0) : moonHeightAt(t0, o);
  for (let k = 1; t0 < toMs; k++) {
    const t1 = Math.min(t0 + MOON_STEP, toMs);
    const h1 = shared && t1 === fromMs + k * MOON_STEP ? shared(k) : moonHeightAt(t1, o);
    if (h0 <= 0 !== h1 <= 0) out.push({ time: refineCrossing(t0, t1, h0, h1, o), direction: h0 <= 0 ? 1 : -1 });
    t0 = t1;
    h0 = h1;
  }
  return out;
}

const MOON_STEP = 20 * 60_000;

// Illinois variant of regula falsi (Dowell & Jarratt 1971): a bracketing root search that keeps
// the sign change inside [lo, hi] and converges in a few steps on a smooth height curve.
function refineCrossing(lo: number, hi: number, hLo: number, hHi: number, o: Observer): number {
  let side = 0;
  for (let i = 0; i < 40 && hi - lo > 1000; i++) {
    const t = hi - (hHi * (hi - lo)) / (hHi - hLo);
    const h = moonHeightAt(t, o);
    if (h <= 0 === hHi <= 0) {
      hi = t;
      hHi = h;
      if (side === -1) hLo /= 2;
      side = -1;
    } else {
      lo = t;
      hLo = h;
      if (side === 1) hHi /= 2;
      side = 1;
    }
    if (Math.abs(h) < 1e-5) return Math.round(t);
  }
  return Math.round((lo + hi) / 2);
}

function pushIfIn(out: Crossing[], d: Date | null | undefined, direction: 1 | -1, fromMs: number, toMs: number): void {
  if (!d) return;
  const time = d.getTime();
  if (Number.isFinite(time) && time >= fromMs && time < toMs) out.push({ time, direction });
}

function pickDay(list: readonly Crossing[], day: DaySpan): { rise: number | null; set: number | null } {
  let rise: number | null = null;
  let set: number | null = null;
  // A crossing belongs to the day of its printed (rounded) minute, as every almanac time does.
  for (let i = firstAtOrAfter(list, day.start - 30_000); i < list.length && list[i].time < day.end; i++) {
    const shown = roundToMinute(list[i].time);
    if (shown < day.start || shown >= day.end) continue;
    if (list[i].direction === 1 && rise === null) rise = list[i].time;
    if (list[i].direction === -1 && set === null) set = list[i].time;
  }
  return { rise, set };
}

function firstAtOrAfter(list: readonly Crossing[], t: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (list[mid].time < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

// With no crossing in the day the body stays on one side of the horizon all day, so its height
// at the middle of the day decides.
function sunUpAt(day: DaySpan, position: Position): boolean {
  const p = getPosition(new Date((day.start + day.end) / 2), position.latitude, position.longitude);
  return p.altitude > SUN_APPARENT_THRESHOLD;
}

// getTimes puts sunrise/sunset where the Sun's centre is 0.833° below the horizon (geometric);
// getPosition adds its refraction, a constant 0.484° below the horizon: −0.833 + 0.484 = −0.349.
const SUN_APPARENT_THRESHOLD = -0.349;

function moonUpAt(day: DaySpan, position: Position): boolean {
  return moonHeightAt((day.start + day.end) / 2, observer(position.latitude, position.longitude)) > 0;
}
