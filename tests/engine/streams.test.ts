// Stream stations: the velocity kernel against direct cosines, events against the height engine and
// against brute force. The formula of the direct series is the convention as written in
// engine/streams/ellipse.ts (Pugh 1987 §4.3): in the frame of the major axis (f·major·cos θ,
// f·minor·sin θ), θ = V + u − g, rotated by the inclination; V, f, u from the engine's Schureman tables
// (checked on their own in nodal.test.ts against published values).
import { describe, expect, test } from 'vitest';
import { findExtrema } from '../../engine/extrema.js';
import { compileAstronomicalTerms } from '../../engine/nodal.js';
import { compilePredictor } from '../../engine/predict.js';
import {
  compileStreamPredictor, streamEvents, streamEventsFor, streamVelocities, type StreamEvent, type StreamStation,
} from '../../engine/streams.js';
import type { ReferenceStation } from '../../engine/types.js';
import { entryOf, firstOf, itemAt, lastOf } from '../../engine/index.js';

const DAY = 86_400_000;
const MINUTE = 60_000;
const DEG = Math.PI / 180;
const JAN = Date.UTC(2027, 0, 1);

// An invented station at sea, west of the invented coast.
const base = {
  id: 'test-narrows', name: 'Test Narrows (invented)', position: { latitude: 46.8, longitude: -13.4 },
  timezone: 'Atlantic/Azores', provenance: 'Invented for a test',
} as const;

const rotaryish: StreamStation = {
  ...base, kind: 'stream', flood_direction: 75, unit: 'kn', mean_current: { east: 0.05, north: -0.03 },
  constituents: {
    M2: { major: 2.1, minor: 0.15, inclination: 15, phase: 110 },
    S2: { major: 0.7, minor: 0.05, inclination: 14, phase: 150 },
    N2: { major: 0.4, minor: -0.02, inclination: 16, phase: 95 },
    K1: { major: 0.15, minor: 0.04, inclination: 30, phase: 200 },
    M4: { major: 0.12, minor: 0.01, inclination: 12, phase: 40 },
  },
};

/** Velocity (east, north) in knots from the formula, one cosine per constituent, V f u at the instant. */
function directVelocity(station: StreamStation, t: number): [number, number] {
  const names = Object.keys(station.constituents);
  const terms = compileAstronomicalTerms(names);
  const V = new Float64Array(names.length);
  const f = new Float64Array(names.length);
  const u = new Float64Array(names.length);
  terms.evaluate(t, V, f, u);
  const scale = station.unit === 'm/s' ? 3600 / 1852 : 1;
  let east = station.mean_current.east;
  let north = station.mean_current.north;
  names.forEach((name, k) => {
    const e = entryOf(station.constituents, name, 'constituents');
    const theta = (itemAt(V, k, 'V') + itemAt(u, k, 'u') - e.phase) * DEG;
    const x = itemAt(f, k, 'f') * e.major * Math.cos(theta);
    const y = itemAt(f, k, 'f') * e.minor * Math.sin(theta);
    const phi = e.inclination * DEG;
    east += x * Math.cos(phi) - y * Math.sin(phi);
    north += x * Math.sin(phi) + y * Math.cos(phi);
  });
  return [east * scale, north * scale];
}

describe('the velocity kernel', () => {
  test('matches direct cosines over a month at 1-minute steps to 1e-6 kn', () => {
    const count = 31 * 24 * 60;
    const { east, north } = streamVelocities(rotaryish, {}, JAN, MINUTE, count);
    let worst = 0;
    for (let i = 0; i < count; i++) {
      const [e, n] = directVelocity(rotaryish, JAN + i * MINUTE);
      worst = Math.max(worst, Math.abs(itemAt(east, i, 'east') - e), Math.abs(itemAt(north, i, 'north') - n));
    }
    expect(worst).toBeLessThan(1e-6);
  });

  test('m/s axes come out in knots (1 kn = 1852 m per hour)', () => {
    const inMetres: StreamStation = { ...rotaryish, unit: 'm/s' };
    const t = JAN + 5 * 3_600_000;
    const [e, n] = directVelocity(inMetres, t);
    const v = compileStreamPredictor(inMetres).velocityAt(t);
    expect(v.east).toBeCloseTo(e, 6);
    expect(v.north).toBeCloseTo(n, 6);
    const k = compileStreamPredictor(rotaryish).velocityAt(t);
    expect(v.speed / k.speed).toBeCloseTo(3600 / 1852, 9);
  });
});

