// High and low waters read off a gauge record, robust against noise: candidates are the highest
// (lowest) point of a lightly smoothed record within ±2 h; each is then refined by a least-squares
// polynomial (cubic when there are enough readings, else quadratic) through the raw readings within
// ±1.25 h, whose turning point gives the time and height (the usual local fit; Pugh 1987, §2.2).

import type { TideEvent } from '../types.js';
import { addObservation, createNormalEquations, SingularSystemError, solveNormalEquations } from './leastsquares.js';
import type { GaugeRecord } from './record.js';

const HOUR = 3_600_000;
const MINUTE = 60_000;

export interface RecordExtremaOptions {
  candidateHalfWidthHours?: number; // window a candidate must dominate, default 2
  fitHalfWidthHours?: number; // readings each side used by the local fit, default 1.25
}

interface Fitted extends TideEvent {
  rms: number; // residual of the local fit, metres
}

function medianStep(times: Float64Array): number {
  const steps: number[] = [];
  for (let i = 1; i < times.length; i++) steps.push(times[i]! - times[i - 1]!);
  steps.sort((a, b) => a - b);
  return steps[steps.length >> 1] ?? HOUR;
}

/** Running mean over ±halfWidth ms (two pointers; irregular spacing allowed). */
function smooth(times: Float64Array, heights: Float64Array, halfWidth: number): Float64Array {
  const out = new Float64Array(times.length);
  let lo = 0, hi = 0, sum = 0;
  for (let i = 0; i < times.length; i++) {
    while (hi < times.length && times[hi]! <= times[i]! + halfWidth) sum += heights[hi++]!;
    while (times[lo]! < times[i]! - halfWidth) sum -= heights[lo++]!;
    out[i] = sum / (hi - lo);
  }
  return out;
}

/** Indices whose smoothed value is the extreme of its ±halfWidth window (first of equals). */
function candidates(times: Float64Array, values: Float64Array, halfWidth: number, sign: 1 | -1): number[] {
  const found: number[] = [];
  let lo = 0;
  for (let i = 0; i < times.length; i++) {
    while (times[lo]! < times[i]! - halfWidth) lo++;
    const v = sign * values[i]!;
    let best = true;
    for (let j = lo; j < times.length && times[j]! <= times[i]! + halfWidth; j++) {
      const w = sign * values[j]!;
      if (w > v || (w === v && j < i)) {
        best = false;
        break;
      }
    }
    if (best) found.push(i);
  }
  return found;
}

/** Local polynomial fit around reading `centre`; the turning point of the right kind, or null. */
function refine(record: GaugeRecord, centre: number, halfWidth: number, step: number, sign: 1 | -1): Fitted | null {
  const { times, heights } = record;
  const t0 = times[centre]!;
  // At least two readings each side: with hourly readings the window widens to ±2 h.
  const reach = Math.max(halfWidth, 2.01 * step);
  let a = centre, b = centre;
  while (a > 0 && times[a - 1]! >= t0 - reach) a--;
  while (b < times.length - 1 && times[b + 1]! <= t0 + reach) b++;
  const count = b - a + 1;
  if (count < 5) return null;
  const degree = count >= 7 ? 3 : 2;
  const eq = createNormalEquations(degree + 1);
  const row = new Float64Array(degree + 1);
  const xOf = (t: number): number => (t - t0) / reach;
  for (let i = a; i <= b; i++) {
    const x = xOf(times[i]!);
    for (let k = 0, p = 1; k <= degree; k++, p *= x) row[k] = p;
    addObservation(eq, row, heights[i]!);
  }
  let c: Float64Array;
  try {
    c = solveNormalEquations(eq).coefficients;
  } catch (error) {
    if (error instanceof SingularSystemError) return null;
    throw error;
  }
  const c1 = c[1]!, c2 = c[2]!, c3 = degree === 3 ? c[3]! : 0;
  // Roots of p'(x) = c1 + 2c2 x + 3c3 x², the one nearest the candidate with p'' of the right sign.
  const roots: number[] = [];
  if (Math.abs(c3) < 1e-12 * Math.abs(c2)) {
    if (c2 !== 0) roots.push(-c1 / (2 * c2));
  } else {
    const disc = 4 * c2 * c2 - 12 * c3 * c1;
    if (disc >= 0) {
      const q = -(2 * c2 + Math.sign(c2 || 1) * Math.sqrt(disc)) / 2; // stable quadratic formula
      roots.push(q / (3 * c3), c1 / q);
    }
  }
  const p = (x: number): number => c[0]! + c1 * x + c2 * x * x + c3 * x * x * x;
  const turning = roots
    .filter((x) => Number.isFinite(x) && Math.abs(x) <= 1 && sign * (2 * c2 + 6 * c3 * x) < 0)
    .sort((u, v) => Math.abs(u) - Math.abs(v))[0];
  if (turning === undefined) return null;
  const time = t0 + turning * reach;
  let before = 0, after = 0, sumSq = 0;
  for (let i = a; i <= b; i++) {
    if (times[i]! < time) before++;
    else after++;
    sumSq += (heights[i]! - p(xOf(times[i]!))) ** 2;
  }
  if (before < 2 || after < 2) return null; // at the edge of the record or of a gap
  return { time: Math.round(time / 1000) * 1000, type: sign === 1 ? 'high' : 'low', height: p(turning), rms: Math.sqrt(sumSq / count) };
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
      const range = Math.abs(list[i]!.height - list[i - 1]!.height);
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
  const fitHalf = (options.fitHalfWidthHours ?? 1.25) * HOUR;
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
