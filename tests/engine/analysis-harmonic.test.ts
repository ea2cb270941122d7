import { describe, expect, it } from 'vitest';
import { RecordFileError } from '../../engine/errors.js';
import { CONSTITUENT_NAMES } from '../../engine/constituents.js';
import { analyseRecord, type HarmonicAnalysis } from '../../engine/analysis/harmonic.js';
import { expectedEquilibriumConstant } from '../fixtures/analysis-equilibrium.js';
import { equilibriumTide, hourlyEphemeris, type Ephemeris } from '../fixtures/engine-equilibrium.js';
import { DAY, HOUR, degrade, evenTimes, gaussian, recordOf, seededRandom } from '../fixtures/analysis-records.js';
import { itemAt } from '../../engine/index.js';

const START = Date.UTC(2026, 0, 1);
const phaseGap = (a: number, b: number): number => Math.abs(((a - b + 540) % 360) - 180);
const constituent = (a: HarmonicAnalysis, name: string) => {
  const c = a.constituents.find((k) => k.name === name);
  if (!c) throw new Error(`${name} not in the analysis`);
  return c;
};

// The strongest outside check: a year of the equilibrium tide computed from astronomy-engine's Moon and
// Sun (Laplace's degree-2 formula, tests/fixtures/engine-equilibrium.ts), with 1 cm of noise, a
// 10-day hole and 5 % of the hours dropped, must give back the equilibrium constants of
// REFERENCE-VALUES §4 (Cartwright and Tayler 1971, from memory) × the latitude factor, g = −k·λ.
describe('analysis of the equilibrium tide from astronomy-engine (REFERENCE-VALUES §4)', () => {
  let eph: Ephemeris | undefined;
  const year = (): Ephemeris => (eph ??= hourlyEphemeris(START, 366 * 24 + 1));

  it.each([
    ['40°N 30°W', 40, -30, 11],
    ['35°S 150°E (diurnal factor negative: g = −λ + 180°)', -35, 150, 12],
  ])('%s: amplitudes within 3 %, phases within 3° for M2, S2, N2, K2, K1, O1, P1, Q1', (_, lat, lon, seed) => {
    const clean = recordOf(evenTimes(START, HOUR, year().hours), equilibriumTide(year(), lat, lon));
    const record = degrade(clean, { sigma: 0.01, seed, dropShare: 0.05, blockFrom: START + 100 * DAY, blockTo: START + 110 * DAY });
    const a = analyseRecord(record);
    for (const name of ['M2', 'S2', 'N2', 'K2', 'K1', 'O1', 'P1', 'Q1']) {
      const want = expectedEquilibriumConstant(name, lat, lon);
      const got = constituent(a, name);
      expect(got.amplitude / want.amplitude, name).toBeGreaterThan(0.97);
      expect(got.amplitude / want.amplitude, name).toBeLessThan(1.03);
      expect(phaseGap(got.phase, want.phase), name).toBeLessThan(3);
    }
    // The long-period Mf is small at these latitudes but its phase (and sign) must still come out right
    const mf = expectedEquilibriumConstant('Mf', lat, lon);
    if (mf.amplitude > 0.004) expect(phaseGap(constituent(a, 'Mf').phase, mf.phase)).toBeLessThan(10);
    expect(a.residual.explained).toBeGreaterThan(0.99);
    expect(a.residual.rms).toBeLessThan(0.012); // the 1 cm of noise and a little unmodelled tide
  });
});

/** h = Z0 + Σ H cos(σt − g′) + noise: plain cosines with constant amplitude, for the statistics checks. */
function cosineRecord(days: number, sigma: number, seed: number) {
  const times = evenTimes(START, HOUR, days * 24 + 1);
  const normal = gaussian(seededRandom(seed));
  const heights = new Float64Array(times.length);
  for (let i = 0; i < times.length; i++) {
    const hours = (itemAt(times, i, 'times') - START) / HOUR;
    heights[i] = 3 + 1.2 * Math.cos((28.9841042 * hours - 40) * Math.PI / 180) + sigma * normal();
  }
  return recordOf(times, heights);
}

