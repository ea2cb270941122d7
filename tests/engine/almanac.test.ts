import { describe, expect, it } from 'vitest';
import { buildStationYear } from '../../engine/almanac.js';
import { constituentSpeed } from '../../engine/constituents.js';
import { findExtrema } from '../../engine/extrema.js';
import { dayIndexOf, isoUtc, localDays } from '../../engine/localtime.js';
import { loadStationSet } from '../../engine/stations.js';
import { predictorFor } from '../../engine/tides.js';
import type { ReferenceStation, Station, StationYear } from '../../engine/types.js';
import { firstOf, lastOf } from '../../engine/index.js';
import { neighbours } from '../fixtures/lists.js';

const HOUR = 3_600_000;
const single = (s: Station) => ({ byId: new Map([[s.id, s]]) });

const base: ReferenceStation = {
  id: 'clock-quay', name: 'Clock Quay', kind: 'reference',
  position: { latitude: 47.2, longitude: -15.9 }, timezone: 'Europe/Lisbon', datum: 'Chart Datum',
  mean_level: 3.1,
  constituents: {
    M2: { amplitude: 1.5, phase: 140 }, S2: { amplitude: 0.5, phase: 185 },
    K1: { amplitude: 0.08, phase: 100 }, O1: { amplitude: 0.07, phase: 330 },
  },
  provenance: 'Made up for a test (invented)',
};

// The same station with every phase lag moved so that its high water nearest `target` falls on it:
// a wave of speed σ (°/h) delayed by Δt hours has its phase lag increased by σ·Δt.
function tunedTo(target: number, id: string): ReferenceStation {
  const events = findExtrema(predictorFor(base), target - 13 * HOUR, target + 13 * HOUR).filter((e) => e.type === 'high');
  const nearest = events.reduce((a, b) => (Math.abs(b.time - target) < Math.abs(a.time - target) ? b : a));
  const dt = (target - nearest.time) / HOUR;
  const constituents: ReferenceStation['constituents'] = {};
  for (const [name, c] of Object.entries(base.constituents)) {
    constituents[name] = { amplitude: c.amplitude, phase: (((c.phase + constituentSpeed(name) * dt) % 360) + 360) % 360 };
  }
  return { ...base, id, constituents };
}

function dayOf(model: StationYear, date: string) {
  const d = model.days.find((x) => x.date === date);
  if (!d) throw new Error(`no day ${date}`);
  return d;
}

describe('daylight saving in the model', () => {
  // EU rule (Directive 2000/84/EC): summer time from the last Sunday of March to the last Sunday of
  // October, changing at 01:00 UTC — in 2027 on 28 March (a 23-hour day) and 31 October (25 hours,
  // local 01:00–02:00 twice: first at +01:00, i.e. 00:00–01:00 UTC, then at +00:00, 01:00–02:00 UTC).
  const first = tunedTo(Date.UTC(2027, 9, 31, 0, 30), 'first-pass');
  const second = tunedTo(Date.UTC(2027, 9, 31, 1, 30), 'second-pass');
  const a = buildStationYear(first, single(first), 2027);
  const b = buildStationYear(second, single(second), 2027);

  it('has a 23-hour and a 25-hour day with their curves', () => {
    const spring = dayOf(a, '2027-03-28');
    const autumn = dayOf(a, '2027-10-31');
    expect(spring.hours).toBe(23);
    expect(autumn.hours).toBe(25);
    expect(a.curveStepMinutes).toBe(30);
    expect(spring.curve.length).toBe(23 * 2 + 1);
    expect(autumn.curve.length).toBe(25 * 2 + 1);
    expect(dayOf(a, '2027-06-01').curve.length).toBe(49);
    expect(spring.offsetChange).toMatchObject({ from: '+00:00', to: '+01:00', time: '2027-03-28T01:00:00Z' });
    expect(autumn.offsetChange).toMatchObject({ from: '+01:00', to: '+00:00', time: '2027-10-31T01:00:00Z' });
    expect(a.offsetChanges.length).toBe(2);
    expect(a.days.length).toBe(365);
  });

  it('shows an event in the repeated hour once, with the offset in force', () => {
    const inA = a.events.filter((e) => e.local.startsWith('2027-10-31T01:'));
    const inB = b.events.filter((e) => e.local.startsWith('2027-10-31T01:'));
    expect(inA.length).toBe(1);
    expect(firstOf(inA, 'inA').offset).toBe('+01:00');
    expect(firstOf(inA, 'inA').local).toMatch(/^2027-10-31T01:3\d:\d\d\+01:00$/);
    expect(firstOf(inA, 'inA').time).toMatch(/^2027-10-31T00:3/);
    expect(inB.length).toBe(1);
    expect(firstOf(inB, 'inB').offset).toBe('+00:00');
    expect(firstOf(inB, 'inB').local).toMatch(/^2027-10-31T01:3\d:\d\d\+00:00$/);
    expect(firstOf(inB, 'inB').time).toMatch(/^2027-10-31T01:3/);
    // Same wall clock, different instants, each once on the day.
    expect(firstOf(inA, 'inA').clock.slice(0, 3)).toBe(firstOf(inB, 'inB').clock.slice(0, 3));
    expect(dayOf(a, '2027-10-31').events.filter((e) => e.time === firstOf(inA, 'inA').time).length).toBe(1);
    expect(dayOf(b, '2027-10-31').events.filter((e) => e.time === firstOf(inB, 'inB').time).length).toBe(1);
  });

  it('loses and duplicates no event: the model equals the extrema over the local year', () => {
    for (const [st, model] of [[first, a], [second, b]] as const) {
      const days = localDays(2027, st.timezone);
      const expected = findExtrema(predictorFor(st), firstOf(days, 'days').start - HOUR, lastOf(days, 'days').end + HOUR)
        .filter((e) => dayIndexOf(days, e.time) >= 0);
      expect(model.events.map((e) => e.time)).toEqual(expected.map((e) => isoUtc(e.time)));
      expect(model.days.flatMap((d) => d.events)).toEqual(model.events);
    }
  });

  it('handles a southern-hemisphere zone (Pacific/Auckland) as well', () => {
    // New Zealand daylight time, tz database via luxon (rule from memory: ends the first Sunday of
    // April, starts the last Sunday of September): 2027-04-04 has 25 hours, 2027-09-26 has 23.
    const nz = { ...base, id: 'nz-quay', timezone: 'Pacific/Auckland', position: { latitude: -39.6, longitude: 165.8 } };
    const m = buildStationYear(nz, single(nz), 2027);
    expect(dayOf(m, '2027-04-04').hours).toBe(25);
    expect(dayOf(m, '2027-04-04').curve.length).toBe(51);
    expect(dayOf(m, '2027-09-26').hours).toBe(23);
    expect(dayOf(m, '2027-09-26').curve.length).toBe(47);
    expect(m.days.filter((d) => d.hours !== 24).length).toBe(2);
    expect(m.days.flatMap((d) => d.events)).toEqual(m.events);
  });
});

