// Sun and moon rise and set for each local day of a station, plus the Moon's illuminated fraction
// at local noon. Every rise and set is found by a root search on the body's height over the whole
// range (./crossings.ts) and each local day keeps all of those whose printed minute lies inside
// [start, end) (the rounding rule of ../localtime.ts), in time order. Near the polar circles a
// day may hold two moonrises, or a sunset a few minutes after a sunrise at the edge of the
// midnight sun; a day may print a set before its rise: that is the order in which they happen.

import { IANAZone } from 'luxon';
import { getMoonIllumination } from 'suncalc';
import { roundToMinute } from '../localtime.js';
import { zoneOffset } from '../zone-offsets.js';
import { crossings, type Crossing } from './crossings.js';
import { createSkyEphemeris, skyHeight, skySite, type SkyBody, type SkyEphemeris } from './ephemeris.js';
import type { Position } from '../types.js';
import { firstOf, itemAt, lastOf } from '../item.js';

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

/** One rise or set of the Sun or the Moon. Time in UTC ms. */
export interface SkyEvent {
  body: SkyBody;
  type: 'rise' | 'set';
  time: number;
}

/** Sun and moon for one local day. Times are UTC ms; null when the event does not happen that day. */
export interface SkyDay {
  events: SkyEvent[]; // every rise and set of the day, both bodies, in time order
  sunrise: number | null; // the day's first sunrise
  sunset: number | null; // the day's first sunset
  sunNote: SunNote; // set only when the day has neither sunrise nor sunset
  moonrise: number | null; // the day's first moonrise
  moonset: number | null; // the day's first moonset
  moonNote: MoonNote; // set only when the day has neither moonrise nor moonset
  moonIllumination: number; // illuminated fraction 0..1 at local noon, to 0.001
}

/**
 * Sun and moon for each local day, at the station's position (east longitude positive). Pass
 * one SkyEphemeris to every call of a build so the stations share the Sun's and Moon's positions.
 */
export function skyForDays(
  days: readonly DaySpan[], position: Position, zone: string, eph: SkyEphemeris = createSkyEphemeris(),
): SkyDay[] {
  if (days.length === 0) return [];
  const from = firstOf(days, 'days').start - MARGIN;
  const to = lastOf(days, 'days').end + MARGIN;
  const site = skySite(position.latitude, position.longitude);
  const sun = crossings(eph, 'sun', from, to, site);
  const moon = crossings(eph, 'moon', from, to, site);
  const upAtMidday = (body: SkyBody, day: DaySpan) => skyHeight(eph, body, (day.start + day.end) / 2, site) > 0;
  const iana = IANAZone.create(zone);
  return days.map((day) => {
    const events = [...pickDay(sun, 'sun', day), ...pickDay(moon, 'moon', day)].sort((a, b) => a.time - b.time);
    const first = (body: SkyBody, type: SkyEvent['type']) =>
      events.find((e) => e.body === body && e.type === type)?.time ?? null;
    const hasSun = events.some((e) => e.body === 'sun');
    const hasMoon = events.some((e) => e.body === 'moon');
    const fraction = getMoonIllumination(new Date(localNoon(iana, day))).fraction;
    return {
      events,
      sunrise: first('sun', 'rise'),
      sunset: first('sun', 'set'),
      // With no crossing in the day the body stays on one side of the horizon all day.
      sunNote: hasSun ? null : upAtMidday('sun', day) ? 'sun-up-all-day' : 'sun-down-all-day',
      moonrise: first('moon', 'rise'),
      moonset: first('moon', 'set'),
      moonNote: hasMoon ? null : upAtMidday('moon', day) ? 'moon-up-all-day' : 'moon-down-all-day',
      moonIllumination: Number.isFinite(fraction) ? Math.round(Math.min(1, Math.max(0, fraction)) * 1000) / 1000 : 0,
    };
  });
}

/**
 * Every rise (+1) and set (−1) of the body between two instants, in time order, at a position
 * (east longitude positive).
 */
export function skyCrossings(
  body: SkyBody, fromMs: number, toMs: number, position: Position, eph: SkyEphemeris = createSkyEphemeris(),
): Crossing[] {
  return crossings(eph, body, fromMs, toMs, skySite(position.latitude, position.longitude));
}

// A crossing belongs to the day of its printed (rounded) minute, as every almanac time does.
function pickDay(list: readonly Crossing[], body: SkyBody, day: DaySpan): SkyEvent[] {
  const out: SkyEvent[] = [];
  for (let i = firstAtOrAfter(list, day.start - 30_000); i < list.length && itemAt(list, i, 'list').time < day.end; i++) {
    const c = itemAt(list, i, 'list');
    const shown = roundToMinute(c.time);
    if (shown < day.start || shown >= day.end) continue;
    out.push({ body, type: c.direction === 1 ? 'rise' : 'set', time: c.time });
  }
  return out;
}

// The instant the day's clocks read 12:00 (the zone's offset at that wall time, found twice over).
function localNoon(zone: IANAZone, day: DaySpan): number {
  const wall = Date.parse(`${day.date}T12:00:00Z`);
  const guess = wall - zoneOffset(zone, day.start) * 60_000;
  return wall - zoneOffset(zone, guess) * 60_000;
}

function firstAtOrAfter(list: readonly Crossing[], t: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (itemAt(list, mid, 'list').time < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
