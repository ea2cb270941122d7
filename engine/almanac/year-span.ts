// Pieces every year model shares, tide or stream: the padding days around the year for the
// spring–neap envelope, the year's spring and neap entries, and the station as published.
import { basename } from 'node:path';
import { isoUtc, parseDateInZone, type LocalDay } from '../localtime.js';
import type { DaySpan, MoonQuarter } from '../sky.js';
import { dayRange, springNeapMarkers } from '../springneap.js';
import type { SpringNeapEntry, TideEvent } from '../types.js';
import { mm } from './format.js';
import { firstOf, itemAt, lastOf } from '../item.js';

const DAY = 86_400_000;
// Days looked at beyond each end of the year, so a fortnight's envelope near 1 January is whole.
export const SPRING_NEAP_PAD_DAYS = 20;

/** The SPRING_NEAP_PAD_DAYS local days before (-1) or after (+1) the year, as bare spans. */
export function paddingDays(year: number, zone: string, side: -1 | 1): DaySpan[] {
  const dates: string[] = [];
  for (let i = 0; i <= SPRING_NEAP_PAD_DAYS; i++) {
    const first = side < 0 ? Date.UTC(year, 0, 1 - SPRING_NEAP_PAD_DAYS) : Date.UTC(year + 1, 0, 1);
    dates.push(new Date(first + i * DAY).toISOString().slice(0, 10));
  }
  const starts = dates.map((d) => parseDateInZone(d, zone));
  return dates.slice(0, -1).map((date, i) => ({ date, start: itemAt(starts, i, 'starts'), end: itemAt(starts, i + 1, 'starts') }));
}

/** A deep copy as loaded, its source path cut to the file name (no machine paths in published data). */
export function modelStation<T extends { sourceFile?: string | undefined }>(station: T): T {
  const copy = structuredClone(station);
  if (copy.sourceFile !== undefined) copy.sourceFile = basename(copy.sourceFile);
  return copy;
}

/** The year's spring and neap markers, each with its day's range and its lag after the syzygy or quadrature. */
export function springNeapEntries(
  events: readonly TideEvent[], padDays: readonly DaySpan[], days: readonly LocalDay[],
  quarters: readonly MoonQuarter[], ageHours: number,
): SpringNeapEntry[] {
  const first = firstOf(days, 'days').date;
  const last = lastOf(days, 'days').date;
  return springNeapMarkers(events, padDays, quarters, ageHours)
    .filter((m) => m.date >= first && m.date <= last)
    .map((m) => {
      const day = padDays.find((d) => d.date === m.date)!;
      return {
        date: m.date,
        kind: m.kind,
        range: mm(dayRange(events, day.start, day.end) ?? m.envelope),
        astronomical: isoUtc(m.astronomical),
        lagHours: Math.round(m.lagHours * 10) / 10,
      };
    });
}
