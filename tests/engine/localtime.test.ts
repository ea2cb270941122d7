import { describe, expect, it } from 'vitest';
import { UsageError } from '../../engine/errors.js';
import { itemAt } from '../../engine/index.js';
import { neighbours } from '../fixtures/lists.js';
import {
  clock, dayIndexOf, isoLocal, isoUtc, localDate, localDays, offsetString, parseDateInZone, validZone,
} from '../../engine/localtime.js';
import { wordsFor } from '../../templates/locale/index.js';

// the model holds the change as facts; its English sentence comes from the catalogue
const say = (c: { time: string; from: string; to: string } | null): string => wordsFor().offsetChange(c!);

const HOUR = 3_600_000;
const utc = (s: string) => Date.parse(s);

// Last Sunday of a month at 01:00 UTC, computed with plain UTC date arithmetic (no luxon): the EU
// summer-time rule of Directive 2000/84/EC (start: last Sunday of March; end: last Sunday of October).
function lastSundayAt0100Utc(year: number, month: number): number {
  const lastDay = new Date(Date.UTC(year, month, 0));
  return Date.UTC(year, month - 1, lastDay.getUTCDate() - lastDay.getUTCDay(), 1);
}

describe('localDays', () => {
  it('EU rule (Directive 2000/84/EC) in Europe/Lisbon and Europe/London, 2026–2028: one 23-hour and one 25-hour day, at 01:00 UTC', () => {
    for (const zone of ['Europe/Lisbon', 'Europe/London']) {
      for (const year of [2026, 2027, 2028]) {
        const days = localDays(year, zone);
        const spring = lastSundayAt0100Utc(year, 3);
        const autumn = lastSundayAt0100Utc(year, 10);
        const changed = days.filter((d) => d.offsetChange !== null);
        expect(changed.map((d) => d.date)).toEqual([isoUtc(spring).slice(0, 10), isoUtc(autumn).slice(0, 10)]);
        expect(changed.map((d) => d.hours)).toEqual([23, 25]);
        expect(changed.map((d) => d.offsetChange!.time)).toEqual([isoUtc(spring), isoUtc(autumn)]);
        expect(days.filter((d) => d.hours !== 24)).toHaveLength(2);
      }
    }
  });

  it('Europe/Lisbon 2027: 365 days, contiguous, 8760 hours, change days described in plain words', () => {
    const days = localDays(2027, 'Europe/Lisbon');
    expect(days).toHaveLength(365);
    expect(days[0]).toMatchObject({ date: '2027-01-01', weekday: 5, month: 1, dayOfMonth: 1, start: utc('2027-01-01T00:00:00Z'), hours: 24 });
    expect(days[364]).toMatchObject({ date: '2027-12-31', weekday: 5, end: utc('2028-01-01T00:00:00Z') });
    for (const [before, after] of neighbours(days)) expect(after.start).toBe(before.end);
    expect(days.reduce((sum, d) => sum + d.hours, 0)).toBe(8760);

    const march = days.find((d) => d.date === '2027-03-28')!;
    expect(march).toMatchObject({ weekday: 7, hours: 23, offsetStart: '+00:00', offsetEnd: '+01:00' });
    expect(march.offsetChange).toEqual({ time: '2027-03-28T01:00:00Z', from: '+00:00', to: '+01:00' });
    expect(say(march.offsetChange)).toBe('Clocks go forward 1 hour at 01:00 UTC (01:00 → 02:00 local)');
    const october = days.find((d) => d.date === '2027-10-31')!;
    expect(october).toMatchObject({ weekday: 7, hours: 25, offsetStart: '+01:00', offsetEnd: '+00:00' });
    expect(october.offsetChange).toEqual({ time: '2027-10-31T01:00:00Z', from: '+01:00', to: '+00:00' });
    expect(say(october.offsetChange)).toBe('Clocks go back 1 hour at 01:00 UTC (02:00 → 01:00 local)');
  });

  it('Europe/Berlin (same EU rule, one hour east): the note reads 02:00 → 03:00 local', () => {
    const march = localDays(2027, 'Europe/Berlin').find((d) => d.offsetChange !== null)!;
    expect(march.date).toBe('2027-03-28');
    expect(say(march.offsetChange)).toBe('Clocks go forward 1 hour at 01:00 UTC (02:00 → 03:00 local)');
  });

  it('southern hemisphere, Australia/Hobart 2027: 25-hour day in April, 23-hour day in October', () => {
    // Tasmania's rule in the tz database (from memory): summer time ends on the first Sunday of
    // April at 03:00 local and starts on the first Sunday of October at 02:00 local.
    const days = localDays(2027, 'Australia/Hobart');
    expect(days).toHaveLength(365);
    const changed = days.filter((d) => d.offsetChange !== null);
    expect(changed.map((d) => [d.date, d.hours, d.offsetStart, d.offsetEnd])).toEqual([
      ['2027-04-04', 25, '+11:00', '+10:00'],
      ['2027-10-03', 23, '+10:00', '+11:00'],
    ]);
    const [autumn, spring] = changed;
    expect(say(autumn?.offsetChange ?? null)).toBe('Clocks go back 1 hour at 16:00 UTC (03:00 → 02:00 local)');
    expect(spring?.offsetChange).toMatchObject({ time: '2027-10-02T16:00:00Z' });
    expect(days[0]?.start).toBe(utc('2026-12-31T13:00:00Z')); // midnight at +11:00
  });

  it('a zone without daylight saving, Atlantic/Reykjavik: every day 24 hours at +00:00', () => {
    const days = localDays(2027, 'Atlantic/Reykjavik');
    expect(days).toHaveLength(365);
    expect(days.every((d) => d.hours === 24 && d.offsetChange === null && d.offsetStart === '+00:00' && d.offsetEnd === '+00:00')).toBe(true);
  });

  it('a leap year has 366 days (2028, Pacific/Auckland)', () => {
    const days = localDays(2028, 'Pacific/Auckland');
    expect(days).toHaveLength(366);
    expect(days.some((d) => d.date === '2028-02-29')).toBe(true);
  });

  it('invariants in odd zones (midnight shifts, half-hour shifts): spans, hours and offsets agree', () => {
    // America/Santiago shifts at local midnight; Australia/Lord_Howe by 30 minutes; Asia/Kolkata never.
    for (const zone of ['America/Santiago', 'Australia/Lord_Howe', 'Asia/Kolkata', 'Pacific/Auckland']) {
      const days = localDays(2027, zone);
      expect(days).toHaveLength(365);
      for (const [i, d] of days.entries()) {
        const before = days[i - 1];
        expect(d.hours).toBeCloseTo((d.end - d.start) / HOUR, 12);
        expect(localDate(d.start, zone)).toBe(d.date);
        expect(localDate(d.end - 60_000, zone)).toBe(d.date);
        expect(offsetString(d.start, zone)).toBe(d.offsetStart);
        if (before) expect(d.start).toBe(before.end);
        const c = d.offsetChange;
        if (c === null) {
          expect(d.hours).toBe(24);
        } else {
          const at = utc(c.time);
          expect(at).toBeGreaterThanOrEqual(d.start);
          expect(at).toBeLessThan(d.end);
          expect(offsetString(at - 1000, zone)).toBe(c.from);
          expect(offsetString(at, zone)).toBe(c.to);
          expect(wordsFor().clockAt(c.time, c.to)).toBe(clock(at, zone));
          expect(d.hours * 60).toBe(24 * 60 - (toMinutes(c.to) - toMinutes(c.from)));
        }
      }
    }
    const lordHowe = localDays(2027, 'Australia/Lord_Howe').filter((d) => d.offsetChange);
    expect(lordHowe.map((d) => d.hours)).toEqual([24.5, 23.5]);
    expect(say(lordHowe[0]?.offsetChange ?? null)).toMatch(/^Clocks go back 30 minutes at /);
  });

  it('rejects an unknown zone with a UsageError', () => {
    expect(() => localDays(2027, 'Europe/Atlantis')).toThrow(UsageError);
  });
});

