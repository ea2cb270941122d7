import { describe, expect, it } from 'vitest';
import { splitByDay } from '../../engine/almanac/windows.js';
import { localDays } from '../../engine/localtime.js';
import { loadStationSet } from '../../engine/stations.js';
import { cosineCurve, predictorFor, tideEvents } from '../../engine/tides.js';
import type { ReferenceStation, Station } from '../../engine/types.js';
import { findExtrema, scanTides } from '../../engine/extrema.js';
import { openIntervals, type OpenInterval, type WindowSide } from '../../engine/windows.js';
import { diurnalStation, sixtyConstituentStation, standStation } from '../fixtures/engine-stations.js';
import { firstOf, itemAt, lastOf } from '../../engine/index.js';

const SECOND = 1000;
const HOUR = 3_600_000;
const DAY = 86_400_000;
const DEG = Math.PI / 180;

function referenceStation(id: string, meanLevel: number, constituents: ReferenceStation['constituents']): ReferenceStation {
  return {
    id, name: `${id} (invented)`, kind: 'reference', position: { latitude: 47, longitude: -17 }, timezone: 'UTC',
    datum: 'Chart Datum', mean_level: meanLevel, constituents, provenance: 'Invented for the window tests',
  };
}

const solo = (station: Station) => ({ byId: new Map<string, Station>([[station.id, station]]) });

/** The instants where the intervals open or close, in order (ends of the span excluded). */
function crossingsOf(intervals: readonly OpenInterval[], from: number, to: number): number[] {
  return intervals.flatMap((w) => [w.start, w.end]).filter((t) => t > from && t < to);
}

describe('closed form: two solar constituents', () => {
  // Worked example. S2 and S4 carry no node factor (f = 1, u = 0) and their equilibrium arguments are
  // V = 2T and 4T, T the hour angle of the mean sun plus 180° (Schureman 1958), so with t in hours
  // since 00:00 UTC, V_S2 = 30°·t and V_S4 = 60°·t exactly. A pure S2 tide h = Z0 + H cos(30t − g) meets
  // a level L where cos(30t − g) = (L − Z0)/H. Add S4 with phase lag 2g: with x = 30t − g,
  //   h = Z0 + A cos x + B cos 2x = Z0 + A c + B(2c² − 1),  c = cos x,
  // so h = L is the quadratic 2B c² + A c − (B + L − Z0) = 0, c = (−A ± √(A² + 8B(B + L − Z0)))/(4B).
  // With A > 4B, dh/dx = −sin x (A + 4B cos x) keeps its sign on each half turn, so each root c in
  // [−1, 1] gives one crossing per half turn: x = ±acos c + 360°k, t = (x + g)/30.
  // Numbers: Z0 = 2.0, A = 1.5, B = 0.3, g = 40°, L = 2.6: c = (−1.5 + √(2.25 + 2.4·0.9))/1.2
  // = (−1.5 + 2.1)/1.2 = 0.5, x = ±60°, so the tide rises through 2.6 m at t = (−60 + 40)/30 h = −40 min
  // (23:20 UTC) and falls through it at t = (60 + 40)/30 h = 3 h 20 min (03:20 UTC), every 12 hours.
  const Z0 = 2.0;
  const A = 1.5;
  const B = 0.3;
  const g = 40;

  function expectedCrossings(level: number, from: number, to: number, withS4: boolean): number[] {
    const cs = withS4
      ? [1, -1].map((sign) => (-A + sign * Math.sqrt(A * A + 8 * B * (B + level - Z0))) / (4 * B))
      : [(level - Z0) / A];
    const out: number[] = [];
    for (const c of cs.filter((c) => c >= -1 && c <= 1)) {
      const x = Math.acos(c) / DEG;
      for (let k = -2; k < (to - from) / (12 * HOUR) + 2; k++) {
        for (const xx of [x, -x]) {
          const t = Math.floor(from / DAY) * DAY + ((xx + 360 * k + g) / 30) * HOUR; // from 00:00 UTC of the first day
          if (t > from && t < to) out.push(t);
        }
      }
    }
    return out.sort((a, b) => a - b);
  }

  it('the worked example: rises through 2.6 m at 23:20 and falls through it at 03:20 UTC', () => {
    const station = referenceStation('solar-invented', Z0, { S2: { amplitude: A, phase: g }, S4: { amplitude: B, phase: 2 * g } });
    const from = Date.UTC(2027, 0, 1);
    const open = openIntervals(station, solo(station), 'above', 2.6, from, from + DAY);
    // crossings are solved to within 10 ms: compared to the nearest second
    const second = (t: number) => new Date(Math.round(t / 1000) * 1000).toISOString().slice(11, 19);
    expect(open.flatMap((w) => [second(w.start), second(w.end)]))
      .toEqual(['00:00:00', '03:20:00', '11:20:00', '15:20:00', '23:20:00', '00:00:00']);
  });

  for (const [label, withS4] of [['S2 alone', false], ['S2 + S4', true]] as const) {
    it(`${label}: every crossing of four levels over 30 days within 0.1 s of the closed form`, () => {
      const constituents: ReferenceStation['constituents'] = { S2: { amplitude: A, phase: g } };
      if (withS4) constituents.S4 = { amplitude: B, phase: 2 * g };
      const station = referenceStation('solar-invented', Z0, constituents);
      const from = Date.UTC(2027, 5, 1, 5, 17);
      const to = from + 30 * DAY;
      for (const level of [0.9, 1.7, 2.6, 3.4]) {
        for (const side of ['above', 'below'] as const) {
          const found = crossingsOf(openIntervals(station, solo(station), side, level, from, to), from, to);
          const expected = expectedCrossings(level, from, to, withS4);
          expect(found.length, `${side} ${level}`).toBe(expected.length);
          found.forEach((t, i) => expect(Math.abs(t - itemAt(expected, i, 'expected')), `${side} ${level} #${i}`).toBeLessThan(100));
        }
      }
    });
  }
});

