import { describe, expect, it } from 'vitest';
import { StationFileError } from '../../engine/errors.js';
import { compilePredictor, directHeights } from '../../engine/predict.js';
import type { ReferenceStation } from '../../engine/types.js';
import { sixtyConstituentStation } from '../fixtures/engine-stations.js';
import { itemAt } from '../../engine/index.js';

const MINUTE = 60_000;
const HOUR = 3_600_000;

function stationWith(constituents: ReferenceStation['constituents'], meanLevel = 2): ReferenceStation {
  return { ...sixtyConstituentStation(), id: 'small-invented', mean_level: meanLevel, constituents };
}

describe('prediction kernel', () => {
  it('stays within 1e-6 m of the direct sum over a year at 1-minute steps (60 constituents)', () => {
    const station = sixtyConstituentStation();
    expect(Object.keys(station.constituents).length).toBe(60);
    const predictor = compilePredictor(station);
    const start = Date.UTC(2027, 0, 1);
    const count = 365 * 1440;
    const series = predictor.heights(start, MINUTE, count);
    // direct evaluation (V, f, u at the very instant) on every 97th minute
    let worst = 0;
    for (let j = 0; j < count; j += 97) worst = Math.max(worst, Math.abs(itemAt(series, j, 'series') - directHeights(station)(start + j * MINUTE)));
    expect(worst).toBeLessThan(1e-6);
    // the same series anchored elsewhere (windows starting 97 minutes later) agrees everywhere
    const shifted = predictor.heights(start + 97 * MINUTE, MINUTE, count - 97);
    let drift = 0;
    for (let j = 0; j < shifted.length; j++) drift = Math.max(drift, Math.abs(itemAt(shifted, j, 'shifted') - itemAt(series, j + 97, 'series')));
    expect(drift).toBeLessThan(1e-6);
    // and single instants (day-anchored windows) agree with the series
    for (let j = 0; j < count; j += 7919) expect(predictor.heightAt(start + j * MINUTE)).toBeCloseTo(itemAt(series, j, 'series'), 7);
  });

  it('puts an S2-only tide\'s high water where its phase lag says (worked by hand)', () => {
    // Schureman (1958): S2's argument is 2T and T = 0 at 12:00 UTC (mean sun on the Greenwich meridian).
    // With g = 60°, 2T − 60° = 0 when T = 30°, i.e. two hours after noon: high water 14:00 UTC, H above Z0.
    const predictor = compilePredictor(stationWith({ S2: { amplitude: 1.25, phase: 60 } }, 3));
    const t = Date.UTC(2028, 5, 17, 14);
    expect(predictor.heightAt(t)).toBeCloseTo(3 + 1.25, 9);
    expect(predictor.rateAt(t)).toBeCloseTo(0, 9);
    // three hours later the argument has turned 90°: mean level, falling at H·30°/h = 0.654 m/h
    expect(predictor.heightAt(t + 3 * HOUR)).toBeCloseTo(3, 9);
    expect(predictor.rateAt(t + 3 * HOUR)).toBeCloseTo((-1.25 * 30 * Math.PI) / 180, 9);
    expect(directHeights(predictor.station)(t)).toBeCloseTo(4.25, 12);
  });

  it('gives the analytic rate of rise in metres per hour', () => {
    const predictor = compilePredictor(sixtyConstituentStation());
    const start = Date.UTC(2026, 8, 3, 5, 17);
    for (let k = 0; k < 200; k++) {
      const t = start + k * 37 * MINUTE;
      const numeric = (predictor.heightAt(t + 1000) - predictor.heightAt(t - 1000)) / (2000 / HOUR);
      expect(predictor.rateAt(t)).toBeCloseTo(numeric, 6);
    }
  });

  it('handles steps that do not divide a day, steps longer than a day, and empty series', () => {
    const station = sixtyConstituentStation();
    const predictor = compilePredictor(station);
    const start = Date.UTC(2030, 1, 27, 22, 3);
    const odd = predictor.heights(start, 7 * MINUTE + 13_000, 900);
    for (let j = 0; j < odd.length; j += 41) {
      expect(odd[j]).toBeCloseTo(directHeights(station)(start + j * (7 * MINUTE + 13_000)), 6);
    }
    const weekly = predictor.heights(start, 7 * 24 * HOUR, 60);
    for (let j = 0; j < weekly.length; j++) expect(weekly[j]).toBeCloseTo(directHeights(station)(start + j * 7 * 24 * HOUR), 9);
    expect(predictor.heights(start, MINUTE, 0).length).toBe(0);
    expect(() => predictor.heights(start, 0, 10)).toThrow(RangeError);
  });

  it('predicts the mean level for a station without constituents and skips zero amplitudes', () => {
    const flat = compilePredictor(stationWith({}, 1.7));
    expect(flat.heightAt(Date.UTC(2027, 0, 1))).toBe(1.7);
    expect(flat.rateAt(Date.UTC(2027, 0, 1))).toBe(0);
    expect([...flat.heights(0, HOUR, 3)]).toEqual([1.7, 1.7, 1.7]);
    const some = compilePredictor(stationWith({ M2: { amplitude: 1, phase: 0 }, K1: { amplitude: 0, phase: 0 } }));
    expect(some.names).toEqual(['M2']);
  });

  it('refuses unknown and repeated constituents, naming the station file and field', () => {
    const bad = { ...stationWith({ M2: { amplitude: 1, phase: 0 }, XY3: { amplitude: 0.1, phase: 0 } }), sourceFile: 'ports/x.yaml' };
    expect(() => compilePredictor(bad)).toThrow(StationFileError);
    expect(() => compilePredictor(bad)).toThrow(/ports\/x\.yaml: constituents\.XY3: unknown constituent "XY3"/);
    const twice = stationWith({ MU2: { amplitude: 0.1, phase: 0 }, 'μ2': { amplitude: 0.1, phase: 0 } });
    expect(() => compilePredictor(twice)).toThrow(/same constituent/);
    expect(() => directHeights(bad)(0)).toThrow(StationFileError);
  });
});
