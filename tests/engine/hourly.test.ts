import { describe, expect, it } from 'vitest';
import { hourlyHeights, localHours } from '../../engine/almanac/hourly.js';
import { localDays } from '../../engine/localtime.js';
import { cosineCurve, predictorFor, tideEvents } from '../../engine/tides.js';
import type { ReferenceStation, SecondaryStation, Station } from '../../engine/types.js';
import { diurnalStation, standStation } from '../fixtures/engine-stations.js';
import { firstOf, itemAt } from '../../engine/index.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;

const inZone = (zone: string): ReferenceStation => ({ ...standStation(), timezone: zone });
const set = (...stations: Station[]) => ({ byId: new Map(stations.map((s) => [s.id, s] as [string, Station])) });

describe('hourly heights on the local hour', () => {
  it('Lisbon 2027: 24 hours a day, 23 on 28 March (no 01:00), 25 on 31 October (01:00 twice)', () => {
    const station = inZone('Europe/Lisbon');
    const days = localDays(2027, 'Europe/Lisbon');
    const year = hourlyHeights(station, set(station), days, []);
    expect(year.method).toBe('harmonic');
    const byDate = new Map(year.days.map((d) => [d.date, d]));
    const march = byDate.get('2027-03-28')!;
    const october = byDate.get('2027-10-31')!;
    expect(march.clocks).toHaveLength(23);
    expect(march.clocks).not.toContain('01:00');
    expect(march.clocks.slice(0, 3)).toEqual(['00:00', '02:00', '03:00']);
    expect(october.clocks).toHaveLength(25);
    expect(october.clocks.slice(0, 4)).toEqual(['00:00', '01:00', '01:00', '02:00']);
    expect(october.offsets.slice(0, 4)).toEqual(['+01:00', '+01:00', '+00:00', '+00:00']);
    expect(year.days.filter((d) => d.clocks.length === 24)).toHaveLength(363);
    expect(year.days.reduce((n, d) => n + d.heights.length, 0)).toBe(8760);
  });

  it('a half-hour shift (Lord Howe Island, 3 October 2027: 02:00 becomes 02:30) loses the hour 02:00', () => {
    const days = localDays(2027, 'Australia/Lord_Howe');
    const day = days.find((d) => d.date === '2027-10-03')!;
    expect(day.hours).toBe(23.5);
    const hours = localHours(day, 'Australia/Lord_Howe');
    expect(hours).toHaveLength(23);
    expect(hours.every((t) => (t - day.start) % (HOUR / 2) === 0)).toBe(true);
  });

  it('reference ports: the prediction at each instant (to the mm); secondary ports: the half-cosine curve', () => {
    const station = inZone('UTC');
    const days = localDays(2027, 'UTC').slice(0, 40);
    const year = hourlyHeights(station, set(station), days, []);
    const direct = predictorFor(station).heights(firstOf(days, 'days').start, HOUR, 40 * 24);
    expect(year.days.flatMap((d) => d.heights)).toEqual(Array.from(direct, (h) => Math.round(h * 1000) / 1000 + 0));

    const reference = diurnalStation();
    const secondary: SecondaryStation = {
      id: 'cove-invented', name: 'Cove (invented)', kind: 'secondary', reference: reference.id,
      position: reference.position, timezone: 'UTC', datum: 'Chart Datum', provenance: 'Invented',
      differences: {
        high_water: { springs: { time: 20, height: -0.1 }, neaps: { time: 10, height: 0 } },
        low_water: { springs: { time: 30, height: 0 }, neaps: { time: 25, height: 0.05 } },
      },
    };
    const both = set(reference, secondary);
    const events = tideEvents(secondary, both, firstOf(days, 'days').start - 3 * DAY, itemAt(days, 39, 'days').end + 3 * DAY);
    const curve = hourlyHeights(secondary, both, days, events);
    expect(curve.method).toBe('secondary-curve');
    const expected = cosineCurve(events, firstOf(days, 'days').start, HOUR, 40 * 24);
    expect(curve.days.flatMap((d) => d.heights)).toEqual(Array.from(expected, (h) => Math.round(h * 1000) / 1000 + 0));
  });
});
