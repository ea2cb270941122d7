import { describe, expect, it } from 'vitest';
import { StationFileError } from '../../engine/errors.js';
import {
  interpolateDifference, referencePortOf, secondaryEventsFrom, springNeapFactor, springNeapRanges,
} from '../../engine/secondary.js';
import type { ReferenceStation, SecondaryStation, Station, TideEvent } from '../../engine/types.js';
import { firstOf, itemAt } from '../../engine/index.js';

// A tiny reference port with only M2 and S2, chosen so the mean ranges are round numbers.
const reference: ReferenceStation = {
  id: 'round-harbour', name: 'Round Harbour (invented)', kind: 'reference',
  position: { latitude: 47.5, longitude: -15.5 }, timezone: 'UTC', datum: 'Chart Datum',
  mean_level: 3.0,
  constituents: { M2: { amplitude: 1.5, phase: 100 }, S2: { amplitude: 0.5, phase: 140 } },
  provenance: 'Invented for a test',
};

const secondary: SecondaryStation = {
  id: 'square-cove', name: 'Square Cove (invented)', kind: 'secondary', reference: 'round-harbour',
  position: { latitude: 47.6, longitude: -15.6 }, timezone: 'UTC', datum: 'Chart Datum',
  differences: {
    high_water: { springs: { time: 40, height: -0.4 }, neaps: { time: 20, height: -0.2 } },
    low_water: { springs: { time: 60, height: -0.2 }, neaps: { time: 20, height: 0.0 } },
  },
  provenance: 'Invented for a test',
};

const at = (iso: string) => Date.parse(iso);

describe('secondary-port events (worked example by hand)', () => {
  // Worked by hand (the method of the station file's differences; mean ranges after Pugh 1987):
  //   Rs = 2(H_M2 + H_S2) = 2(1.5 + 0.5) = 4.0 m;  Rn = 2(H_M2 − H_S2) = 2(1.5 − 0.5) = 2.0 m.
  // Reference events: HW 06:00Z 4.60 m, LW 12:12Z 1.60 m, HW 18:30Z 4.10 m.
  //   HW 06:00: R = 4.60 − 1.60 = 3.00 (next LW); k = (3.00 − 2.0)/(4.0 − 2.0) = 0.50
  //     time diff = 20 + 0.50·(40 − 20) = 30 min → 06:30:00Z; height diff = −0.2 + 0.5·(−0.4 + 0.2) = −0.30 → 4.30 m
  //   LW 12:12: R = 4.10 − 1.60 = 2.50 (next HW); k = (2.50 − 2.0)/2.0 = 0.25
  //     time diff = 20 + 0.25·(60 − 20) = 30 min → 12:42:00Z; height diff = 0 + 0.25·(−0.2 − 0) = −0.05 → 1.55 m
  //   HW 18:30: last event, R to the previous LW = 2.50; k = 0.25
  //     time diff = 20 + 0.25·20 = 25 min → 18:55:00Z; height diff = −0.2 + 0.25·(−0.2) = −0.25 → 3.85 m
  const refEvents: TideEvent[] = [
    { time: at('2027-01-10T06:00:00Z'), type: 'high', height: 4.6 },
    { time: at('2027-01-10T12:12:00Z'), type: 'low', height: 1.6 },
    { time: at('2027-01-10T18:30:00Z'), type: 'high', height: 4.1 },
  ];

  it('has the round mean ranges of the worked example', () => {
    expect(springNeapRanges(reference)).toEqual({ springs: 4, neaps: 2 });
    expect(springNeapFactor(3, 4, 2)).toBeCloseTo(0.5, 12);
  });

  it('shifts times on UTC instants and heights by the interpolated differences', () => {
    const out = secondaryEventsFrom(refEvents, reference, secondary);
    expect(out.map((e) => new Date(e.time).toISOString())).toEqual([
      '2027-01-10T06:30:00.000Z', '2027-01-10T12:42:00.000Z', '2027-01-10T18:55:00.000Z',
    ]);
    expect(out.map((e) => e.type)).toEqual(['high', 'low', 'high']);
    expect(firstOf(out, 'out').height).toBeCloseTo(4.3, 9);
    expect(itemAt(out, 1, 'out').height).toBeCloseTo(1.55, 9);
    expect(itemAt(out, 2, 'out').height).toBeCloseTo(3.85, 9);
  });

  it('extrapolates linearly outside springs and neaps', () => {
    // By hand: R = 5.0 → k = (5 − 2)/2 = 1.5; LW time diff = 20 + 1.5·40 = 80 min; height diff = 1.5·(−0.2) = −0.30.
    // R = 1.0 → k = −0.5; HW time diff = 20 − 0.5·20 = 10 min; height diff = −0.2 − 0.5·(−0.2) = −0.10.
    const events: TideEvent[] = [
      { time: at('2027-02-01T00:00:00Z'), type: 'low', height: 0.5 },
      { time: at('2027-02-01T06:00:00Z'), type: 'high', height: 5.5 },
      { time: at('2027-02-01T12:00:00Z'), type: 'low', height: 4.5 },
    ];
    const out = secondaryEventsFrom(events, reference, secondary);
    expect(new Date(firstOf(out, 'out').time).toISOString()).toBe('2027-02-01T01:20:00.000Z');
    expect(firstOf(out, 'out').height).toBeCloseTo(0.2, 9);
    expect(new Date(itemAt(out, 1, 'out').time).toISOString()).toBe('2027-02-01T06:10:00.000Z');
    expect(itemAt(out, 1, 'out').height).toBeCloseTo(5.4, 9);
    expect(interpolateDifference({ time: 20, height: 0 }, { time: 60, height: -0.2 }, 1.5).time).toBeCloseTo(80, 12);
  });

  it('rejects a reference port without S2 (springs and neaps cannot be told apart)', () => {
    const noS2: ReferenceStation = { ...reference, constituents: { M2: { amplitude: 1.5, phase: 100 } } };
    expect(() => secondaryEventsFrom(refEvents, noS2, secondary)).toThrow(StationFileError);
  });
});

describe('reference of a secondary port', () => {
  const set = (...stations: Station[]) => ({ byId: new Map(stations.map((s) => [s.id, s] as const)) });

  it('finds the reference port', () => {
    expect(referencePortOf(secondary, set(reference, secondary))).toBe(reference);
  });

  it('rejects a missing reference, a secondary reference and a cycle, naming the field', () => {
    expect(() => referencePortOf(secondary, set(secondary))).toThrow(/reference: no station with id "round-harbour"/);
    const middle: SecondaryStation = { ...secondary, id: 'round-harbour', reference: 'elsewhere' };
    expect(() => referencePortOf(secondary, set(secondary, middle))).toThrow(/is itself a secondary port/);
    const loopA: SecondaryStation = { ...secondary, id: 'a', reference: 'b' };
    const loopB: SecondaryStation = { ...secondary, id: 'b', reference: 'a' };
    expect(() => referencePortOf(loopA, set(loopA, loopB))).toThrow(/loops back/);
    try {
      referencePortOf(secondary, set(secondary));
    } catch (err) {
      expect(err).toBeInstanceOf(StationFileError);
      expect((err as StationFileError).field).toBe('reference');
    }
  });
});
