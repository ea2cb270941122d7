// The offset tables and the plain formatting must answer exactly what luxon answers (luxon reading
// the IANA database through Intl is the reference), so that the almanac stays byte-identical.
import { DateTime, IANAZone } from 'luxon';
import { describe, expect, it } from 'vitest';
import { clock, isoLocal, localDate, offsetString } from '../../engine/localtime.js';
import { zoneOffset } from '../../engine/zone-offsets.js';

// Half-hour shifts (Lord_Howe), half-hour offsets (Kolkata, Adelaide), quarter hours (Chatham,
// Kathmandu), changes at local midnight (Havana, Santiago, Beirut), southern and northern daylight
// saving, and a zone that changed its standard offset (Pyongyang, May 2018).
const ZONES = [
  'Australia/Lord_Howe', 'Asia/Kolkata', 'Australia/Adelaide', 'Pacific/Chatham', 'Asia/Kathmandu',
  'America/Havana', 'America/Santiago', 'Asia/Beirut', 'Europe/Lisbon', 'Pacific/Auckland',
  'America/St_Johns', 'Asia/Pyongyang', 'UTC',
];

// Every transition of a year in the zone, found by luxon alone (hourly scan, then to the millisecond).
function luxonTransitions(zone: IANAZone, year: number): number[] {
  const out: number[] = [];
  const end = Date.UTC(year + 1, 0, 1);
  let prev = zone.offset(Date.UTC(year, 0, 1));
  for (let t = Date.UTC(year, 0, 1); t < end; t += 3_600_000) {
    const next = zone.offset(t + 3_600_000);
    if (next === prev) continue;
    prev = next;
    let lo = t;
    let hi = t + 3_600_000;
    while (hi - lo > 1) {
      const mid = Math.floor((lo + hi) / 2);
      if (zone.offset(mid) === zone.offset(lo)) lo = mid;
      else hi = mid;
    }
    out.push(hi);
  }
  return out;
}

describe('zone offset tables', () => {
  it('agree with luxon at and around every transition, and at odd instants, in many zones', () => {
    // The scan does find transitions: Lord Howe shifts by half an hour in April and October.
    expect(luxonTransitions(IANAZone.create('Australia/Lord_Howe'), 2027)).toHaveLength(2);
    for (const name of ZONES) {
      const zone = IANAZone.create(name);
      for (const year of [2018, 2027]) {
        const instants: number[] = [];
        for (const t of luxonTransitions(zone, year)) {
          for (const d of [-60_001, -1001, -1, 0, 1, 999, 30_000, 60_000]) instants.push(t + d);
        }
        for (let t = Date.UTC(year, 0, 1) - 7; t < Date.UTC(year + 1, 0, 2); t += 77_777_777) instants.push(t);
        for (const t of instants) {
          expect(zoneOffset(zone, t), `${name} ${t}`).toBe(zone.offset(t));
          const dt = DateTime.fromMillis(Math.round(t / 60_000) * 60_000, { zone });
          expect(clock(t, name)).toBe(dt.toFormat('HH:mm'));
          expect(localDate(t, name)).toBe(dt.toFormat('yyyy-MM-dd'));
          const s = Math.round(t / 1000) * 1000;
          expect(isoLocal(t, name)).toBe(DateTime.fromMillis(s, { zone }).toFormat("yyyy-MM-dd'T'HH:mm:ssZZ"));
          expect(offsetString(t, name)).toBe(DateTime.fromMillis(t, { zone }).toFormat('ZZ'));
        }
      }
    }
  });

  it('fall back to luxon far outside the tables', () => {
    const zone = IANAZone.create('Europe/Lisbon');
    const t = Date.UTC(1850, 5, 1, 12);
    expect(zoneOffset(zone, t)).toBe(zone.offset(t)); // local mean time, a fraction of a minute
    expect(clock(t, 'Europe/Lisbon')).toBe(DateTime.fromMillis(t, { zone }).toFormat('HH:mm'));
  });
});
