// Build the StreamYear model: a stream station's year in the shape of a tide station's StationYear
// (events, local days with sun and moon, moon phases, springs and neaps, months), plain data that the
// renderers read and never recompute.
//
// Springs and neaps come from the tide station named by `tide_reference` (its own predicted range, as
// for any tide station), else from the stream's own range: each strongest flood counts as a "high" of
// its rate and each strongest ebb as a "low" of minus its rate, so the fortnightly envelope of flood
// plus ebb rate takes the place of the tidal range; the age that pairs markers with syzygies is the
// age of the tide (Pugh 1987) from the M2 and S2 ellipse phases.

import { createEngineContext, type EngineContext } from '../context.js';
import { isInvented } from '../almanac/caution.js';
import { commonDayFields, monthEntries } from '../almanac/days.js';
import { generator } from '../almanac/generator.js';
import { modelStation, paddingDays, springNeapEntries } from '../almanac/year-span.js';
import { ageOfTideHours } from '../datums.js';
import { UsageError } from '../errors.js';
import {
  clock, dayIndexOf, isoLocal, isoUtc, localDate, localDays, offsetString, roundToMinute,
  type LocalDay,
} from '../localtime.js';
import { moonQuarters, skyForDays, type MoonQuarter } from '../sky.js';
import { harmonicStationOf, tideEvents, type StationLookup } from '../tides.js';
import type { MoonPhaseEntry, MoonPhaseName, SpringNeapKind, Station, TideEvent } from '../types.js';
import { isRotary } from './predict.js';
import { ebbDirectionOf, referenceStreamOf, type StreamLookup } from './secondary.js';
import type {
  AnyStreamStation, StreamAlmanacEvent, StreamDayEntry, StreamEvent, StreamYear,
} from './types.js';
import { streamAlongFlood, streamEventsFor } from '../streams.js';
import { firstOf, itemAt, lastOf } from '../item.js';

const MINUTE = 60_000;
const DAY = 86_400_000;

export type StreamYearLookup = StreamLookup & Partial<StationLookup>;

const knots = (x: number): number => Math.round(x * 100) / 100 + 0;
const degrees = (x: number | null): number | null => (x === null ? null : (Math.round(x * 10) / 10) % 360 + 0);

/** One event for the model: instants as the tide events print them, knots and degrees rounded. */
export function streamAlmanacEvent(e: StreamEvent, zone: string): StreamAlmanacEvent {
  return {
    time: isoUtc(e.time),
    local: isoLocal(e.time, zone),
    clock: clock(e.time, zone),
    date: localDate(e.time, zone),
    offset: offsetString(roundToMinute(e.time), zone),
    type: e.type,
    speed: knots(e.speed),
    direction: degrees(e.direction),
  };
}

/** Stream events as the tide engine's events, for the spring–neap envelope: flood + rate, ebb − rate. */
function asRangeEvents(events: readonly StreamEvent[]): TideEvent[] {
  return events
    .filter((e) => e.type !== 'slack')
    .map((e) => ({ time: e.time, type: e.type === 'flood' ? 'high' : 'low', height: e.type === 'flood' ? e.speed : -e.speed }));
}

function tideReferenceOf(station: AnyStreamStation, set: StreamYearLookup): Station | null {
  if (station.tide_reference === undefined) return null;
  const found = set.byId?.get(station.tide_reference);
  if (!found) {
    throw new UsageError('--stations', `the tide station "${station.tide_reference}" named by tide_reference of ${station.id} is not in the station set`, 'give the folder that holds it with --stations, or leave tide_reference out');
  }
  return found;
}

