// High and low waters read off a gauge record, robust against noise: candidates are the highest
// (lowest) point of a lightly smoothed record within ±2 h; each is then refined by a least-squares
// cubic through the raw readings within ±1.5 h, fitted again centred on its own turning point, which
// gives the time; the height is read from a quartic centred there. Tried on a curve with a 10 %
// quarter-diurnal overtide, a quadratic timed the turning points 2.3 min off (RMS) against 0.2 min for
// the cubic; with 2 cm of noise both scatter by about 2.6 min, which the differences fit then averages
// over dozens of tides.

import type { TideEvent } from '../types.js';
import { addObservation, createNormalEquations, SingularSystemError, solveNormalEquations } from './leastsquares.js';
import type { GaugeRecord } from './record.js';
import { firstOf, itemAt, numberAt } from '../item.js';

const HOUR = 3_600_000;
const MINUTE = 60_000;

export interface RecordExtremaOptions {
  candidateHalfWidthHours?: number; // window a candidate must dominate, default 2
  fitHalfWidthHours?: number; // readings each side used by the local fit, default 1.5
}

interface Fitted extends TideEvent {
  rms: number; // residual of the local fit, metres
}

function medianStep(times: Float64Array): number {
  const steps: number[] = [];
  for (let i = 1; i < times.length; i++) steps.push(numberAt(times, i, 'times') - numberAt(times, i - 1, 'times'));
  steps.sort((a, b) => a - b);
  return steps[steps.length >> 1] ?? HOUR;
}

/** Running mean over ±halfWidth ms (two pointers; irregular spacing allowed). */
function smooth(times: Float64Array, heights: Float64Array, halfWidth: number): Float64Array {
  const out = new Float64Array(times.length);
  let lo = 0, hi = 0, sum = 0;
  for (let i = 0; i < times.length; i++) {
    while (hi < times.length && numberAt(times, hi, 'times') <= numberAt(times, i, 'times') + halfWidth) sum += numberAt(heights, hi++, 'heights');
    while (numberAt(times, lo, 'times') < numberAt(times, i, 'times') - halfWidth) sum -= numberAt(heights, lo++, 'heights');
    out[i] = sum / (hi - lo);
  }
  return out;
}

/** Indices whose smoothed value is the extreme of its ±halfWidth window (first of equals). */
function candidates(times: Float64Array, values: Float64Array, halfWidth: number, sign: 1 | -1): number[] {
  const found: number[] = [];
  let lo = 0;
  for (let i = 0; i < times.length; i++) {
    while (numberAt(times, lo, 'times') < numberAt(times, i, 'times') - halfWidth) lo++;
    const v = sign * numberAt(values, i, 'values');
    let best = true;
    for (let j = lo; j < times.length && numberAt(times, j, 'times') <= numberAt(times, i, 'times') + halfWidth; j++) {
      const w = sign * numberAt(values, j, 'values');
      if (w > v || (w === v && j < i)) {
        best = false;
        break;
      }
    }
    if (best) found.push(i);
  }
  return found;
}

/** Coefficients of the least-squares polynomial in x = (t − tc)/reach through the readings within ±reach. */
function polynomialFit(record: GaugeRecord, tc: number, reach: number, degree: number): Float64Array | null {
  const { times, heights } = record;
  const a = lowerBound(times, tc - reach);
  const b = lowerBound(times, tc + reach + 1) - 1;
  const eq = createNormalEquations(degree + 1);
  const row = new Float64Array(degree + 1);
  for (let i = a; i <= b; i++) {
    const x = (numberAt(times, i, 'times') - tc) / reach;
    for (let k = 0, p = 1; k <= degree; k++, p *= x) row[k] = p;
    addObservation(eq, row, numberAt(heights, i, 'heights'));
  }
  try {
    return solveNormalEquations(eq).coefficients;
  } catch (error) {
    if (error instanceof SingularSystemError) return null;
    throw error;
  }
}

function readingsWithin(times: Float64Array, tc: number, reach: number): number {
  return lowerBound(times, tc + reach + 1) - lowerBound(times, tc - reach);
}

/**
 * The turning point nearest tc of the least-squares polynomial through the readings within ±reach: a
 * cubic when there are seven readings or more (it follows the asymmetry of a real tide curve), else a
 * quadratic. Null when there is none of the right kind, or not two readings on each side of it.
 */
