// The StreamYear model of a stream station: the same shape as a tide station's year, its events those
// of the stream engine (tested in streams.test.ts), springs and neaps from the tide reference or from the
// stream's own rates. Moon quarters come from the engine's sky module (tested against astronomy-engine).
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { buildStationYear } from '../../engine/almanac.js';
import { loadStationSet, type StationSet } from '../../engine/stations.js';
import { buildStreamYear, streamAlmanacEvent, streamEventsFor, type StreamStation, type StreamYear } from '../../engine/streams.js';
import { firstOf } from '../../engine/index.js';

const DEMO = join(import.meta.dirname, '..', '..', 'stations-demo');
let set: StationSet;
let narrows: StreamStation;
let model: StreamYear;

beforeAll(() => {
  set = loadStationSet(DEMO);
  narrows = set.streams!.find((s) => s.id === 'wrackrun-narrows') as StreamStation;
  model = buildStreamYear(narrows, set, 2027);
}, 60_000);

describe('buildStreamYear', () => {
  test('every local day of the year, each event on the day of its printed minute', () => {
    expect(model.days).toHaveLength(365);
    expect(model.months).toHaveLength(12);
    const all = model.days.flatMap((d) => d.events);
    expect(all).toEqual(model.events);
    for (const day of model.days) for (const e of day.events) expect(e.date).toBe(day.date);
    const raw = streamEventsFor(narrows, set, Date.parse('2026-12-30T00:00:00Z'), Date.parse('2027-01-03T00:00:00Z'));
    const first = raw.find((e) => e.time >= Date.parse('2027-01-01T00:00:00Z'))!;
    expect(firstOf(model.events, 'events').time).toBe(new Date(Math.round(first.time / 1000) * 1000).toISOString().replace('.000Z', 'Z'));
    expect(firstOf(model.events, 'events').speed).toBe(Math.round(first.speed * 100) / 100);
  });

  test('each day holds its strongest flood and ebb, and a curve from midnight to midnight', () => {
    for (const day of model.days) {
      const floods = day.events.filter((e) => e.type === 'flood').map((e) => e.speed);
      expect(day.strongestFlood).toBe(floods.length ? Math.max(...floods) : null);
      expect(day.curve).toHaveLength(day.hours * 2 + 1);
    }
    const floodRates = model.events.filter((e) => e.type === 'flood').map((e) => e.speed);
    expect(model.extremes.strongestFlood!.speed).toBe(Math.max(...floodRates));
    // a flood sets near 070°, where the curve is positive
    for (const e of model.events.filter((x) => x.type === 'flood')) expect(Math.abs(e.direction! - 70)).toBeLessThan(10);
  });

  test('springs and neaps from the tide reference are the tide station\'s own', () => {
    expect(model.springNeapFrom).toBe('tide-reference');
    const tide = buildStationYear(set.byId.get('brinewold-head')!, set, 2027);
    expect(model.springNeap.map((s) => [s.date, s.kind])).toEqual(tide.springNeap.map((s) => [s.date, s.kind]));
    expect(model.days.filter((d) => d.springNeap !== null)).toHaveLength(model.springNeap.length);
  }, 60_000);

  test('without a tide reference, springs and neaps follow the stream\'s own rates', () => {
    const own = { ...narrows } as StreamStation;
    delete own.tide_reference;
    const alone = buildStreamYear(own, { streams: [own] }, 2027);
    expect(alone.springNeapFrom).toBe('stream');
    expect(alone.tideReference).toBeNull();
    expect(alone.springNeap.length).toBeGreaterThanOrEqual(48);
    for (const s of alone.springNeap) {
      expect(Math.abs(s.lagHours)).toBeLessThan(4 * 24);
      const day = alone.days.find((d) => d.date === s.date)!;
      expect(day.springNeap).toBe(s.kind);
    }
    // springs run faster than the neaps beside them
    const springs = alone.springNeap.filter((s) => s.kind === 'spring').map((s) => s.range);
    const neaps = alone.springNeap.filter((s) => s.kind === 'neap').map((s) => s.range);
    expect(Math.min(...springs)).toBeGreaterThan(Math.max(...neaps));
  }, 60_000);

  test('plain JSON, cautions and the invented mark', () => {
    expect(JSON.parse(JSON.stringify(model))).toEqual(model);
    expect(model.invented).toBe(true);
    // facts only: the cautions are the renderers' words (the catalogue's caution.full and caution.streams)
    expect(model).not.toHaveProperty('caution');
    expect(model).not.toHaveProperty('streamCaution');
    expect(model.station.sourceFile).toBe('wrackrun-narrows.yaml');
    expect(model.moonPhases.length).toBeGreaterThanOrEqual(48);
  });

  test('an event at 23:59:40 prints 00:00 and is dated the next day, as a tide event is', () => {
    // 2027-05-14 23:59:40 in Lisbon (summer time, UTC+01:00) is 22:59:40 UTC
    const late = streamAlmanacEvent({ time: Date.parse('2027-05-14T22:59:40Z'), type: 'flood', speed: 2.5, direction: 70 }, 'Europe/Lisbon');
    expect(late.local).toBe('2027-05-14T23:59:40+01:00');
    expect(late.clock).toBe('00:00');
    expect(late.date).toBe('2027-05-15');
    expect(late.offset).toBe('+01:00');
    // and the year's events sit on the day their date names
    const onDay = new Map(model.days.flatMap((d) => d.events.map((e) => [e.time, d.date] as const)));
    for (const e of model.events) expect(onDay.get(e.time)).toBe(e.date);
  });

  test('stream days carry the same calendar, clock and sky fields as tide days (one day builder)', () => {
    const tide = buildStationYear(set.byId.get('brinewold-head')!, set, 2027);
    const shared = (d: object) => Object.keys(d).filter((k) => !['events', 'curve', 'springNeap', 'range', 'strongestFlood', 'strongestEbb'].includes(k)).sort();
    expect(shared(firstOf(model.days, 'days'))).toEqual(shared(firstOf(tide.days, 'days')));
    const day = model.days.find((d) => d.date === '2027-03-28')!;
    expect(day.start).toBe('2027-03-28T00:00:00Z');
    expect(day.end).toBe('2027-03-28T23:00:00Z');
    expect(day.sky.length).toBeGreaterThanOrEqual(3);
    expect(day.sky.find((e) => e.body === 'sun' && e.type === 'rise')!.time).toBe(day.sunrise);
  }, 60_000);
});
