import { describe, expect, it } from 'vitest';
import { findExtrema } from '../../engine/extrema.js';
import { compilePredictor } from '../../engine/predict.js';
import { springNeapFactor, springNeapRanges } from '../../engine/secondary.js';
import { createEngineContext } from '../../engine/context.js';
import { cosineCurve, predictorFor, tideEvents, tideHeights } from '../../engine/tides.js';
import type { ReferenceStation, SecondaryStation, Station, TideEvent } from '../../engine/types.js';
import { firstOf, itemAt } from '../../engine/index.js';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const MINUTE = 60_000;

const reference: ReferenceStation = {
  id: 'harbour', name: 'Harbour (invented)', kind: 'reference',
  position: { latitude: 47.5, longitude: -15.5 }, timezone: 'Europe/Lisbon', datum: 'Chart Datum',
  mean_level: 3.2,
  constituents: {
    M2: { amplitude: 1.6, phase: 130 }, S2: { amplitude: 0.55, phase: 175 },
    N2: { amplitude: 0.3, phase: 110 }, K1: { amplitude: 0.08, phase: 90 }, O1: { amplitude: 0.07, phase: 330 },
    M4: { amplitude: 0.12, phase: 40 },
  },
  provenance: 'Invented for a test',
};
const secondary: SecondaryStation = {
  id: 'creek', name: 'Creek (invented)', kind: 'secondary', reference: 'harbour',
  position: { latitude: 47.6, longitude: -15.6 }, timezone: 'Europe/Lisbon', datum: 'Chart Datum',
  differences: {
    high_water: { springs: { time: 25, height: -0.3 }, neaps: { time: 15, height: -0.2 } },
    low_water: { springs: { time: 40, height: -0.1 }, neaps: { time: 30, height: -0.05 } },
  },
  provenance: 'Invented for a test',
};
const set = { byId: new Map<string, Station>([[reference.id, reference], [secondary.id, secondary]]) };
const from = Date.UTC(2027, 2, 1);
const to = Date.UTC(2027, 3, 1);

describe('tide facade: reference ports', () => {
  it('gives the harmonic extrema and heights, with one compiled predictor per station and context', () => {
    const ctx = createEngineContext();
    expect(predictorFor(reference, ctx)).toBe(predictorFor(reference, ctx));
    expect(predictorFor(reference)).not.toBe(predictorFor(reference)); // no context: nothing kept
    expect(createEngineContext().predictors.size).toBe(0);
    const direct = findExtrema(compilePredictor(reference), from, to);
    const events = tideEvents(reference, set, from, to);
    expect(events.map((e) => e.time)).toEqual(direct.map((e) => e.time));
    const h = tideHeights(reference, set, from, 10 * MINUTE, 100);
    const p = compilePredictor(reference);
    for (let i = 0; i < 100; i += 17) expect(h[i]).toBeCloseTo(p.heightAt(from + i * 10 * MINUTE), 6);
  });
});

describe('tide facade: secondary ports', () => {
  const events = tideEvents(secondary, set, from, to);
  const refEvents = findExtrema(compilePredictor(reference), from - 2 * DAY, to + 2 * DAY);

  it('shifts every reference event by its interpolated differences', () => {
    const { springs, neaps } = springNeapRanges(reference);
    expect(events.length).toBeGreaterThan(100);
    for (const e of events) {
      // Pair each secondary event with the reference event it came from (same type, 15–60 min earlier
      // for these differences even extrapolated), then redo the method by its definition.
      const i = refEvents.findIndex((r) => r.type === e.type && e.time - r.time >= 0 && e.time - r.time <= 90 * MINUTE);
      expect(i).toBeGreaterThan(0);
      const r = itemAt(refEvents, i, 'refEvents');
      const range = Math.abs(r.height - itemAt(refEvents, i + 1, 'refEvents').height);
      const k = springNeapFactor(range, springs, neaps);
      const d = e.type === 'high' ? secondary.differences.high_water : secondary.differences.low_water;
      expect((e.time - r.time) / MINUTE).toBeCloseTo(d.neaps.time + k * (d.springs.time - d.neaps.time), 2);
      expect(e.height - r.height).toBeCloseTo(d.neaps.height + k * (d.springs.height - d.neaps.height), 6);
    }
  });

  it('gives the same events whatever window asks for them', () => {
    const split = Date.UTC(2027, 2, 14, 5, 17);
    const parts = [...tideEvents(secondary, set, from, split), ...tideEvents(secondary, set, split, to)];
    expect(parts.length).toBe(events.length);
    parts.forEach((e, i) => {
      expect(Math.abs(e.time - itemAt(events, i, 'events').time)).toBeLessThanOrEqual(1000);
      expect(e.height).toBeCloseTo(itemAt(events, i, 'events').height, 3);
    });
  });

  it('draws heights by the cosine curve through its own events', () => {
    const a = itemAt(events, 10, 'events');
    const b = itemAt(events, 11, 'events');
    const h = tideHeights(secondary, set, a.time, (b.time - a.time) / 4, 5);
    // By the curve's formula h1 + (h2 − h1)(1 − cos(πx))/2: x = 0, ¼, ½, ¾, 1 give
    // factors 0, (1 − √½)/2, ½, (1 + √½)/2, 1.
    const f = [0, (1 - Math.SQRT1_2) / 2, 0.5, (1 + Math.SQRT1_2) / 2, 1];
    f.forEach((x, i) => expect(h[i]).toBeCloseTo(a.height + (b.height - a.height) * x, 6));
  });

  it('cosine curve is NaN outside its events rather than inventing heights', () => {
    const ev: TideEvent[] = [{ time: 0, type: 'low', height: 1 }, { time: 6 * HOUR, type: 'high', height: 3 }];
    const h = cosineCurve(ev, -HOUR, HOUR, 9);
    expect(Number.isNaN(firstOf(h, 'h'))).toBe(true);
    expect(h[1]).toBe(1);
    expect(h[4]).toBeCloseTo(2, 12);
    expect(h[7]).toBe(3);
    expect(Number.isNaN(itemAt(h, 8, 'h'))).toBe(true);
  });
});