function toMinutes(offset: string): number {
  const sign = offset.startsWith('-') ? -1 : 1;
  return sign * (Number(offset.slice(1, 3)) * 60 + Number(offset.slice(4, 6)));
}

describe('the repeated hour of autumn (Europe/Lisbon, 2027-10-31)', () => {
  const zone = 'Europe/Lisbon';

  it('two instants an hour apart with the same wall clock show their own offsets', () => {
    const first = utc('2027-10-31T00:30:00Z');
    const second = utc('2027-10-31T01:30:00Z');
    expect(isoLocal(first, zone)).toBe('2027-10-31T01:30:00+01:00');
    expect(isoLocal(second, zone)).toBe('2027-10-31T01:30:00+00:00');
    expect(offsetString(first, zone)).toBe('+01:00');
    expect(offsetString(second, zone)).toBe('+00:00');
    expect(clock(first, zone)).toBe('01:30');
    expect(clock(second, zone)).toBe('01:30');
    expect(Date.parse(isoLocal(first, zone))).toBe(first);
    expect(Date.parse(isoLocal(second, zone))).toBe(second);
  });

  it('events every 7 min 13 s across both change days: each on one day, in order, no duplicate, no gap', () => {
    const days = localDays(2027, zone);
    for (const date of ['2027-03-28', '2027-10-31']) {
      const i = days.findIndex((d) => d.date === date);
      const from = itemAt(days, i - 1, 'days').start;
      const to = itemAt(days, i + 1, 'days').end;
      const seen = new Set<string>();
      const perDay = new Map<number, number[]>();
      for (let t = from + 17_000; t < to; t += 433_000) {
        const local = isoLocal(t, zone);
        expect(seen.has(local)).toBe(false); // no two instants print alike
        seen.add(local);
        expect(Date.parse(local)).toBe(Math.round(t / 1000) * 1000); // the printed text leads back to the instant
        const d = dayIndexOf(days, t);
        expect(days[d]?.date).toBe(localDate(t, zone));
        perDay.set(d, [...(perDay.get(d) ?? []), t]);
      }
      expect([...perDay.keys()]).toEqual([i - 1, i, i + 1]);
      for (const [d, times] of perDay) {
        // the count on each day matches its length: 23 or 25 hours hold fewer or more events
        expect(Math.abs(times.length - (itemAt(days, d, 'days').hours * HOUR) / 433_000)).toBeLessThanOrEqual(1);
      }
      if (date === '2027-03-28') {
        // the skipped hour 01:00–01:59 never appears on the spring day
        expect(perDay.get(i)!.some((t) => clock(t, zone).startsWith('01:'))).toBe(false);
      } else {
        // the repeated hour appears twice, once at each offset
        const oneOClock = perDay.get(i)!.filter((t) => clock(t, zone).startsWith('01:'));
        expect(new Set(oneOClock.map((t) => offsetString(t, zone)))).toEqual(new Set(['+01:00', '+00:00']));
      }
    }
  });
});