describe('a to-and-fro stream is the height engine on its axis', () => {
  // minor 0, one inclination, mean current along the axis: the flood component is a height-like sum
  const inclination = 30; // counter-clockwise from east: 60° true
  const stream: StreamStation = {
    ...base, kind: 'stream', flood_direction: 60, unit: 'kn',
    mean_current: { east: 0.2 * Math.cos(inclination * DEG), north: 0.2 * Math.sin(inclination * DEG) },
    constituents: {
      M2: { major: 2.4, minor: 0, inclination, phase: 80 },
      S2: { major: 0.8, minor: 0, inclination, phase: 120 },
      K1: { major: 0.3, minor: 0, inclination, phase: 10 },
      M4: { major: 0.25, minor: 0, inclination, phase: 300 },
    },
  };
  const height: ReferenceStation = {
    ...base, id: 'axis', kind: 'reference', datum: 'none', mean_level: 0.2,
    constituents: Object.fromEntries(Object.entries(stream.constituents).map(([k, e]) => [k, { amplitude: e.major, phase: e.phase }])),
  };
  const from = JAN;
  const to = JAN + 31 * DAY;
  const events = streamEvents(compileStreamPredictor(stream), from, to);
  const extrema = findExtrema(compilePredictor(height), from, to);

  test('strongest flood and ebb are its high and low waters (within 1 s), rates their heights', () => {
    const maxima = events.filter((e) => e.type !== 'slack');
    expect(extrema.every((x) => (x.type === 'high' ? x.height > 0 : x.height < 0))).toBe(true);
    expect(maxima.length).toBe(extrema.length);
    maxima.forEach((m, i) => {
      const x = itemAt(extrema, i, 'extrema');
      expect(m.type).toBe(x.type === 'high' ? 'flood' : 'ebb');
      expect(Math.abs(m.time - x.time)).toBeLessThanOrEqual(1000);
      expect(m.speed).toBeCloseTo(Math.abs(x.height), 6);
      expect(m.direction).toBeCloseTo(m.type === 'flood' ? 60 : 240, 6);
    });
  });

  test('slacks are its zero crossings (within 1 s)', () => {
    const predictor = compilePredictor(height);
    const slacks = events.filter((e) => e.type === 'slack');
    // zero crossings of the height curve between each high and the next low, by plain bisection to 1 ms
    const crossings: number[] = [];
    for (let i = 0; i + 1 < extrema.length; i++) {
      let lo = itemAt(extrema, i, 'extrema').time;
      let hi = itemAt(extrema, i + 1, 'extrema').time;
      const sLo = Math.sign(predictor.heightAt(lo));
      while (hi - lo > 1) {
        const mid = (lo + hi) / 2;
        if (Math.sign(predictor.heightAt(mid)) === sLo) lo = mid;
        else hi = mid;
      }
      crossings.push(lo);
    }
    const inside = slacks.filter((s) => s.time > firstOf(extrema, 'extrema').time && s.time < lastOf(extrema, 'extrema').time);
    expect(inside.length).toBe(crossings.length);
    inside.forEach((s, i) => {
      expect(Math.abs(s.time - itemAt(crossings, i, 'crossings'))).toBeLessThanOrEqual(1000);
      expect(s.speed).toBeLessThan(1e-4);
      expect(s.direction).toBeNull();
    });
  });
});

/** Sign changes of the flood component at 1-second steps: the brute-force slacks. */
function bruteSlacks(station: StreamStation, from: number, to: number): number[] {
  const count = Math.round((to - from) / 1000);
  const { east, north } = streamVelocities(station, {}, from, 1000, count);
  const fx = Math.sin(station.flood_direction * DEG);
  const fy = Math.cos(station.flood_direction * DEG);
  const out: number[] = [];
  let previous = firstOf(east, 'east') * fx + firstOf(north, 'north') * fy;
  for (let i = 1; i < count; i++) {
    const s = itemAt(east, i, 'east') * fx + itemAt(north, i, 'north') * fy;
    if (previous >= 0 !== s >= 0) out.push(from + i * 1000 - 500);
    previous = s;
  }
  return out;
}

