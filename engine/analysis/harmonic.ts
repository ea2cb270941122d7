// Least-squares harmonic analysis of a gauge record (Pugh 1987, Tides, Surges and Mean Sea-Level, §4.2;
// Godin 1972, The Analysis of Tides): h(t) = Z0 + Σ fⱼ (aⱼ cos(Vⱼ+uⱼ) + bⱼ sin(Vⱼ+uⱼ)), then Hⱼ = hypot(aⱼ, bⱼ),
// gⱼ = atan2(bⱼ, aⱼ), since fH cos(V+u−g) = fH cos g cos(V+u) + fH sin g sin(V+u).

import { RecordFileError } from '../errors.js';
import { constituentSpeed } from '../constituents.js';
import { checkAnalysable, summariseRecord, type RecordSummary } from './coverage.js';
import { designRows } from './design.js';
import { applicableInferences, type InferenceRule } from './inference.js';
import { addObservation, createNormalEquations, SingularSystemError, solveNormalEquations } from './leastsquares.js';
import { selectConstituents, separationHours, type ExcludedConstituent } from './rayleigh.js';
import type { GaugeRecord } from './record.js';
import { constituentUncertainty, residualStatistics, type ResidualStatistics } from './statistics.js';
import { firstOf, itemAt, numberAt } from '../item.js';

export interface AnalysedConstituent {
  name: string;
  speed: number; // degrees per hour
  amplitude: number; // H, metres
  phase: number; // g, degrees in [0, 360), UTC
  amplitudeError: number; // 95 % confidence half-width, metres
  phaseError: number; // 95 % confidence half-width, degrees (180 when the phase is undetermined)
  inferred?: { from: string; ratio: number }; // not fitted: the equilibrium ratio to a fitted neighbour
}

export interface HarmonicAnalysis {
  record: GaugeRecord;
  summary: RecordSummary;
  rayleigh: number;
  meanLevel: number; // Z0, metres on the record's zero
  meanLevelError: number; // 95 % half-width
  trend?: { change: number; error: number }; // level change over the record (m, last − first reading) and its 95 % half-width
  constituents: AnalysedConstituent[]; // in order of decreasing amplitude
  excluded: ExcludedConstituent[]; // left out altogether (not inferred)
  residual: ResidualStatistics;
  fitted: Float64Array; // the fitted tide at each reading
}

export interface AnalysisOptions {
  rayleigh?: number; // R of the Rayleigh criterion, default 1
  constituents?: readonly string[]; // a fixed set instead of the Rayleigh choice (benchmarks, tests)
  infer?: boolean; // infer the unseparated constituents that have an equilibrium neighbour (default true)
  trend?: boolean; // fit a straight line beside the mean level (default: when Ssa is not separable)
}

/** Analyses a record into harmonic constants; RecordFileError when the record cannot support it. */
export function analyseRecord(record: GaugeRecord, options: AnalysisOptions = {}): HarmonicAnalysis {
  const rayleigh = options.rayleigh ?? 1;
  const summary = summariseRecord(record);
  checkAnalysable(record, summary, separationHours('M2', 'S2'));
  const selection = options.constituents === undefined
    ? selectConstituents({ spanHours: summary.spanHours, intervalHours: summary.intervalHours, rayleigh })
    : { admitted: [...options.constituents], excluded: [] };
  const names = selection.admitted;
  const inferences: InferenceRule[] = options.infer === false ? [] : applicableInferences(names,
    selection.excluded.filter((e) => e.reason === 'rayleigh').map((e) => e.name));
  const excluded = selection.excluded.filter((e) => !inferences.some((r) => r.name === e.name));
  // Below half a year the seasonal lines (Sa, Ssa) cannot be told from the mean level; what the record
  // shows of them is mostly a slope, taken up by a straight line so it does not leak into Mm, Mf, MSf.
  const withTrend = options.trend ?? selection.excluded.some((e) => e.name === 'Ssa' && e.conflictsWith === 'Z0');
  const rows = designRows(names, inferences, withTrend ? { from: summary.start, to: summary.end } : undefined);
  const size = rows.size;
  const n = record.times.length;
  if (n <= size) {
    throw new RecordFileError(record.file, 'rows',
      `${n} readings cannot determine ${size} unknowns (${names.length} constituents and the mean level)`,
      'supply more readings (hourly or closer spacing) over the record span');
  }
  const equations = createNormalEquations(size);
  const row = new Float64Array(size);
  for (let i = 0; i < n; i++) {
    rows.fill(numberAt(record.times, i, 'times'), row);
    addObservation(equations, row, numberAt(record.heights, i, 'heights'));
  }
  let solution;
  try {
    solution = solveNormalEquations(equations);
  } catch (error) {
    if (!(error instanceof SingularSystemError)) throw error;
    const name = error.index === 0 ? 'the mean level'
      : error.index === 1 + 2 * names.length ? 'the change of level over the record' : itemAt(names, (error.index - 1) >> 1, 'names');
    throw new RecordFileError(record.file, 'time',
      `the readings' gaps leave ${name} indistinguishable from the other constituents`,
      'analyse a record with fewer or shorter gaps, or raise --rayleigh to fit fewer constituents');
  }
  const x = solution.coefficients;
  const fitted = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    rows.fill(numberAt(record.times, i, 'times'), row);
    let sum = 0;
    for (let k = 0; k < size; k++) sum += numberAt(row, k, 'row') * numberAt(x, k, 'x');
    fitted[i] = sum;
  }
  const residual = residualStatistics(record, fitted, size);
  const variance = residual.standardError ** 2;
  const constituents: AnalysedConstituent[] = names.map((name, j) => {
    const ia = 1 + 2 * j;
    const u = constituentUncertainty(numberAt(x, ia, 'x'), numberAt(x, ia + 1, 'x'), solution.inverse, size, ia, variance);
    return { name, speed: constituentSpeed(name), ...u };
  });
  for (const r of inferences) {
    const from = constituents.find((c) => c.name === r.from)!;
    constituents.push({
      name: r.name,
      speed: constituentSpeed(r.name),
      amplitude: r.ratio * from.amplitude,
      phase: from.phase,
      amplitudeError: r.ratio * from.amplitudeError,
      phaseError: from.phaseError,
      inferred: { from: r.from, ratio: r.ratio },
    });
  }
  constituents.sort((p, q) => q.amplitude - p.amplitude);
  return {
    record,
    summary,
    rayleigh,
    meanLevel: firstOf(x, 'x'),
    meanLevelError: 1.96 * Math.sqrt(variance * firstOf(solution.inverse, 'inverse')),
    ...(withTrend ? { trend: { change: numberAt(x, size - 1, 'x'), error: 1.96 * Math.sqrt(variance * numberAt(solution.inverse, size * size - 1, 'inverse')) } } : {}),
    constituents,
    excluded,
    residual,
    fitted,
  };
}
