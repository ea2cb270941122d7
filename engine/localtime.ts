// The local calendar of a station-year and the formatting of instants in the station's zone.
// Instants are UTC epoch milliseconds everywhere; local time exists only in what these return.
// The IANA time zone database, through luxon, is the reference for every offset.
//
// Rounding rule (one rule for every printed time): an instant is printed at its nearest whole
// minute (`clock`) or second (`isoUtc`, `isoLocal`), and it belongs to the local day of its
// rounded minute (`localDate`, `dayIndexOf`). So a high water at 23:59:40 prints "00:00" on the
// next day, never "00:00" on the day before. Rounding happens on the UTC instant, then the
// rounded instant is shown in the zone, so it always has a real local time and its own offset
// (an event in the repeated hour of autumn shows the offset in force at that instant).

import { DateTime, IANAZone } from 'luxon';
import { UsageError } from './errors.js';
import { zoneOffset } from './zone-offsets.js';
import { itemAt } from './item.js';

const MINUTE = 60_000;
const HOUR = 3_600_000;

/** A change of UTC offset during a local day (daylight saving or a change of standard time). */
export interface OffsetChange {
  time: string; // ISO UTC instant of the change, to the second
  from: string; // offset before, "+00:00" (with ":ss" where the zone has seconds)
  to: string; // offset after, "+01:00"
}

/** One local calendar day: local midnight to the next local midnight, as UTC instants. */
export interface LocalDay {
  date: string; // "YYYY-MM-DD"
  weekday: number; // ISO weekday: 1 = Monday … 7 = Sunday
  month: number; // 1..12
  dayOfMonth: number;
  start: number; // UTC ms of local midnight (or the first local instant of the day)
  end: number; // UTC ms of the next day's start (exclusive)
  hours: number; // 24; 23 or 25 on daylight-saving days; 23.5 etc. in zones with half-hour shifts
  offsetStart: string; // offset in force at `start`
  offsetEnd: string; // offset in force at the last instant of the day (just before `end`)
  offsetChange: OffsetChange | null;
}

/** True when `name` is an IANA time zone name that luxon can use. */
export function validZone(name: string): boolean {
  return typeof name === 'string' && name.length > 0 && IANAZone.isValidZone(name);
}

// Checking a name builds an Intl formatter (slow), so each valid zone is checked once.
const zones = new Map<string, IANAZone>();

function zoneOf(name: string): IANAZone {
  let zone = zones.get(name);
  if (zone === undefined) {
    if (!validZone(name)) {
      throw new UsageError('timezone', `"${name}" is not a known IANA time zone`, 'write a name such as Europe/Lisbon or Pacific/Auckland');
    }
    zone = IANAZone.create(name);
    zones.set(name, zone);
  }
  return zone;
}

/**
 * "+01:00" from an offset in minutes; "+05:41:16" where the offset has seconds (the local mean
 * time some zones kept before standard time), so an offset is never cut or shown as a fraction.
 */
export function formatOffset(minutes: number): string {
  const sign = minutes < 0 ? '-' : '+';
  const seconds = Math.abs(Math.round(minutes * 60));
  const s = seconds % 60;
  const m = Math.floor(seconds / 60);
  return `${sign}${pad2(Math.floor(m / 60))}:${pad2(m % 60)}${s === 0 ? '' : `:${pad2(s)}`}`;
}

function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/** The UTC offset in force at an instant, "+01:00". */
export function offsetString(ms: number, zone: string): string {
  return formatOffset(zoneOffset(zoneOf(zone), ms));
}

export function roundToSecond(ms: number): number {
  return Math.round(ms / 1000) * 1000;
}

export function roundToMinute(ms: number): number {
  return Math.round(ms / MINUTE) * MINUTE;
}

/** "2027-01-01T03:12:41Z": the instant in UTC, rounded to the nearest second. */
export function isoUtc(ms: number): string {
  return new Date(roundToSecond(ms)).toISOString().slice(0, 19) + 'Z';
}

/** "2027-03-28T14:02:10+01:00": the instant in the zone with its own offset, to the second. */
export function isoLocal(ms: number, zone: string): string {
  const t = roundToSecond(ms);
  const z = zoneOf(zone);
  const offset = zoneOffset(z, t);
  const w = wallClock(t, offset);
  if (w === null) return DateTime.fromMillis(t, { zone: z }).toFormat("yyyy-MM-dd'T'HH:mm:ss") + formatOffset(z.offset(t));
  return `${datePart(w)}T${pad2(w.getUTCHours())}:${pad2(w.getUTCMinutes())}:${pad2(w.getUTCSeconds())}${formatOffset(offset)}`;
}

/** Local wall clock "HH:mm" at the instant's nearest minute (see the rounding rule above). */
export function clock(ms: number, zone: string): string {
  const t = roundToMinute(ms);
  const z = zoneOf(zone);
  const w = wallClock(t, zoneOffset(z, t));
  if (w === null) return DateTime.fromMillis(t, { zone: z }).toFormat('HH:mm');
  return `${pad2(w.getUTCHours())}:${pad2(w.getUTCMinutes())}`;
}

/** Local date "YYYY-MM-DD" of the instant's nearest minute, so it always agrees with `clock`. */
export function localDate(ms: number, zone: string): string {
  const t = roundToMinute(ms);
  const z = zoneOf(zone);
  const w = wallClock(t, zoneOffset(z, t));
  if (w === null) return DateTime.fromMillis(t, { zone: z }).toFormat('yyyy-MM-dd');
  return datePart(w);
}

