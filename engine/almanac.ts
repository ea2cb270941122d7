// Build the StationYear model: everything a tide book prints about one station for one year, in
// plain JSON-serialisable data that the website and the PDF books read and never recompute.
import { isInvented } from './almanac/caution.js';
import { dayEntries, monthEntries } from './almanac/days.js';
import { almanacEvent, mm } from './almanac/format.js';
import { generator } from './almanac/generator.js';
import { modelStation, paddingDays, springNeapEntries } from './almanac/year-span.js';
import { hourlyHeights } from './almanac/hourly.js';
import { outOfRangeWarning, yearWindows } from './almanac/windows.js';
import { lowWaterBelowLat, stationDatums } from './datums.js';
import { UsageError } from './errors.js';
import {
  clock, dayIndexOf, isoLocal, isoUtc, localDate, localDays, type LocalDay,
} from './localtime.js';
import { createEngineContext, type EngineContext } from './context.js';
import { moonQuarters, skyForDays, type DaySpan, type MoonQuarter } from './sky.js';
import {
  cosineCurve, harmonicStationOf, predictorFor, tideEvents, type StationLookup,
} from './tides.js';
import type {
  AlmanacEvent, ModelWarning, MoonPhaseEntry, MoonPhaseName, SpringNeapEntry, SpringNeapKind, Station, StationYear,
  TideEvent,
} from './types.js';
import { firstOf, itemAt, lastOf } from './item.js';

export { CAUTION, isInvented } from './almanac/caution.js';

export interface AlmanacOptions {
  /** Minutes between the points of each day's curve; must divide 60. Default 30 (fits half-hour clock changes). */
  curveStepMinutes?: number;
  /**
   * The caches to use and fill (predictors, datums, a reference port's 19 years of events, Sun and
   * Moon positions): pass one context to the stations that may share them, then drop it. Default: a
   * new context for this station-year alone.
   */
  context?: EngineContext;
}

const MINUTE = 60_000;
const DAY = 86_400_000;

/** The whole model of one station for one calendar year in the station's own time zone. */
export function buildStationYear(
  station: Station, set: StationLookup, year: number, options: AlmanacOptions = {},
): StationYear {
  const step = options.curveStepMinutes ?? 30;
  if (!Number.isInteger(step) || step <= 0 || 60 % step !== 0) {
    throw new UsageError('curveStepMinutes', `${step} does not divide an hour`, 'use 10, 15, 20 or 30');
  }
  const ctx = options.context ?? createEngineContext();
  const zone = station.timezone;
  const reference = harmonicStationOf(station, set);
  const days = localDays(year, zone);
  const padDays: DaySpan[] = [...paddingDays(year, zone, -1), ...days, ...paddingDays(year, zone, 1)];
  const yearStart = firstOf(days, 'days').start;
  const yearEnd = lastOf(days, 'days').end;

  // One event list for everything: the year's events are those printed on one of its days.
  const allEvents = tideEvents(station, set, firstOf(padDays, 'padDays').start - DAY, lastOf(padDays, 'padDays').end + DAY, ctx);
  const yearEvents = allEvents.filter((e) => dayIndexOf(days, e.time) >= 0);
  if (yearEvents.length === 0) throw new RangeError(`no high or low water predicted for ${station.id} in ${year}`);
  const events = yearEvents.map((e) => almanacEvent(e, zone));

  const summary = stationDatums(station, set, ctx);
  const quarters = moonQuarters(firstOf(padDays, 'padDays').start - 20 * DAY, lastOf(padDays, 'padDays').end + 5 * DAY);
  const moonPhases = yearQuarters(quarters, days, zone);
  const springNeap = springNeapEntries(allEvents, padDays, days, quarters, summary.ageOfTideHours);

  const sample = station.kind === 'reference'
    ? (s: number, st: number, n: number) => predictorFor(station, ctx).heights(s, st, n)
    : (s: number, st: number, n: number) => cosineCurve(allEvents, s, st, n);
  const curves = days.map((d) => dayCurve(d, step * MINUTE, sample));

  const dayList = dayEntries({
    zone, days, events: yearEvents, formatted: events, rangeEvents: allEvents, curves,
    sky: skyForDays(days, station.position, zone, ctx.sky),
    moonPhaseOn: new Map(moonPhases.map((m) => [m.date, m.phase] as [string, MoonPhaseName])),
    springNeapOn: new Map(springNeap.map((s) => [s.date, s.kind] as [string, SpringNeapKind])),
  });

  const warnings: ModelWarning[] = structuredClone(summary.warnings);
  const below = lowWaterBelowLat(yearEvents, summary.datums.LAT);
  if (below) {
    // the LAT epoch or the datum label may be wrong
    const e = almanacEvent(below, zone);
    warnings.push({ code: 'low-water-below-lat', height: e.height, time: e.time, date: e.date, clock: e.clock,
      offset: e.offset, LAT: summary.datums.LAT, epoch: { ...summary.datums.epoch } });
  }

  const windows = yearWindows(station, set, days, allEvents, yearEvents, ctx);
  for (const w of windows) {
    const line = outOfRangeWarning(w, year);
    if (line) warnings.push(line);
  }

  return {
    station: modelStation(station),
    year,
    timezone: zone,
    invented: isInvented(station),
    reference: station.kind === 'secondary' ? { id: reference.id, name: reference.name } : null,
    events,
    moonPhases,
    springNeap,
    datums: { ...summary.datums, epoch: { ...summary.datums.epoch } },
    tideType: { ...summary.tideType },
    meanSpringRange: summary.meanSpringRange,
    meanNeapRange: summary.meanNeapRange,
    ageOfTideHours: summary.ageOfTideHours,
    springLagHours: meanSpringLag(springNeap),
    curveStepMinutes: step,
    days: dayList,
    months: monthEntries(dayList),
    offsetChanges: dayList.flatMap((d) => (d.offsetChange ? [d.offsetChange] : [])),
    extremes: yearExtremes(yearEvents, events),
    warnings,
    hourly: hourlyHeights(station, set, days, allEvents, ctx),
    windows,
    generator: generator(),
  };
}

