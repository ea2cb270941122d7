// A zone's UTC offsets as a small table of transitions per UTC month, so the formatting of
// thousands of instants needs no Intl call each (luxon asks Intl for every offset: slow).
// The table is read off luxon itself: its offset sampled every hour of the year, and wherever two
// neighbouring samples differ, the first millisecond of the new offset found by bisection. So a
// lookup answers exactly what luxon answers, for every instant of the years the table covers.

import type { IANAZone } from 'luxon';
import { itemAt } from './item.js';

const HOUR = 3_600_000;
// Years outside this span go straight to luxon (no table is built for them).
const FIRST_YEAR = 1900;
const LAST_YEAR = 2200;
const MAX_TABLES = 512; // a few zones × a year and a bit of months; cleared whole when full

interface OffsetTable {
  from: number; // UTC ms, first instant covered
  to: number; // UTC ms, exclusive
  starts: number[]; // first instant of each offset; starts[0] === from
  offsets: number[]; // offset in minutes from starts[i] to starts[i + 1]
}

// Module scope on purpose, unlike the station caches of EngineContext: the tables depend on no station
// (only on the tz database luxon reads), are bounded by MAX_TABLES and are cleared whole.
const tables = new Map<string, OffsetTable>();
const lastUsed = new Map<string, OffsetTable>(); // per zone name, the table used last

/** The zone's UTC offset in minutes at an instant, exactly as luxon's `zone.offset(ms)` gives it. */
export function zoneOffset(zone: IANAZone, ms: number): number {
  let table = lastUsed.get(zone.name);
  if (table === undefined || !(ms >= table.from && ms < table.to)) {
    if (!Number.isFinite(ms)) return zone.offset(ms);
    const date = new Date(ms);
    const year = date.getUTCFullYear();
    if (year < FIRST_YEAR || year > LAST_YEAR) return zone.offset(ms);
    table = tableFor(zone, year, date.getUTCMonth());
    lastUsed.set(zone.name, table);
  }
  const { starts, offsets } = table;
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (itemAt(starts, mid, 'offset starts') <= ms) lo = mid;
    else hi = mid - 1;
  }
  return itemAt(offsets, lo, 'offsets');
}

function tableFor(zone: IANAZone, year: number, month: number): OffsetTable {
  const key = `${zone.name}|${year}|${month}`;
  let table = tables.get(key);
  if (table === undefined) {
    if (tables.size >= MAX_TABLES) {
      tables.clear();
      lastUsed.clear();
    }
    table = buildTable(zone, Date.UTC(year, month, 1), Date.UTC(year, month + 1, 1));
    tables.set(key, table);
  }
  return table;
}

// Hourly samples: no zone changes its offset twice within an hour.
function buildTable(zone: IANAZone, from: number, to: number): OffsetTable {
  let prev = zone.offset(from);
  const starts = [from];
  const offsets = [prev];
  let prevT = from;
  for (let t = from + HOUR; t < to + HOUR; t += HOUR) {
    const at = Math.min(t, to - 1);
    const offset = zone.offset(at);
    if (offset !== prev) {
      starts.push(firstOfNewOffset(zone, prevT, at, prev));
      offsets.push(offset);
      prev = offset;
    }
    prevT = at;
  }
  return { from, to, starts, offsets };
}

// Smallest instant in (lo, hi] whose offset differs from `before` (the offset at lo).
function firstOfNewOffset(zone: IANAZone, lo: number, hi: number, before: number): number {
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (zone.offset(mid) === before) lo = mid;
    else hi = mid;
  }
  return hi;
}