describe('slack water against 1-second brute force over a month', () => {
  test('every slack of a near to-and-fro stream within 30 s of a sign change of its flood component', () => {
    const from = JAN;
    const to = JAN + 31 * DAY;
    const slacks = streamEvents(compileStreamPredictor(rotaryish), from, to).filter((e) => e.type === 'slack');
    const brute = bruteSlacks(rotaryish, from, to);
    expect(slacks.length).toBeGreaterThan(110);
    for (const s of slacks) {
      const nearest = brute.reduce((best, t) => Math.min(best, Math.abs(t - s.time)), Infinity);
      expect(nearest).toBeLessThanOrEqual(30_000);
    }
    // and no sign change is left without its slack (none in this stream turns back within a minute)
    expect(brute.filter((t) => t > firstOf(slacks, 'slacks').time - 60_000 && t < lastOf(slacks, 'slacks').time + 60_000).length).toBe(slacks.length);
  });

  test('a rotary stream: slack is the least speed between the maxima, with that speed', () => {
    const rotary: StreamStation = {
      ...rotaryish,
      constituents: {
        M2: { major: 1.6, minor: 0.9, inclination: 20, phase: 110 },
        S2: { major: 0.5, minor: 0.3, inclination: 20, phase: 150 },
      },
    };
    const from = JAN;
    const to = JAN + 7 * DAY;
    const events = streamEvents(compileStreamPredictor(rotary), from, to);
    const count = Math.round((to - from) / 1000);
    const { east, north } = streamVelocities(rotary, {}, from, 1000, count);
    const speedAt = (t: number) => {
      const i = Math.round((t - from) / 1000);
      return Math.hypot(itemAt(east, i, 'east'), itemAt(north, i, 'north'));
    };
    let checked = 0;
    events.forEach((e, k) => {
      if (e.type !== 'slack' || k === 0 || k === events.length - 1) return;
      const a = itemAt(events, k - 1, 'events').time;
      const b = itemAt(events, k + 1, 'events').time;
      let best = a;
      for (let t = a; t <= b; t += 1000) if (speedAt(t) < speedAt(best)) best = t;
      expect(Math.abs(best - e.time)).toBeLessThanOrEqual(30_000);
      expect(e.speed).toBeCloseTo(speedAt(best), 3);
      expect(e.speed).toBeGreaterThan(0.3);
      expect(e.direction).not.toBeNull();
      checked++;
    });
    expect(checked).toBeGreaterThan(20);
  });
});

describe('the same events whatever span asks for them', () => {
  test('a week asked alone and inside a quarter gives the same instants and speeds', () => {
    const p = compileStreamPredictor(rotaryish);
    const week = streamEvents(p, JAN + 40 * DAY, JAN + 47 * DAY);
    const quarter = streamEvents(compileStreamPredictor(rotaryish), JAN, JAN + 90 * DAY)
      .filter((e) => e.time >= JAN + 40 * DAY && e.time < JAN + 47 * DAY);
    expect(week.length).toBeGreaterThan(40);
    expect(week).toEqual(quarter);
  });
});

describe('stream-secondary stations', () => {
  const secondary = {
    ...base, id: 'test-secondary', kind: 'stream-secondary' as const, reference: 'test-narrows', flood_direction: 90,
    differences: {
      slack_to_flood: { time: 20 }, flood: { time: 15, rate: 0.8 }, slack_to_ebb: { time: -10 }, ebb: { time: 5, rate: 0.6 },
    },
  };
  const set = { streams: [rotaryish, secondary] };

  test('events are the reference events shifted and scaled, flood and ebb separately', () => {
    const from = JAN + 2 * DAY;
    const to = JAN + 4 * DAY;
    const ref = streamEventsFor(rotaryish, set, from - DAY, to + DAY);
    const sec = streamEventsFor(secondary, set, from, to);
    expect(sec.length).toBeGreaterThan(10);
    for (const e of sec) {
      const shifts = { flood: 15, ebb: 5 } as Record<string, number>;
      const match = ref.find((r) => r.type === e.type && (e.type === 'slack'
        ? [20, -10].some((m) => r.time + m * MINUTE === e.time)
        : r.time + entryOf(shifts, e.type, 'shifts') * MINUTE === e.time));
      expect(match, `${e.type} at ${new Date(e.time).toISOString()}`).toBeDefined();
      if (e.type === 'flood') {
        expect(e.speed).toBeCloseTo(match!.speed * 0.8, 12);
        expect(e.direction).toBe(90);
      }
      if (e.type === 'ebb') {
        expect(e.speed).toBeCloseTo(match!.speed * 0.6, 12);
        expect(e.direction).toBe(270);
      }
    }
  });

  test('the slack before a flood takes slack_to_flood, before an ebb slack_to_ebb', () => {
    const sec: StreamEvent[] = streamEventsFor(secondary, set, JAN + DAY, JAN + 3 * DAY);
    const ref = streamEventsFor(rotaryish, set, JAN, JAN + 4 * DAY);
    sec.forEach((e, i) => {
      if (e.type !== 'slack' || i + 1 >= sec.length) return;
      const next = itemAt(sec, i + 1, 'sec');
      const shift = next.type === 'flood' ? 20 : -10;
      expect(ref.some((r) => r.type === 'slack' && r.time + shift * MINUTE === e.time)).toBe(true);
    });
  });

  test('its velocity curve passes through its events', () => {
    const sec = streamEventsFor(secondary, set, JAN + DAY, JAN + 2 * DAY);
    const flood = sec.find((e) => e.type === 'flood')!;
    const { east, north } = streamVelocities(secondary, set, flood.time, MINUTE, 1);
    expect(Math.hypot(firstOf(east, 'east'), firstOf(north, 'north'))).toBeCloseTo(flood.speed, 9);
    expect(firstOf(east, 'east')).toBeCloseTo(flood.speed, 9); // the flood sets toward 90°: due east
  });
});