describe('uncertainties and residual statistics', () => {
  it('95 % half-widths match the textbook σ_H = σ·√(2/n) for white noise', () => {
    // Pugh (1987) §4.2.4: for n evenly spaced readings with noise σ, each cos/sin coefficient has standard
    // error σ·√(2/n); so σ_H = σ·√(2/n) and σ_g = σ_H / H radians (node factor f ≈ 1 scales both).
    const sigma = 0.05;
    const a = analyseRecord(cosineRecord(60, sigma, 3), { constituents: ['M2', 'S2', 'K1', 'O1'] });
    const n = a.residual.count;
    const m2 = constituent(a, 'M2');
    const expected = 1.96 * sigma * Math.sqrt(2 / n);
    const f = m2.amplitude / 1.2; // the fitted amplitude absorbs 1/f of the node factor
    expect(m2.amplitudeError * f).toBeGreaterThan(0.85 * expected);
    expect(m2.amplitudeError * f).toBeLessThan(1.15 * expected);
    expect(m2.phaseError).toBeCloseTo((m2.amplitudeError / m2.amplitude) * (180 / Math.PI), 1);
    expect(a.residual.rms).toBeGreaterThan(0.9 * sigma);
    expect(a.residual.rms).toBeLessThan(1.1 * sigma);
    expect(a.residual.maxAbs).toBeGreaterThan(2.5 * sigma);
    // variance of 1.2 cos is 0.72; explained share ≈ 0.72 / (0.72 + σ²)
    expect(a.residual.explained).toBeCloseTo(0.72 / (0.72 + sigma * sigma), 3);
    // A constituent that is not in the record comes out at noise level with a wide phase interval
    const k1 = constituent(a, 'K1');
    expect(k1.amplitude).toBeLessThan(3 * k1.amplitudeError);
    expect(k1.phaseError).toBeGreaterThan(20);
  });

  it('notes the constituents a 30-day record cannot separate, and infers those it can', () => {
    const a = analyseRecord(cosineRecord(30, 0.01, 4));
    const names = a.excluded.map((e) => e.name);
    expect(names).toEqual(expect.arrayContaining(['MU2', 'Sa', 'Ssa']));
    expect(a.excluded.find((e) => e.name === 'MU2')).toMatchObject({ conflictsWith: 'N2' });
    expect(names).not.toContain('K2');
    expect(a.constituents.find((c) => c.name === 'K2')).toMatchObject({ inferred: { from: 'S2' } });
    expect(a.constituents.find((c) => c.name === 'P1')).toMatchObject({ inferred: { from: 'K1' } });
    expect(analyseRecord(cosineRecord(30, 0.01, 4), { infer: false }).excluded.map((e) => e.name)).toContain('K2');
    expect(a.summary.spanHours).toBe(720);
  });
});

describe('records the analysis refuses', () => {
  const refusal = (record: ReturnType<typeof recordOf>): RecordFileError => {
    try {
      analyseRecord(record);
    } catch (e) {
      if (e instanceof RecordFileError) return e;
      throw e;
    }
    throw new Error('expected a RecordFileError');
  };

  it('a record shorter than 14.77 days (M2/S2, REFERENCE-VALUES §5)', () => {
    const e = refusal(cosineRecord(14, 0.01, 5));
    expect(e.message).toMatch(/^synthetic\.csv: time: the record spans 14\.00 days .*14\.77 days.*; supply at least 14\.77 days/);
  });

  it('a record with more than half its span missing', () => {
    const full = cosineRecord(60, 0.01, 6);
    const e = refusal(degrade(full, { sigma: 0, seed: 1, blockFrom: START + 5 * DAY, blockTo: START + 40 * DAY }));
    expect(e.problem).toMatch(/^58 % of the record's span has no readings; the longest gap is 35\.0\d days/);
  });

  it('constituents the readings cannot tell apart (the same column twice)', () => {
    const e = (() => {
      try {
        analyseRecord(cosineRecord(30, 0.01, 8), { constituents: ['M2', 'S2', 'M2'] });
      } catch (error) {
        return error as RecordFileError;
      }
      throw new Error('expected a RecordFileError');
    })();
    expect(e).toBeInstanceOf(RecordFileError);
    expect(e.problem).toBe("the readings' gaps leave M2 indistinguishable from the other constituents");
  });

  it('fewer readings than unknowns (a fixed list of every constituent, 3-hourly for 16 days)', () => {
    const times = evenTimes(START, 3 * HOUR, 16 * 8 + 1);
    try {
      analyseRecord(recordOf(times, new Float64Array(times.length)), { constituents: CONSTITUENT_NAMES });
      throw new Error('expected a RecordFileError');
    } catch (e) {
      expect(e).toBeInstanceOf(RecordFileError);
      expect((e as RecordFileError).message).toMatch(/^synthetic\.csv: rows: 129 readings cannot determine 137 unknowns/);
    }
  });
});