function turningPoint(record: GaugeRecord, tc: number, reach: number, sign: 1 | -1): number | null {
  const count = readingsWithin(record.times, tc, reach);
  if (count < 5) return null;
  const c = polynomialFit(record, tc, reach, count >= 7 ? 3 : 2);
  if (c === null) return null;
  const c1 = numberAt(c, 1, 'c'), c2 = numberAt(c, 2, 'c'), c3 = c[3] ?? 0;
  // Roots of p'(x) = c1 + 2c2·x + 3c3·x²; keep the one nearest tc that curves the right way.
  const roots: number[] = [];
  if (Math.abs(3 * c3) <= 1e-9 * Math.abs(c2)) roots.push(-c1 / (2 * c2));
  else {
    const disc = c2 * c2 - 3 * c3 * c1;
    if (disc >= 0) {
      const q = -(c2 + Math.sign(c2 || 1) * Math.sqrt(disc)); // stable form of the quadratic formula
      roots.push(q / (3 * c3), q !== 0 ? c1 / q : Number.NaN);
    }
  }
  const x = roots
    .filter((r) => Math.abs(r) <= 1 && sign * (2 * c2 + 6 * c3 * r) < 0)
    .sort((u, v) => Math.abs(u) - Math.abs(v))[0];
  if (x === undefined) return null;
  const time = tc + x * reach;
  const before = lowerBound(record.times, time) - lowerBound(record.times, tc - reach);
  return before < 2 || count - before < 2 ? null : time; // not at the edge of the record or of a gap
}

function lowerBound(times: Float64Array, t: number): number {
  let lo = 0, hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (numberAt(times, mid, 'times') < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The high (low) water near reading `centre`. Its time: the turning point of a polynomial over
 * ±halfWidth (at least two readings each side, so ±2 h for hourly readings), found again centred on
 * itself so that an off-centre window does not pull it towards the candidate reading. Its height: the
 * value there of a quartic centred on it when there are nine readings or more (a cubic would fall short
 * of the peak by about 0.1 % of the amplitude, its fourth-order term), else of a quadratic.
 */
function refine(record: GaugeRecord, centre: number, halfWidth: number, step: number, sign: 1 | -1): Fitted | null {
  const reach = Math.max(halfWidth, 2.01 * step);
  let time = turningPoint(record, numberAt(record.times, centre, 'times'), reach, sign);
  for (let pass = 0; pass < 2 && time !== null; pass++) {
    const again = turningPoint(record, time, reach, sign);
    if (again === null) break;
    const moved = Math.abs(again - time);
    time = again;
    if (moved < 1000) break;
  }
  if (time === null) return null;
  const count = readingsWithin(record.times, time, reach);
  const degree = count >= 9 ? 4 : 2;
  const c = polynomialFit(record, time, reach, degree);
  if (c === null) return null;
  const a = lowerBound(record.times, time - reach);
  let sumSq = 0;
  for (let i = a; i < a + count; i++) {
    const x = (numberAt(record.times, i, 'times') - time) / reach;
    let p = 0;
    for (let k = degree; k >= 0; k--) p = p * x + numberAt(c, k, 'c');
    sumSq += (numberAt(record.heights, i, 'heights') - p) ** 2;
  }
  return { time: Math.round(time / 1000) * 1000, type: sign === 1 ? 'high' : 'low', height: firstOf(c, 'c'), rms: Math.sqrt(sumSq / count) };
}

/** Keeps events alternating high/low (the more extreme of a run) and drops wiggles smaller than `minRange`. */
function clean(events: Fitted[], minRange: number): Fitted[] {
  let list = [...events].sort((a, b) => a.time - b.time);
  for (let changed = true; changed;) {
    changed = false;
    const merged: Fitted[] = [];
    for (const e of list) {
      const last = merged[merged.length - 1];
      if (last !== undefined && last.type === e.type) {
        const keepNew = e.type === 'high' ? e.height > last.height : e.height < last.height;
        if (keepNew) merged[merged.length - 1] = e;
        changed = true;
        continue;
      }
      merged.push(e);
    }
    list = merged;
    // The smallest high-low pair below the noise is a wiggle, not two tides: remove both.
    let worst = -1, worstRange = minRange;
    for (let i = 1; i < list.length; i++) {
      const range = Math.abs(itemAt(list, i, 'list').height - itemAt(list, i - 1, 'list').height);
      if (range < worstRange) {
        worstRange = range;
        worst = i;
      }
    }
    if (worst > 0) {
      list.splice(worst - 1, 2);
      changed = true;
    }
  }
  return list;
}

/** High and low waters of a gauge record (UTC ms, metres), in time order. */
export function recordExtrema(record: GaugeRecord, options: RecordExtremaOptions = {}): TideEvent[] {
  const { times, heights } = record;
  if (times.length < 5) return [];
  const step = medianStep(times);
  const smoothed = smooth(times, heights, Math.max(20 * MINUTE, 1.01 * step));
  const window = (options.candidateHalfWidthHours ?? 2) * HOUR;
  const fitHalf = (options.fitHalfWidthHours ?? 1.5) * HOUR;
  const fitted: Fitted[] = [];
  for (const sign of [1, -1] as const) {
    for (const i of candidates(times, smoothed, window, sign)) {
      const e = refine(record, i, fitHalf, step, sign);
      if (e !== null) fitted.push(e);
    }
  }
  const rmsValues = fitted.map((e) => e.rms).sort((a, b) => a - b);
  const noise = rmsValues[rmsValues.length >> 1] ?? 0;
  return clean(fitted, Math.max(0.02, 4 * noise)).map(({ time, type, height }) => ({ time, type, height }));
}
