// The model's days and months: one entry per local calendar day, everything a day prints.
import { clock, dayIndexOf, isoUtc, type LocalDay } from '../localtime.js';
import type { SkyDay } from '../sky.js';
import { dayRange } from '../springneap.js';
import type {
  AlmanacEvent, DayEntry, MonthEntry, MoonPhaseName, SpringNeapKind, TideEvent,
} from '../types.js';
import { mm } from './format.js';
import { itemAt } from '../item.js';

export interface DayInputs {
  zone: string;
  days: readonly LocalDay[];
  events: readonly TideEvent[]; // the year's events, each printed on one of `days`
  formatted: readonly AlmanacEvent[]; // the same events as the model prints them
  rangeEvents: readonly TideEvent[]; // events reaching beyond the year, for ranges across midnight
  curves: readonly number[][]; // per day
  sky: readonly SkyDay[]; // per day
  moonPhaseOn: ReadonlyMap<string, MoonPhaseName>; // local date → quarter
  springNeapOn: ReadonlyMap<string, SpringNeapKind>; // local date → marker
}

const isoOrNull = (t: number | null): string | null => (t === null ? null : isoUtc(t));
const clockOrNull = (t: number | null, zone: string): string | null => (t === null ? null : clock(t, zone));

/** The fields every kind of day shares (tide and stream days alike): the calendar, the clock, sun and moon. */
export type CommonDayFields = Omit<DayEntry, 'events' | 'curve' | 'springNeap' | 'range'>;

/** The calendar, clock and sky fields of one local day, in the one shape tide and stream days share. */
export function commonDayFields(day: LocalDay, sky: SkyDay, zone: string, moonPhase: MoonPhaseName | null): CommonDayFields {
  return {
    date: day.date,
    weekday: day.weekday,
    month: day.month,
    dayOfMonth: day.dayOfMonth,
    start: isoUtc(day.start),
    end: isoUtc(day.end),
    hours: day.hours,
    offsetStart: day.offsetStart,
    offsetEnd: day.offsetEnd,
    offsetChange: day.offsetChange ? { ...day.offsetChange } : null,
    sunrise: isoOrNull(sky.sunrise),
    sunset: isoOrNull(sky.sunset),
    sunriseClock: clockOrNull(sky.sunrise, zone),
    sunsetClock: clockOrNull(sky.sunset, zone),
    sunNote: sky.sunNote,
    moonrise: isoOrNull(sky.moonrise),
    moonset: isoOrNull(sky.moonset),
    moonriseClock: clockOrNull(sky.moonrise, zone),
    moonsetClock: clockOrNull(sky.moonset, zone),
    sky: sky.events.map((e) => ({ body: e.body, type: e.type, time: isoUtc(e.time), clock: clock(e.time, zone) })),
    moonPhase,
    moonIllumination: sky.moonIllumination,
  };
}

/** One DayEntry per local day; every event lands on exactly one day (the day of its rounded minute). */
export function dayEntries(input: DayInputs): DayEntry[] {
  const { zone, days } = input;
  const perDay: AlmanacEvent[][] = days.map(() => []);
  input.events.forEach((e, i) => {
    const d = dayIndexOf(days, e.time);
    if (d < 0) throw new RangeError(`event at ${isoUtc(e.time)} lies outside the year's days`);
    itemAt(perDay, d, 'perDay').push(itemAt(input.formatted, i, 'formatted'));
  });
  return days.map((day, i): DayEntry => {
    const range = dayRange(input.rangeEvents, day.start, day.end);
    return {
      ...commonDayFields(day, itemAt(input.sky, i, 'sky'), zone, input.moonPhaseOn.get(day.date) ?? null),
      events: itemAt(perDay, i, 'perDay'),
      curve: itemAt(input.curves, i, 'curves'),
      springNeap: input.springNeapOn.get(day.date) ?? null,
      range: range === null ? null : mm(range),
    };
  });
}

/** Month entries pointing into the days. */
export function monthEntries(days: readonly Pick<DayEntry, 'month'>[]): MonthEntry[] {
  const months: MonthEntry[] = [];
  days.forEach((d, i) => {
    const last = months[months.length - 1];
    if (last && last.month === d.month) last.dayCount++;
    else {
      months.push({ month: d.month, slug: String(d.month).padStart(2, '0'),
        firstDayIndex: i, dayCount: 1 });
    }
  });
  return months;
}
