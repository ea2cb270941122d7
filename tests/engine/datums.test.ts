import { describe, expect, it } from 'vitest';
import {
  ageOfTideHours, datumEpoch, formNumber, harmonicLevels, lowWaterBelowLat, stationDatums, tideTypeOf,
} from '../../engine/datums.js';
import { nodeFactors } from '../../engine/nodal.js';
import { tideEvents } from '../../engine/tides.js';
import type { ReferenceStation, SecondaryStation, Station, TideEvent } from '../../engine/types.js';
import { createEngineContext } from '../../engine/context.js';
import { firstOf } from '../../engine/index.js';

// One context for the file: datums of a station are computed once and then read from it.
const ctx = createEngineContext();

const DAY = 86_400_000;

function reference(constituents: ReferenceStation['constituents'], extra: Partial<ReferenceStation> = {}): ReferenceStation {
  return {
    id: 'test-port', name: 'Test Port (invented)', kind: 'reference',
    position: { latitude: 47, longitude: -16 }, timezone: 'UTC', datum: 'Chart Datum',
    mean_level: 3, constituents, provenance: 'Invented for a test', ...extra,
  };
}
const lookup = (...stations: Station[]) => ({ byId: new Map(stations.map((s) => [s.id, s] as const)) });

// A pure M2 + S2 station: Z0 = 3.000 m, H_M2 = 1.500 m, H_S2 = 0.500 m.
const pure = reference({ M2: { amplitude: 1.5, phase: 120 }, S2: { amplitude: 0.5, phase: 160 } });

describe('LAT and HAT over the 19-year epoch', () => {
  // The lowest a pure M2+S2 tide can go is Z0 − (max f_M2 · H_M2 + H_S2) (S2 has no node factor),
  // reached at a spring low water in the years when f_M2 is largest; max f_M2 is taken from the
  // engine's Schureman node factor over the same 19 years, itself checked against Schureman's
  // value f(M2) = 1.0378 at N = 180° (REFERENCE-VALUES §3, tolerance 0.002).
  const epoch = datumEpoch(pure);
  let fMax = 0;
  for (let t = epoch.start; t < epoch.end; t += DAY) fMax = Math.max(fMax, firstOf(nodeFactors(['M2'], t).f, 'f'));

  it('uses 19 years from 1 January of the default epoch 2020', () => {
    expect(epoch.from).toBe(2020);
    expect(epoch.to).toBe(2038);
    expect(new Date(epoch.start).toISOString()).toBe('2020-01-01T00:00:00.000Z');
    expect(new Date(epoch.end).toISOString()).toBe('2039-01-01T00:00:00.000Z');
    expect(fMax).toBeCloseTo(1.0378, 2); // Schureman (1958) via REFERENCE-VALUES §3
    expect(Math.abs(fMax - 1.0378)).toBeLessThan(0.002);
  });

  it('LAT = Z0 − (max f_M2·H_M2 + H_S2) and HAT = Z0 + (…) within a few mm', () => {
    const { datums } = stationDatums(pure, lookup(pure), ctx);
    const bound = fMax * 1.5 + 0.5;
    // Formula above (Pugh 1987 ch. 4 for the two-constituent envelope); the extremum needs both
    // phases at 180° at once, which a spring low water near the f_M2 maximum meets to within mm.
    expect(datums.LAT).toBeGreaterThanOrEqual(mmRound(3 - bound) - 0.001);
    expect(datums.LAT - (3 - bound)).toBeLessThan(0.005);
    expect(datums.HAT).toBeLessThanOrEqual(mmRound(3 + bound) + 0.001);
    expect(3 + bound - datums.HAT).toBeLessThan(0.005);
    expect(datums.epoch).toEqual({ from: 2020, to: 2038 });
  });

  it('keeps the same LAT whatever the edition year, and a different epoch moves it', () => {
    const later = { ...pure, datum_epoch: 2001 };
    const a = stationDatums(pure, lookup(pure), ctx).datums.LAT;
    expect(stationDatums(pure, lookup(pure), ctx)).toBe(ctx.datums.get(pure)!.summary); // kept in the context
    expect(stationDatums(pure, lookup(pure)).datums.LAT).toBe(a); // without a context: computed afresh, the same
    const b = stationDatums(later, lookup(later), ctx).datums;
    expect(b.epoch).toEqual({ from: 2001, to: 2019 });
    // Both epochs span a whole nodal cycle, so the pure M2+S2 LAT agrees to a few mm.
    expect(Math.abs(b.LAT - a)).toBeLessThan(0.005);
  });
});