/** Sign changes of h − L on a 1-second grid: the brute-force reference. */
function sampledCrossings(heights: Float64Array, start: number, level: number): number[] {
  const out: number[] = [];
  for (let i = 1; i < heights.length; i++) {
    if (itemAt(heights, i - 1, 'heights') >= level !== itemAt(heights, i, 'heights') >= level) out.push(start + i * SECOND);
  }
  return out;
}

function expectMatchesSampling(station: Station, set: ReturnType<typeof solo>, levels: readonly number[], days: number): number {
  const from = Date.UTC(2027, 2, 20); // spans the March clock change of the demo zones
  const to = from + days * DAY;
  const count = (to - from) / SECOND;
  const heights = station.kind === 'reference'
    ? predictorFor(station).heights(from, SECOND, count)
    : cosineCurve(tideEvents(station, set, from - 2 * DAY, to + 2 * DAY), from, SECOND, count);
  let total = 0;
  for (const level of levels) {
    for (const side of ['above', 'below'] as WindowSide[]) {
      const found = crossingsOf(openIntervals(station, set, side, level, from, to), from, to);
      const sampled = sampledCrossings(heights, from, level);
      expect(found.length, `${station.id} ${side} ${level}`).toBe(sampled.length);
      found.forEach((t, i) => expect(Math.abs(t - itemAt(sampled, i, 'sampled')), `${station.id} ${side} ${level} #${i}`).toBeLessThanOrEqual(30 * SECOND));
      total += found.length;
    }
  }
  return total;
}

/** Levels across the station's range over the span: near the lows, mid-tide, near the highs. */
function levelsFor(station: Station, set: ReturnType<typeof solo>, days: number): number[] {
  const from = Date.UTC(2027, 2, 20);
  const events = tideEvents(station, set, from, from + days * DAY);
  const lows = events.filter((e) => e.type === 'low').map((e) => e.height);
  const highs = events.filter((e) => e.type === 'high').map((e) => e.height);
  const lo = Math.min(...lows);
  const hi = Math.max(...highs);
  // the last level lies between the lowest and highest low water: some tides reach it, some do not
  return [lo + 0.25 * (hi - lo), (lo + hi) / 2, lo + 0.8 * (hi - lo), (Math.min(...lows) + Math.max(...lows)) / 2];
}

describe('crossings found in the same pass as the high and low waters', () => {
  // The oracle is the kernel's own height (predictor.heightAt, itself checked against direct cosine sums in
  // tests/engine/predict.test.ts): 5 ms either side of each crossing the tide stands on either side of the level.
  it('each crossing is bracketed to 5 ms by the prediction, 60 constituents, and the events are unchanged', () => {
    const station = sixtyConstituentStation();
    const predictor = predictorFor(station);
    const from = Date.UTC(2027, 2, 20, 7, 13); // not on a midnight or a grid point
    const to = from + 30 * DAY;
    const levels = [station.mean_level - 1.5, station.mean_level, station.mean_level + 1.5];
    const scan = scanTides(predictor, from, to, levels);
    expect(scan.events).toEqual(findExtrema(predictor, from, to));
    let count = 0;
    for (const c of scan.levels) {
      expect(c.aboveAtStart).toBe(predictor.heightAt(from) >= c.level);
      for (const t of c.times) {
        const before = predictor.heightAt(t - 5) - c.level;
        const after = predictor.heightAt(t + 5) - c.level;
        expect(before * after).toBeLessThanOrEqual(0);
        count++;
      }
      // crossings alternate in direction, so the state at the end follows from the count
      expect(predictor.heightAt(to - 1) >= c.level).toBe(c.aboveAtStart !== (c.times.length % 2 === 1));
    }
    expect(count).toBeGreaterThan(200);
  });
});

describe('brute force: 1-second sampling of the engine', () => {
  const set = loadStationSet('stations-demo');
  for (const station of set.stations) {
    it(`${station.id} (${station.kind}, ${Math.abs(station.position.latitude).toFixed(0)}°): same crossings, each within 30 s`, () => {
      const total = expectMatchesSampling(station, set, levelsFor(station, set, 8), 8);
      expect(total).toBeGreaterThan(40);
    });
  }
  for (const station of [diurnalStation(), standStation()]) {
    it(`${station.id}: same crossings, each within 30 s`, () => {
      expect(expectMatchesSampling(station, solo(station), levelsFor(station, solo(station), 15), 15)).toBeGreaterThan(20);
    });
  }
});

