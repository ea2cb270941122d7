import { describe, expect, it } from 'vitest';
import { findExtrema } from '../../engine/extrema.js';
import { compilePredictor, type Predictor } from '../../engine/predict.js';
import type { ReferenceStation, TideEvent } from '../../engine/types.js';
import { diurnalStation, doubleHighStation, sixtyConstituentStation, standStation } from '../fixtures/engine-stations.js';
import { itemAt } from '../../engine/index.js';
import { neighbours } from '../fixtures/lists.js';

const SECOND = 1000;
const HOUR = 3_600_000;
const DAY = 86_400_000;

/** Every local extremum of the kernel sampled each second: the brute-force reference. */
function bruteForce(predictor: Predictor, start: number, end: number): TideEvent[] {
  const count = Math.round((end - start) / SECOND);
  const h = predictor.heights(start - SECOND, SECOND, count + 2); // one sample either side
  const events: TideEvent[] = [];
  for (let j = 1; j <= count; j++) {
    const time = start + (j - 1) * SECOND;
    if (itemAt(h, j, 'h') > itemAt(h, j - 1, 'h') && itemAt(h, j, 'h') >= itemAt(h, j + 1, 'h')) events.push({ time, type: 'high', height: itemAt(h, j, 'h') });
    else if (itemAt(h, j, 'h') < itemAt(h, j - 1, 'h') && itemAt(h, j, 'h') <= itemAt(h, j + 1, 'h')) events.push({ time, type: 'low', height: itemAt(h, j, 'h') });
  }
  return events;
}

function expectSameEvents(found: TideEvent[], reference: TideEvent[]): void {
  expect(found.length).toBe(reference.length);
  found.forEach((e, i) => {
    const r = itemAt(reference, i, 'reference');
    expect(e.type, `event ${i}`).toBe(r.type);
    expect(Math.abs(e.time - r.time), `event ${i} time (ms)`).toBeLessThanOrEqual(SECOND);
    expect(Math.abs(e.height - r.height), `event ${i} height (m)`).toBeLessThan(0.001);
  });
}

function withConstituents(constituents: ReferenceStation['constituents']): ReferenceStation {
  return { ...standStation(), id: 'shaped-invented', constituents };
}

describe('high and low waters', () => {
  const start = Date.UTC(2027, 2, 1, 7, 13);
  const end = start + 30 * DAY;

  it.each([
    ['strong overtides (double high waters)', doubleHighStation],
    ['overtides making stands', standStation],
    ['a diurnal port', diurnalStation],
    ['60 constituents', sixtyConstituentStation],
  ])('match brute force at 1 s over a month: %s', (_, make) => {
    const predictor = compilePredictor(make());
    const found = findExtrema(predictor, start, end);
    expectSameEvents(found, bruteForce(predictor, start, end));
    for (const [a, b] of neighbours(found)) expect(b.type).not.toBe(a.type);
    expect(found.every((e) => e.time >= start && e.time < end)).toBe(true);
  });

  it('finds double high waters where the overtides make them', () => {
    const found = findExtrema(compilePredictor(doubleHighStation()), start, end);
    // a high, a low less than 0.3 m below it and another high, all within four hours: nearly every tide
    const doubles = found.filter((e, i) => {
      const next = found[i + 2];
      return e.type === 'high' && next && next.time - e.time < 4 * HOUR && e.height - itemAt(found, i + 1, 'found').height < 0.3;
    });
    expect(doubles.length).toBeGreaterThan(40);
  });

  it('gives days with a single high water at a diurnal port', () => {
    const found = findExtrema(compilePredictor(diurnalStation()), start, end);
    let singleDays = 0;
    for (let d = start; d + DAY <= end; d += DAY) {
      if (found.filter((e) => e.type === 'high' && e.time >= d && e.time < d + DAY).length === 1) singleDays++;
    }
    expect(singleDays).toBeGreaterThan(5);
  });

  describe('near-degenerate shapes (S2 with S6 = −(1 + ε)·S2/9: the curve is flat to third order at each high and low)', () => {
    // Worked by hand: h = A cos x − (1 + ε)(A/9) cos 3x has h′ ≈ εA·x − (4/3)A·x³ near x = 0, so for ε > 0
    // every high water splits into a high, a low and a high, ±√(3ε/4) rad apart (a dip of 3Aε²/16), and
    // for ε < 0 it is a single very flat stand. S2 and S6 have no node factors, so the shape is exact.
    const shapeStart = Date.UTC(2027, 5, 1);
    const shapeEnd = shapeStart + 5 * DAY;
    it.each([
      [1e-3, 6], // pairs about 6.5 minutes apart, dip 0.2 µm
      [2e-5, 6], // pairs about 55 seconds apart
      [-1e-3, 2], // a flat stand, no extra events
    ])('ε = %d gives %d events per S2 cycle, as brute force does', (eps, perCycle) => {
      const predictor = compilePredictor(withConstituents({
        S2: { amplitude: 1, phase: 30 },
        S6: { amplitude: (1 + eps) / 9, phase: (3 * 30 + 180) % 360 },
      }));
      const found = findExtrema(predictor, shapeStart, shapeEnd);
      expectSameEvents(found, bruteForce(predictor, shapeStart, shapeEnd));
      expect(found.length).toBe(perCycle * 10);
    });
  });

  it('gives the same events whether a span is searched whole or in pieces', () => {
    const predictor = compilePredictor(sixtyConstituentStation());
    const cut = start + 11 * DAY + 5 * HOUR + 17 * SECOND;
    const whole = findExtrema(predictor, start, end);
    const pieces = [...findExtrema(predictor, start, cut), ...findExtrema(predictor, cut, end)];
    expect(pieces.length).toBe(whole.length);
    pieces.forEach((e, i) => {
      expect(Math.abs(e.time - itemAt(whole, i, 'whole').time)).toBeLessThanOrEqual(1);
      expect(e.height).toBeCloseTo(itemAt(whole, i, 'whole').height, 7);
    });
  });

  it('finds the extremum of the sum to well under a second and a millimetre', () => {
    const predictor = compilePredictor(doubleHighStation());
    for (const e of findExtrema(predictor, start, start + 3 * DAY)) {
      expect(Math.abs(predictor.rateAt(e.time))).toBeLessThan(1e-3); // m/h: under 1 s off at |h″| ≥ 4 m/h²
      expect(Math.abs(predictor.heightAt(e.time) - e.height)).toBeLessThan(1e-6);
    }
  });

  it('returns nothing for an empty span or a station without constituents', () => {
    const predictor = compilePredictor(standStation());
    expect(findExtrema(predictor, start, start)).toEqual([]);
    expect(findExtrema(compilePredictor(withConstituents({})), start, end)).toEqual([]);
  });
});