/** The whole model of one stream station for one calendar year in the station's own time zone. */
export function buildStreamYear(
  station: AnyStreamStation, set: StreamYearLookup, year: number, curveStepMinutes = 30,
  ctx: EngineContext = createEngineContext(),
): StreamYear {
  if (!Number.isInteger(curveStepMinutes) || curveStepMinutes <= 0 || 60 % curveStepMinutes !== 0) {
    throw new UsageError('curveStepMinutes', `${curveStepMinutes} does not divide an hour`, 'use 10, 15, 20 or 30');
  }
  const zone = station.timezone;
  const days = localDays(year, zone);
  const padDays = [...paddingDays(year, zone, -1), ...days, ...paddingDays(year, zone, 1)];
  const allEvents = streamEventsFor(station, set, firstOf(padDays, 'padDays').start - DAY, lastOf(padDays, 'padDays').end + DAY, ctx);
  const yearEvents = allEvents.filter((e) => dayIndexOf(days, e.time) >= 0);
  const events = yearEvents.map((e) => streamAlmanacEvent(e, zone));

  const quarters = moonQuarters(firstOf(padDays, 'padDays').start - 20 * DAY, lastOf(padDays, 'padDays').end + 5 * DAY);
  const moonPhases: MoonPhaseEntry[] = quarters
    .filter((q) => dayIndexOf(days, q.time) >= 0)
    .map((q) => ({ time: isoUtc(q.time), local: isoLocal(q.time, zone), clock: clock(q.time, zone), date: localDate(q.time, zone), phase: q.phase }));

  const tide = tideReferenceOf(station, set);
  const harmonic = station.kind === 'stream' ? station : referenceStreamOf(station, set);
  const rangeEvents = tide
    ? tideEvents(tide, set as StationLookup, firstOf(padDays, 'padDays').start - DAY, lastOf(padDays, 'padDays').end + DAY, ctx)
    : asRangeEvents(allEvents);
  const age = tide
    ? ageOfTideHours(harmonicStationOf(tide, set as StationLookup).constituents)
    : ageOfTideHours(Object.fromEntries(Object.entries(harmonic.constituents).map(([k, e]) => [k, { amplitude: e.major, phase: e.phase }])));
  const springNeap = springNeapEntries(rangeEvents, padDays, days, quarters, age);

  const step = curveStepMinutes * MINUTE;
  const sky = skyForDays(days, station.position, zone, ctx.sky);
  const springNeapOn = new Map(springNeap.map((s) => [s.date, s.kind] as [string, SpringNeapKind]));
  const perDay: StreamAlmanacEvent[][] = days.map(() => []);
  yearEvents.forEach((e, i) => itemAt(perDay, dayIndexOf(days, e.time), 'perDay').push(itemAt(events, i, 'events')));
  const moonPhaseOn = new Map(moonPhases.map((m) => [m.date, m.phase] as [string, MoonPhaseName]));
  const dayList = days.map((day, i): StreamDayEntry => {
    const most = (type: 'flood' | 'ebb') => itemAt(perDay, i, 'perDay').filter((e) => e.type === type).reduce<number | null>((m, e) => (m === null || e.speed > m ? e.speed : m), null);
    return {
      ...commonDayFields(day, itemAt(sky, i, 'sky'), zone, moonPhaseOn.get(day.date) ?? null),
      events: itemAt(perDay, i, 'perDay'),
      curve: dayCurve(station, set, day, step, ctx),
      springNeap: springNeapOn.get(day.date) ?? null,
      strongestFlood: most('flood'),
      strongestEbb: most('ebb'),
    };
  });

  const strongest = (type: 'flood' | 'ebb') =>
    events.filter((e) => e.type === type).reduce<StreamAlmanacEvent | null>((best, e) => (!best || e.speed > best.speed ? e : best), null);
  const reference = station.kind === 'stream-secondary' ? harmonic : null;
  return {
    kind: 'stream',
    station: modelStation(station),
    year,
    timezone: zone,
    invented: isInvented(station),
    reference: reference ? { id: reference.id, name: reference.name } : null,
    tideReference: tide ? { id: tide.id, name: tide.name } : null,
    floodDirection: station.flood_direction,
    ebbDirection: ebbDirectionOf(station),
    rotary: isRotary(harmonic),
    springNeapFrom: tide ? 'tide-reference' : 'stream',
    events,
    moonPhases,
    springNeap,
    curveStepMinutes,
    days: dayList,
    months: monthEntries(dayList),
    offsetChanges: dayList.flatMap((d) => (d.offsetChange ? [d.offsetChange] : [])),
    extremes: { strongestFlood: strongest('flood'), strongestEbb: strongest('ebb') },
    warnings: [],
    generator: generator(),
  };
}

function dayCurve(station: AnyStreamStation, set: StreamYearLookup, day: LocalDay, stepMs: number, ctx: EngineContext): number[] {
  const n = Math.floor((day.end - day.start) / stepMs) + 1;
  const out = Array.from(streamAlongFlood(station, set, day.start, stepMs, n, ctx), knots);
  if (day.start + (n - 1) * stepMs < day.end) out.push(knots(firstOf(streamAlongFlood(station, set, day.end, stepMs, 1, ctx), 'stream at the end of the day')));
  return out;
}