describe('formatting and rounding', () => {
  it('isoUtc rounds to the nearest second', () => {
    expect(isoUtc(utc('2027-01-01T03:12:40.600Z'))).toBe('2027-01-01T03:12:41Z');
    expect(isoUtc(utc('2027-01-01T03:12:41.499Z'))).toBe('2027-01-01T03:12:41Z');
    expect(isoUtc(utc('2027-12-31T23:59:59.700Z'))).toBe('2028-01-01T00:00:00Z');
  });

  it('isoLocal in summer time', () => {
    expect(isoLocal(utc('2027-03-28T13:02:10Z'), 'Europe/Lisbon')).toBe('2027-03-28T14:02:10+01:00');
    expect(isoLocal(utc('2027-07-01T12:00:00Z'), 'Pacific/Auckland')).toBe('2027-07-02T00:00:00+12:00');
  });

  it('an event at 23:59:40 prints 00:00 on the next day, and belongs to that day', () => {
    const zone = 'Europe/Lisbon';
    const days = localDays(2027, zone);
    const late = utc('2027-01-01T23:59:40Z');
    expect(clock(late, zone)).toBe('00:00');
    expect(localDate(late, zone)).toBe('2027-01-02');
    expect(days[dayIndexOf(days, late)]?.date).toBe('2027-01-02');
    const earlier = utc('2027-01-01T23:59:29Z');
    expect(clock(earlier, zone)).toBe('23:59');
    expect(days[dayIndexOf(days, earlier)]?.date).toBe('2027-01-01');
    expect(dayIndexOf(days, utc('2026-12-31T23:59:00Z'))).toBe(-1);
    expect(dayIndexOf(days, utc('2027-12-31T23:59:31Z'))).toBe(-1); // prints 00:00 on 1 January 2028
  });

  it('rounding across the spring gap lands on a real local time', () => {
    // 00:59:50 local (+00:00) rounds to 01:00 UTC, the instant clocks jump to 02:00 (+01:00).
    expect(clock(utc('2027-03-28T00:59:50Z'), 'Europe/Lisbon')).toBe('02:00');
  });

  it('zone names', () => {
    expect(validZone('Europe/Lisbon')).toBe(true);
    expect(validZone('Pacific/Auckland')).toBe(true);
    expect(validZone('Europe/Atlantis')).toBe(false);
    expect(validZone('')).toBe(false);
  });
});

describe('parseDateInZone', () => {
  it('a date means the first instant of that local day', () => {
    expect(parseDateInZone('2027-01-01', 'Europe/Lisbon')).toBe(utc('2027-01-01T00:00:00Z'));
    expect(parseDateInZone('2027-01-01', 'Europe/Berlin')).toBe(utc('2026-12-31T23:00:00Z'));
    expect(parseDateInZone('2027-07-01', 'Pacific/Auckland')).toBe(utc('2027-06-30T12:00:00Z'));
    expect(parseDateInZone('2028-02-29', 'Europe/Lisbon')).toBe(utc('2028-02-29T00:00:00Z'));
  });

  it('impossible or malformed dates are a UsageError naming the option', () => {
    for (const bad of ['2027-02-30', '2027-02-29', '2027-13-01', '2027-00-10', '2027-04-31', '2027-1-1', 'tomorrow', '']) {
      expect(() => parseDateInZone(bad, 'Europe/Lisbon', '--from')).toThrow(UsageError);
    }
    expect(() => parseDateInZone('2027-02-30', 'Europe/Lisbon', '--from')).toThrow(/^--from: 2027-02-30 is not a day of the calendar/);
    expect(() => parseDateInZone('2027-01-01', 'Mars/Olympus')).toThrow(UsageError);
  });
});