describe('model content', () => {
  it('fills the station facts, caution, generator and flags', () => {
    const m = buildStationYear(base, single(base), 2027);
    expect(m.invented).toBe(true); // "invented" in the provenance
    expect(buildStationYear({ ...base, provenance: 'Harbour survey 2019' }, single(base), 2027).invented).toBe(false);
    expect('caution' in m).toBe(false); // the caution is the renderers' words, in the reader's language
    expect(m.generator.name).toBe('tidewright');
    expect(m.generator.version).toMatch(/^\d+\.\d+\.\d+/);
    expect(m.reference).toBeNull();
    expect(m.year).toBe(2027);
    expect(m.timezone).toBe('Europe/Lisbon');
    expect(m.months.map((x) => x.dayCount)).toEqual([31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]);
    expect(m.extremes.highest.type).toBe('high');
    expect(m.extremes.lowest.type).toBe('low');
    expect(Math.max(...m.events.map((e) => e.height))).toBe(m.extremes.highest.height);
    expect(m.moonPhases.length).toBeGreaterThanOrEqual(48);
    for (const q of m.moonPhases) expect(dayOf(m, q.date).moonPhase).toBe(q.phase);
    for (const s of m.springNeap) expect(dayOf(m, s.date).springNeap).toBe(s.kind);
  });

  it('rejects a curve step that does not divide the hour', () => {
    expect(() => buildStationYear(base, single(base), 2027, { curveStepMinutes: 7 })).toThrow(/divide/);
    const m = buildStationYear(base, single(base), 2027, { curveStepMinutes: 20 });
    expect(dayOf(m, '2027-03-28').curve.length).toBe(23 * 3 + 1);
  });
});

describe('every demo station', () => {
  const set = loadStationSet('stations-demo');
  for (const station of set.stations) {
    it(`${station.id}: builds, is plain JSON, and is sane`, () => {
      const model = buildStationYear(station, set, 2027);
      const text = JSON.stringify(model);
      expect(JSON.parse(text)).toEqual(model);
      expect(text).not.toMatch(/NaN|Infinity/);
      assertPlainFinite(model, 'model');
      expect(model.invented).toBe(true);
      expect(model.days.length).toBe(365);
      expect(model.days.flatMap((d) => d.events)).toEqual(model.events);
      for (const d of model.days) {
        expect(d.curve.length).toBe(d.hours * 2 + 1);
        expect(d.range === null || d.range > 0).toBe(true);
      }
      for (const [a, b] of neighbours(model.events)) expect(b.time > a.time).toBe(true);
      const { datums: d } = model;
      expect(d.LAT).toBeLessThanOrEqual(d.MLWS);
      expect(d.HAT).toBeGreaterThanOrEqual(d.MHWS);
      expect(model.springNeap.length).toBeGreaterThanOrEqual(40);
      expect(model.station.sourceFile).toBe(`${station.id}.yaml`);
      if (station.kind === 'secondary') expect(model.reference?.id).toBe(station.reference);
    });
  }
});

// Only plain objects, arrays, strings, booleans, null and finite numbers: what JSON keeps as is.
function assertPlainFinite(value: unknown, path: string): void {
  if (value === null || typeof value === 'string' || typeof value === 'boolean') return;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`${path} is ${value}`);
    return;
  }
  if (Array.isArray(value)) {
    value.forEach((v, i) => assertPlainFinite(v, `${path}[${i}]`));
    return;
  }
  if (typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
    for (const [k, v] of Object.entries(value)) {
      if (v === undefined) throw new Error(`${path}.${k} is undefined`);
      assertPlainFinite(v, `${path}.${k}`);
    }
    return;
  }
  throw new Error(`${path} is not plain data (${Object.prototype.toString.call(value)})`);
}