describe('windows that never open, never close, and across midnight', () => {
  const station = diurnalStation();
  const from = Date.UTC(2027, 0, 1);
  const to = Date.UTC(2027, 2, 1);

  it('a level above every high water never opens; below every low water it is open throughout', () => {
    expect(openIntervals(station, solo(station), 'above', 9, from, to)).toEqual([]);
    expect(openIntervals(station, solo(station), 'below', -9, from, to)).toEqual([]);
    expect(openIntervals(station, solo(station), 'above', -9, from, to)).toEqual([{ start: from, end: to }]);
  });

  it('a diurnal tide at a level near its higher highs opens on some days only', () => {
    const events = tideEvents(station, solo(station), from, to);
    const top = Math.max(...events.map((e) => e.height));
    const days = localDays(2027, 'UTC').slice(0, 59);
    const split = splitByDay(openIntervals(station, solo(station), 'above', top - 0.15, from, to), days, 'UTC');
    const closed = split.filter((d) => d.state === 'closed').length;
    expect(closed).toBeGreaterThan(10);
    expect(closed).toBeLessThan(59);
  });

  it('pieces on 23- and 25-hour days stay inside their day and join back into the intervals', () => {
    const lisbon: ReferenceStation = { ...standStation(), timezone: 'Europe/Lisbon' };
    const days = localDays(2027, 'Europe/Lisbon');
    const yearFrom = firstOf(days, 'days').start;
    const yearTo = lastOf(days, 'days').end;
    const intervals = openIntervals(lisbon, solo(lisbon), 'above', lisbon.mean_level, yearFrom, yearTo);
    const split = splitByDay(intervals, days, 'Europe/Lisbon');
    const short = split.find((d) => d.date === '2027-03-28')!;
    const long = split.find((d) => d.date === '2027-10-31')!;
    expect(days.find((d) => d.date === '2027-03-28')!.hours).toBe(23);
    expect(days.find((d) => d.date === '2027-10-31')!.hours).toBe(25);
    for (const [i, d] of split.entries()) {
      for (const p of d.pieces) {
        expect(Date.parse(p.start)).toBeGreaterThanOrEqual(itemAt(days, i, 'days').start);
        expect(Date.parse(p.end)).toBeLessThanOrEqual(itemAt(days, i, 'days').end);
      }
    }
    // every piece joined to its neighbour across midnight gives back the interval (to its nearest minute)
    const joined: OpenInterval[] = [];
    for (const p of split.flatMap((d) => d.pieces)) {
      const last = joined[joined.length - 1];
      if (last && p.fromPreviousDay && last.end === Date.parse(p.start)) last.end = Date.parse(p.end);
      else joined.push({ start: Date.parse(p.start), end: Date.parse(p.end) });
    }
    const minute = (t: number) => Math.round(t / 60_000) * 60_000;
    expect(joined).toEqual(intervals.map((w) => ({ start: minute(w.start), end: minute(w.end) })).filter((w) => w.end > w.start));
    expect(short.pieces.length + long.pieces.length).toBeGreaterThan(0);
    // clocks: a piece open at midnight reads 00:00, one still open at the end reads 24:00
    for (const p of [...short.pieces, ...long.pieces]) {
      if (p.fromPreviousDay) expect(p.startClock).toBe('00:00');
      if (p.intoNextDay) expect(p.endClock).toBe('24:00');
      expect(p.startLocal.slice(11, 16)).toBe(p.fromPreviousDay ? '00:00' : p.startClock);
    }
  });
});

describe('StationYear.windows', () => {
  it('one entry per window with every local day, and a warning for a level the year never reaches', async () => {
    const { buildStationYear } = await import('../../engine/almanac.js');
    const station: ReferenceStation = {
      ...standStation(), timezone: 'Europe/Lisbon',
      windows: [{ id: 'sill', name: 'Sill', above: 1.5 }, { id: 'roof', name: 'Roof', above: 20 }],
    };
    const model = buildStationYear(station, solo(station), 2027);
    expect(model.windows.map((w) => [w.id, w.side, w.level, w.method])).toEqual([
      ['sill', 'above', 1.5, 'harmonic'], ['roof', 'above', 20, 'harmonic'],
    ]);
    const [sill, roof] = model.windows as [typeof model.windows[0], typeof model.windows[0]];
    expect(sill.days.map((d) => d.date)).toEqual(model.days.map((d) => d.date));
    expect(sill.outOfRange).toBeNull();
    expect(sill.openDays).toBe(365);
    expect(roof.outOfRange?.code).toBe('window-never-opens');
    expect(roof.days.every((d) => d.state === 'closed')).toBe(true);
    expect(model.warnings).toContainEqual(expect.objectContaining({ code: 'window-never-opens', window: 'Roof', side: 'above', level: 20, year: 2027 }));
    expect(JSON.parse(JSON.stringify(model.windows))).toEqual(model.windows);
  });
});