describe('levels from the constants (Pugh 1987)', () => {
  it('MHWS, MHWN, MLWN, MLWS and MSL of the pure station, by hand', () => {
    // Z0 ± (H_M2 ± H_S2): 3 + 2.0 = 5.0, 3 + 1.0 = 4.0, 3 − 1.0 = 2.0, 3 − 2.0 = 1.0; MSL = Z0 = 3.
    const l = harmonicLevels(pure);
    expect(l).toEqual({ MHWS: 5, MHWN: 4, MLWN: 2, MLWS: 1, MSL: 3 });
    const s = stationDatums(pure, lookup(pure), ctx);
    expect(s.meanSpringRange).toBe(4);
    expect(s.meanNeapRange).toBe(2);
  });

  it('secondary port: reference levels plus the spring and neap height differences', () => {
    const sec: SecondaryStation = {
      id: 'side-creek', name: 'Side Creek (invented)', kind: 'secondary', reference: 'test-port',
      position: { latitude: 47, longitude: -16 }, timezone: 'UTC', datum: 'Chart Datum',
      differences: {
        high_water: { springs: { time: 30, height: -0.4 }, neaps: { time: 20, height: -0.2 } },
        low_water: { springs: { time: 50, height: 0.1 }, neaps: { time: 40, height: 0.2 } },
      },
      provenance: 'Invented for a test',
    };
    const set = lookup(pure, sec);
    const s = stationDatums(sec, set, ctx);
    // By hand: MHWS 5.0 − 0.4 = 4.6; MHWN 4.0 − 0.2 = 3.8; MLWN 2.0 + 0.2 = 2.2; MLWS 1.0 + 0.1 = 1.1;
    // MSL = mean of the four = 11.7/4 = 2.925; ranges 4.6 − 1.1 = 3.5 and 3.8 − 2.2 = 1.6.
    expect(s.datums).toMatchObject({ MHWS: 4.6, MHWN: 3.8, MLWN: 2.2, MLWS: 1.1, MSL: 2.925 });
    expect(s.meanSpringRange).toBe(3.5);
    expect(s.meanNeapRange).toBe(1.6);
    // LAT/HAT from the secondary port's own events over the same epoch.
    const e = datumEpoch(sec);
    const events = tideEvents(sec, set, e.start, e.end);
    const lows = events.filter((x) => x.type === 'low').map((x) => x.height);
    const highs = events.filter((x) => x.type === 'high').map((x) => x.height);
    expect(s.datums.LAT).toBe(mmRound(Math.min(...lows)));
    expect(s.datums.HAT).toBe(mmRound(Math.max(...highs)));
    expect(s.tideType.kind).toBe('semidiurnal');
  });
});

describe('tide type, age of the tide, warnings', () => {
  it('classes by form number (Courtier 1938, as given in Pugh 1987)', () => {
    const withRatio = (k1o1: number) =>
      formNumber({ M2: { amplitude: 1, phase: 0 }, S2: { amplitude: 0, phase: 0 },
        K1: { amplitude: k1o1 / 2, phase: 0 }, O1: { amplitude: k1o1 / 2, phase: 0 } });
    expect(withRatio(0.1)).toBeCloseTo(0.1, 12);
    expect(tideTypeOf(withRatio(0.1)).kind).toBe('semidiurnal');
    expect(tideTypeOf(0.24).kind).toBe('semidiurnal');
    expect(tideTypeOf(0.25).kind).toBe('mixed-semidiurnal');
    expect(tideTypeOf(withRatio(1)).kind).toBe('mixed-semidiurnal');
    expect(tideTypeOf(1.49).kind).toBe('mixed-semidiurnal');
    expect(tideTypeOf(1.5).kind).toBe('mixed-diurnal');
    expect(tideTypeOf(3).kind).toBe('mixed-diurnal');
    expect(tideTypeOf(3.01).kind).toBe('diurnal');
    expect(tideTypeOf(withRatio(5))).toEqual({ formNumber: 5, kind: 'diurnal' });
    expect(formNumber({ K1: { amplitude: 0.3, phase: 0 } })).toBe(999);
  });

  it('age of the tide = (g_S2 − g_M2)/(30 − 28.9841042) h (Pugh 1987; speeds from Schureman Table 2)', () => {
    const age = (gM2: number, gS2: number) =>
      ageOfTideHours({ M2: { amplitude: 1, phase: gM2 }, S2: { amplitude: 0.3, phase: gS2 } });
    expect(age(120, 160)).toBeCloseTo(40 / 1.0158958, 6); // 39.37 h
    expect(age(350, 30)).toBeCloseTo(40 / 1.0158958, 6); // across 0°
    expect(age(20, 10)).toBeCloseTo(-10 / 1.0158958, 6); // springs slightly before syzygy
    expect(stationDatums(pure, lookup(pure), ctx).ageOfTideHours).toBe(39.4);
  });

  it('warns when LAT stands more than 0.1 m above chart datum', () => {
    const high = reference({ M2: { amplitude: 1.5, phase: 120 }, S2: { amplitude: 0.5, phase: 160 } },
      { id: 'high-datum', mean_level: 3.0 + 2.2 });
    const s = stationDatums(high, lookup(high), ctx);
    expect(s.datums.LAT).toBeGreaterThan(0.1);
    expect(s.warnings.map((w) => w.code).join(' ')).toMatch(/lat-above-datum/);
    // Chart datum 2 cm below LAT: no warning (Z0 − (1.0378·1.5 + 0.5) ≈ Z0 − 2.057).
    const low = reference(pure.constituents, { id: 'low-datum', mean_level: 2.08 });
    expect(stationDatums(low, lookup(low), ctx).warnings).toEqual([]);
  });

  it('finds a low water below LAT (beyond a millimetre of rounding)', () => {
    const ev = (height: number, type: TideEvent['type'] = 'low'): TideEvent => ({ time: 0, type, height });
    expect(lowWaterBelowLat([ev(0.2), ev(4, 'high'), ev(-0.05)], 0)?.height).toBe(-0.05);
    expect(lowWaterBelowLat([ev(0.2), ev(-0.0005)], 0)).toBeNull();
    expect(lowWaterBelowLat([ev(-3, 'high')], 0)).toBeNull();
  });
});

function mmRound(x: number): number {
  return Math.round(x * 1000) / 1000;
}
