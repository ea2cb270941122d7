import { describe, expect, it } from 'vitest';
import { analyseRecord } from '../../engine/analysis/harmonic.js';
import { referenceStationFrom, referenceStationYaml } from '../../engine/analysis/station-yaml.js';
import { compilePredictor } from '../../engine/predict.js';
import { parseStation } from '../../engine/stations.js';
import type { ReferenceStation } from '../../engine/types.js';
import { DAY, HOUR, degrade, evenTimes, recordOf } from '../fixtures/analysis-records.js';
import { entryOf, itemAt } from '../../engine/index.js';

// Invented constants (realistic in magnitude, with overtides); the check is self-consistency:
// the engine predicts a record from them, the analysis must give them back.
const known: ReferenceStation = {
  id: 'roundtrip-quay',
  name: 'Round-trip Quay (invented)',
  kind: 'reference',
  position: { latitude: 47.2, longitude: -15.9 },
  timezone: 'Europe/Lisbon',
  datum: 'Chart Datum',
  mean_level: 2.52,
  constituents: {
    M2: { amplitude: 1.734, phase: 211.6 },
    S2: { amplitude: 0.592, phase: 258.0 },
    N2: { amplitude: 0.312, phase: 117.4 },
    K2: { amplitude: 0.154, phase: 175.1 },
    K1: { amplitude: 0.081, phase: 101.3 },
    O1: { amplitude: 0.068, phase: 331.9 },
    P1: { amplitude: 0.025, phase: 95.0 },
    Q1: { amplitude: 0.021, phase: 290.4 },
    M4: { amplitude: 0.105, phase: 46.7 },
    MS4: { amplitude: 0.061, phase: 101.2 },
    MN4: { amplitude: 0.038, phase: 22.5 },
    M6: { amplitude: 0.021, phase: 250.0 },
    Mf: { amplitude: 0.012, phase: 200.0 },
    Ssa: { amplitude: 0.030, phase: 280.0 },
  },
  provenance: 'Invented for the round-trip test',
};

const START = Date.UTC(2027, 0, 1);
const phaseGap = (a: number, b: number): number => Math.abs(((a - b + 540) % 360) - 180);

function predicted(station: ReferenceStation, days: number, stepMs: number) {
  const count = Math.floor((days * DAY) / stepMs) + 1;
  return recordOf(evenTimes(START, stepMs, count), compilePredictor(station).heights(START, stepMs, count));
}

describe('round trip: constants → compilePredictor → record → analysis → constants', () => {
  it('a year, hourly, with gaps: every constant back to 1 mm and 0.5°', () => {
    const record = degrade(predicted(known, 366, HOUR), { sigma: 0, seed: 21, dropShare: 0.1, blockFrom: START + 200 * DAY, blockTo: START + 215 * DAY });
    const a = analyseRecord(record);
    expect(a.meanLevel).toBeCloseTo(known.mean_level, 3);
    for (const [name, k] of Object.entries(known.constituents)) {
      const got = a.constituents.find((c) => c.name === name)!;
      expect(Math.abs(got.amplitude - k.amplitude), name).toBeLessThan(0.001);
      expect(phaseGap(got.phase, k.phase), name).toBeLessThan(0.5);
    }
    // Constituents not in the record come out near zero
    for (const c of a.constituents.filter((x) => !(x.name in known.constituents))) {
      expect(c.amplitude, c.name).toBeLessThan(0.001);
    }
    expect(a.residual.rms).toBeLessThan(0.001);
  });

  it('a month at 10-minute steps: the constituents it separates come back to 1 mm and 0.5°', () => {
    const separable = ['M2', 'S2', 'N2', 'K1', 'O1', 'Q1', 'M4', 'MS4', 'MN4', 'M6'];
    const station: ReferenceStation = {
      ...known,
      constituents: Object.fromEntries(separable.map((n) => [n, entryOf(known.constituents, n, 'constituents')])),
    };
    // without inference: this port has no K2, L2 or P1 for their neighbours to carry (see analysis-inference.test.ts)
    const a = analyseRecord(predicted(station, 32, 10 * 60_000), { infer: false });
    for (const name of separable) {
      const got = a.constituents.find((c) => c.name === name)!;
      expect(Math.abs(got.amplitude - entryOf(station.constituents, name, 'constituents').amplitude), name).toBeLessThan(0.001);
      expect(phaseGap(got.phase, entryOf(station.constituents, name, 'constituents').phase), name).toBeLessThan(0.5);
    }
  });

  it('the YAML written parses with the station loader and predicts the record again', () => {
    const record = predicted(known, 366, HOUR);
    const a = analyseRecord(record);
    const meta = { id: known.id, name: known.name, latitude: 47.2, longitude: -15.9, timezone: 'Europe/Lisbon', datum: 'Chart Datum' };
    const text = referenceStationYaml(a, meta);
    const loaded = parseStation(text, 'roundtrip.yaml');
    expect(loaded).toMatchObject({ ...referenceStationFrom(a, meta), sourceFile: expect.anything() });
    if (loaded.kind !== 'reference') throw new Error('expected a reference port');
    const again = compilePredictor(loaded).heights(START, HOUR, 24 * 60);
    let worst = 0;
    for (let i = 0; i < again.length; i++) worst = Math.max(worst, Math.abs(itemAt(again, i, 'again') - itemAt(record.heights, i, 'heights')));
    expect(worst).toBeLessThan(0.003); // rounding of the file: 0.1 mm per amplitude, 0.01° per phase
    expect(text).toMatch(/^# Harmonic constants of Round-trip Quay \(invented\)/);
    expect(text.replace(/\n# /g, ' ')).toContain('Astronomical predictions only.');
  });
});
