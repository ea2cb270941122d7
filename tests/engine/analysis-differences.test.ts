import { describe, expect, it } from 'vitest';
import { RecordFileError } from '../../engine/errors.js';
import { fitAgainstRangeFactor } from '../../engine/analysis/difference-fit.js';
import { analyseDifferences } from '../../engine/analysis/differences.js';
import { recordExtrema } from '../../engine/analysis/record-extrema.js';
import { secondaryStationFrom, secondaryStationYaml } from '../../engine/analysis/secondary-yaml.js';
import { parseStation } from '../../engine/stations.js';
import { tideHeights } from '../../engine/tides.js';
import type { ReferenceStation, SecondaryStation, Station } from '../../engine/types.js';
import { DAY, HOUR, degrade, evenTimes, recordOf } from '../fixtures/analysis-records.js';
import { entryOf, itemAt } from '../../engine/index.js';

const MINUTE = 60_000;
const START = Date.UTC(2027, 2, 1);

// Invented ports, realistic in magnitude.
const reference: ReferenceStation = {
  id: 'gull-point',
  name: 'Gull Point (invented)',
  kind: 'reference',
  position: { latitude: 47.0, longitude: -16.0 },
  timezone: 'Europe/London',
  datum: 'Chart Datum',
  mean_level: 3.0,
  constituents: {
    M2: { amplitude: 1.6, phase: 130 }, S2: { amplitude: 0.55, phase: 175 }, N2: { amplitude: 0.3, phase: 110 },
    K1: { amplitude: 0.08, phase: 100 }, O1: { amplitude: 0.07, phase: 330 }, M4: { amplitude: 0.05, phase: 40 },
  },
  provenance: 'Invented for the differences test',
};
const known: SecondaryStation = {
  id: 'pipit-creek',
  name: 'Pipit Creek (invented)',
  kind: 'secondary',
  reference: 'gull-point',
  position: { latitude: 47.1, longitude: -16.1 },
  timezone: 'Europe/London',
  datum: 'Chart Datum',
  differences: {
    high_water: { springs: { time: 25, height: -0.3 }, neaps: { time: 15, height: -0.2 } },
    low_water: { springs: { time: 40, height: -0.1 }, neaps: { time: 30, height: -0.05 } },
  },
  provenance: 'Invented for the differences test',
};
const set = { byId: new Map<string, Station>([[reference.id, reference], [known.id, known]]) };

/** The secondary port's record: its events from engine/secondary.ts joined by the almanac's cosine curve. */
function secondaryRecord(days: number, stepMinutes: number) {
  const count = Math.floor((days * DAY) / (stepMinutes * MINUTE)) + 1;
  return recordOf(evenTimes(START, stepMinutes * MINUTE, count), tideHeights(known, set, START, stepMinutes * MINUTE, count));
}

describe('recordExtrema', () => {
  // An asymmetric curve, M2-like with a 10 % quarter-diurnal overtide; its turning points found by brute
  // force at 1-second steps are the truth.
  const period = 12.42 * HOUR;
  const curve = (t: number): number =>
    2 + 1.5 * Math.cos((2 * Math.PI * (t - START)) / period) + 0.15 * Math.cos((4 * Math.PI * (t - START)) / period - 1);
  const truth: { time: number; height: number; type: string }[] = [];
  for (let t = START + 1000; t < START + 10 * DAY; t += 1000) {
    const a = curve(t - 1000), b = curve(t), c = curve(t + 1000);
    if (b > a && b >= c) truth.push({ time: t, height: b, type: 'high' });
    if (b < a && b <= c) truth.push({ time: t, height: b, type: 'low' });
  }
  const times = evenTimes(START, 10 * MINUTE, 6 * 24 * 10);
  const heights = times.map(curve);

  it('times and heights the turning points of a clean asymmetric curve to 0.5 min and 1 mm', () => {
    const events = recordExtrema(recordOf(times, heights));
    expect(events.map((e) => e.type)).toEqual(truth.map((e) => e.type));
    events.forEach((e, i) => {
      expect(Math.abs(e.time - itemAt(truth, i, 'truth').time) / MINUTE).toBeLessThan(0.5);
      expect(Math.abs(e.height - itemAt(truth, i, 'truth').height)).toBeLessThan(0.001);
    });
  });

  it('finds every one of them, and nothing else, with 2 cm of noise', () => {
    const events = recordExtrema(degrade(recordOf(times, heights), { sigma: 0.02, seed: 9 }));
    expect(events.map((e) => e.type)).toEqual(truth.map((e) => e.type));
    let sumSq = 0;
    events.forEach((e, i) => {
      sumSq += ((e.time - itemAt(truth, i, 'truth').time) / MINUTE) ** 2;
      expect(Math.abs(e.time - itemAt(truth, i, 'truth').time) / MINUTE).toBeLessThan(10);
      expect(Math.abs(e.height - itemAt(truth, i, 'truth').height)).toBeLessThan(0.025);
    });
    expect(Math.sqrt(sumSq / events.length)).toBeLessThan(3.5);
  });

  it('skips extrema cut by a gap instead of inventing them at its edge', () => {
    const period = 12.42 * HOUR;
    const times = evenTimes(START, 10 * MINUTE, 6 * 24 * 3).filter((t) => t < START + 5 * HOUR || t > START + 8 * HOUR);
    const heights = times.map((t) => 2 + 1.5 * Math.cos((2 * Math.PI * (t - START)) / period));
    const events = recordExtrema(recordOf(times, heights));
    expect(events.some((e) => Math.abs(e.time - (START + period / 2)) < HOUR)).toBe(false); // the low at 6.21 h is in the gap
    expect(events.some((e) => Math.abs(e.time - (START + period)) < 2 * MINUTE)).toBe(true);
  });
});