// Heights from local midnight every `stepMs`, ending exactly on the next local midnight.
function dayCurve(
  day: LocalDay, stepMs: number, sample: (start: number, step: number, count: number) => Float64Array,
): number[] {
  const n = Math.floor((day.end - day.start) / stepMs) + 1;
  const out = Array.from(sample(day.start, stepMs, n), mm);
  if (day.start + (n - 1) * stepMs < day.end) out.push(mm(firstOf(sample(day.end, stepMs, 1), 'height at the end of the day')));
  return out;
}

function yearQuarters(quarters: readonly MoonQuarter[], days: readonly LocalDay[], zone: string): MoonPhaseEntry[] {
  return quarters
    .filter((q) => dayIndexOf(days, q.time) >= 0)
    .map((q) => ({
      time: isoUtc(q.time), local: isoLocal(q.time, zone), clock: clock(q.time, zone),
      date: localDate(q.time, zone), phase: q.phase,
    }));
}

/** The mean lag of the year's spring marks after the syzygy each follows, hours to the tenth. */
function meanSpringLag(entries: readonly SpringNeapEntry[]): number | null {
  const lags = entries.filter((e) => e.kind === 'spring').map((e) => e.lagHours);
  return lags.length === 0 ? null : Math.round((lags.reduce((a, b) => a + b, 0) / lags.length) * 10) / 10;
}

function yearExtremes(raw: readonly TideEvent[], events: readonly AlmanacEvent[]): StationYear['extremes'] {
  let hi = -1;
  let lo = -1;
  raw.forEach((e, i) => {
    if (e.type === 'high' && (hi < 0 || e.height > itemAt(raw, hi, 'raw').height)) hi = i;
    if (e.type === 'low' && (lo < 0 || e.height < itemAt(raw, lo, 'raw').height)) lo = i;
  });
  // A year always has both; fall back to any event rather than crash on a degenerate station.
  return { highest: itemAt(events, hi < 0 ? 0 : hi, 'events'), lowest: itemAt(events, lo < 0 ? 0 : lo, 'events') };
}