// The local wall time as a Date whose UTC fields read it, built as luxon builds it (the instant
// shifted by its offset), so the plain formatting below prints what luxon's toFormat would.
// Null for years without four plain digits: those are left to luxon.
function wallClock(t: number, offsetMinutes: number): Date | null {
  const w = new Date(t + offsetMinutes * 60 * 1000);
  const y = w.getUTCFullYear();
  return y >= 1000 && y <= 9999 ? w : null;
}

function datePart(w: Date): string {
  return `${w.getUTCFullYear()}-${pad2(w.getUTCMonth() + 1)}-${pad2(w.getUTCDate())}`;
}

const DATE_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/** UTC ms of the first instant of a local date ("2027-01-01" → local midnight in the zone). */
export function parseDateInZone(text: string, zone: string, option = 'date'): number {
  const m = DATE_PATTERN.exec(text);
  if (!m) {
    throw new UsageError(option, `"${text}" is not a date`, 'write the date as YYYY-MM-DD, e.g. 2027-01-01');
  }
  const start = startOfLocalDate(Number(m[1]), Number(m[2]), Number(m[3]), zoneOf(zone));
  if (start === null) {
    throw new UsageError(option, `${text} is not a day of the calendar in ${zone}`, 'write a date that exists, e.g. 2027-02-28');
  }
  return start;
}

// First instant of a local date, or null when the date does not exist (bad day of month, or a
// day the zone skipped). Where midnight falls in a gap, luxon moves forward to the first real time.
function startOfLocalDate(year: number, month: number, day: number, zone: IANAZone): number | null {
  if (month < 1 || month > 12 || day < 1 || day > 31) return null;
  const dt = DateTime.fromObject({ year, month, day }, { zone });
  if (!dt.isValid || dt.year !== year || dt.month !== month || dt.day !== day) return null;
  return dt.toMillis();
}

/** Every local calendar day of `year` in `zone`, in order, each with its span in UTC. */
export function localDays(year: number, zone: string): LocalDay[] {
  const z = zoneOf(zone);
  const dates: { y: number; m: number; d: number; start: number }[] = [];
  // One extra date (1 January of the next year) gives the end of 31 December.
  for (let m = 1; m <= 13; m++) {
    const y = m === 13 ? year + 1 : year;
    const month = m === 13 ? 1 : m;
    const last = m === 13 ? 1 : DateTime.utc(year, month, 1).daysInMonth ?? 31;
    for (let d = 1; d <= last; d++) {
      const start = startOfLocalDate(y, month, d, z);
      if (start !== null) dates.push({ y, m: month, d, start });
    }
  }
  const days: LocalDay[] = [];
  for (let i = 0; i + 1 < dates.length; i++) {
    const { y, m, d, start } = itemAt(dates, i, 'local dates');
    const end = itemAt(dates, i + 1, 'local dates').start;
    const weekday = (new Date(Date.UTC(y, m - 1, d)).getUTCDay() + 6) % 7; // 0 = Monday here
    days.push({
      date: `${y}-${pad2(m)}-${pad2(d)}`,
      weekday: weekday + 1,
      month: m,
      dayOfMonth: d,
      start,
      end,
      hours: (end - start) / HOUR,
      offsetStart: formatOffset(zoneOffset(z, start)),
      offsetEnd: formatOffset(zoneOffset(z, end - 1)),
      offsetChange: findOffsetChange(start, end, z),
    });
  }
  return days;
}

/** Index of the local day an instant is printed on (by its rounded minute), or -1 if outside. */
export function dayIndexOf(days: readonly Pick<LocalDay, 'start' | 'end'>[], ms: number): number {
  const t = roundToMinute(ms);
  let lo = 0;
  let hi = days.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const day = itemAt(days, mid, 'days');
    if (t < day.start) hi = mid - 1;
    else if (t >= day.end) lo = mid + 1;
    else return mid;
  }
  return -1;
}

// A change that lands exactly on local midnight (zones that shift at 24:00) belongs to the day
// that starts with it, hence the scan begins one second before `start`. Offsets are sampled every
// 30 minutes (no zone changes twice within that), then the first instant of the new offset is
// found by bisection to the second (transitions fall on whole seconds).
function findOffsetChange(start: number, end: number, zone: IANAZone): OffsetChange | null {
  let prevT = start - 1000;
  let prevOffset = zoneOffset(zone, prevT);
  // The common day: 24 hours and one offset from end to end (no zone shifts and shifts back in a day).
  if (end - start === 24 * HOUR && zoneOffset(zone, end - 1) === prevOffset) return null;
  for (let t = start; ; t = Math.min(t + HOUR / 2, end - 1)) {
    const offset = zoneOffset(zone, t);
    if (offset !== prevOffset) return describeChange(bisectChange(prevT, t, zone), prevOffset, offset);
    if (t >= end - 1) return null;
    prevT = t;
    prevOffset = offset;
  }
}

function bisectChange(lo: number, hi: number, zone: IANAZone): number {
  const before = zoneOffset(zone, lo);
  let a = Math.floor(lo / 1000);
  let b = Math.ceil(hi / 1000);
  while (b - a > 1) {
    const mid = Math.floor((a + b) / 2);
    if (zoneOffset(zone, mid * 1000) === before) a = mid;
    else b = mid;
  }
  return b * 1000;
}

function describeChange(at: number, from: number, to: number): OffsetChange {
  return { time: isoUtc(at), from: formatOffset(from), to: formatOffset(to) };
}