describe('fitAgainstRangeFactor', () => {
  it('fits d = neaps + k·(springs − neaps) and drops one outlier (worked example)', () => {
    // d = 15 + 10k exactly at k = 0, 0.25 … 1.25, plus one bad match (+60 min) at k = 0.5
    const k = [0, 0.25, 0.5, 0.75, 1, 1.25, 0.5];
    const d = [15, 17.5, 20, 22.5, 25, 27.5, 80];
    const fit = fitAgainstRangeFactor(k, d, 2);
    expect(fit).toMatchObject({ count: 6, rejected: 1, constant: false });
    expect(fit.neaps).toBeCloseTo(15, 9);
    expect(fit.springs).toBeCloseTo(25, 9);
    expect(fit.rms).toBeCloseTo(0, 9);
  });

  it('gives one value when k hardly varies', () => {
    const fit = fitAgainstRangeFactor([0.5, 0.52, 0.55, 0.51], [20, 21, 19, 20], 2);
    expect(fit).toMatchObject({ constant: true, neaps: 20, springs: 20 });
  });
});

describe('analyseDifferences: a synthetic secondary built from known differences', () => {
  // The almanac's cosine curve changes curvature abruptly at each event, which pulls a local fit by
  // well under a minute: the clean record gives the differences back to 1 minute and 2 mm.
  it('recovers the differences from a clean 10-minute record of 30 days to 1 min and 2 mm', () => {
    const a = analyseDifferences(secondaryRecord(30, 10), reference);
    const d = a.differences;
    for (const [got, want] of [
      [d.high_water.springs, known.differences.high_water.springs], [d.high_water.neaps, known.differences.high_water.neaps],
      [d.low_water.springs, known.differences.low_water.springs], [d.low_water.neaps, known.differences.low_water.neaps],
    ] as const) {
      expect(Math.abs(got.time - want.time)).toBeLessThan(1);
      expect(Math.abs(got.height - want.height)).toBeLessThan(0.002);
    }
    expect(a.kRange[0]).toBeLessThan(0.1); // the record spans neaps …
    expect(a.kRange[1]).toBeGreaterThan(0.9); // … and springs
    expect(a.unmatched.length).toBe(0);
  });

  it('recovers them within 2 minutes and 1 cm with 1 cm of noise and gaps', () => {
    const record = degrade(secondaryRecord(30, 10), { sigma: 0.01, seed: 5, dropShare: 0.05, blockFrom: START + 9 * DAY, blockTo: START + 10 * DAY });
    const a = analyseDifferences(record, reference);
    const d = a.differences;
    expect(Math.abs(d.high_water.springs.time - 25)).toBeLessThan(2);
    expect(Math.abs(d.high_water.neaps.time - 15)).toBeLessThan(2);
    expect(Math.abs(d.low_water.springs.time - 40)).toBeLessThan(2);
    expect(Math.abs(d.low_water.neaps.time - 30)).toBeLessThan(2);
    expect(Math.abs(d.high_water.springs.height + 0.3)).toBeLessThan(0.01);
    expect(Math.abs(d.high_water.neaps.height + 0.2)).toBeLessThan(0.01);
    expect(Math.abs(d.low_water.springs.height + 0.1)).toBeLessThan(0.01);
    expect(Math.abs(d.low_water.neaps.height + 0.05)).toBeLessThan(0.01);
    expect(a.fits.highTime.rms).toBeLessThan(3);
    expect(a.fits.highHeight.rms).toBeLessThan(0.01);
  });

  it('writes a secondary station file the loader accepts, fit quality in comments', () => {
    const a = analyseDifferences(secondaryRecord(30, 10), reference);
    const meta = { id: 'pipit-creek', name: 'Pipit Creek (invented)', latitude: 47.1, longitude: -16.1, timezone: 'Europe/London', datum: 'Chart Datum' };
    const text = secondaryStationYaml(a, meta);
    const loaded = parseStation(text, 'pipit-creek.yaml');
    expect(loaded).toMatchObject({ ...secondaryStationFrom(a, meta), sourceFile: 'pipit-creek.yaml' });
    if (loaded.kind !== 'secondary') throw new Error('expected a secondary port');
    expect(Math.abs(loaded.differences.high_water.springs.time - 25)).toBeLessThanOrEqual(1); // whole minutes
    expect(loaded.differences.low_water.neaps.height).toBeCloseTo(-0.05, 2);
    expect(text).toMatch(/^# Fit quality \(RMS of residuals\): high water \d+\.\d min and 0\.\d{3} m over \d+ events; low water/m);
  });

  it('a record of three days gives one value for springs and neaps, and says so', () => {
    const a = analyseDifferences(secondaryRecord(3, 10), reference);
    expect(a.fits.highTime.constant).toBe(true);
    const meta = { id: 'pipit-creek', name: 'Pipit Creek', latitude: 47.1, longitude: -16.1, timezone: 'Europe/London', datum: 'Chart Datum' };
    expect(secondaryStationYaml(a, meta)).toContain('# The record covers too little of the spring-neap cycle');
  });

  it('refuses a record with too few tides to match', () => {
    expect(() => analyseDifferences(secondaryRecord(1, 10), reference)).toThrow(RecordFileError);
    expect(() => analyseDifferences(secondaryRecord(1, 10), reference)).toThrow(/only \d (high|low) waters of the record could be matched/);
  });

  it('refuses a reference port without S2 (springs and neaps cannot be told apart)', () => {
    const noS2: ReferenceStation = { ...reference, constituents: { M2: entryOf(reference.constituents, 'M2', 'constituents') } };
    expect(() => analyseDifferences(secondaryRecord(30, 10), noS2)).toThrow(/no S2 amplitude/);
  });
});
