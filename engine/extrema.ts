// High and low waters: the zeros of the rate of rise h′(t) of the prediction kernel where it changes sign.
//
// Every true extremum of the harmonic sum is reported, however small: a stand with a tiny wiggle gives a
// high, a low and a high seconds to minutes apart, because that is what the predicted curve does (a
// publication may choose to merge them; the engine does not hide them). A horizontal inflection (h′
// touching zero without changing sign) is not an extremum and gives no event.
//
// Method. Each day window of the kernel is scanned on a grid where the fastest constituent turns
// GRID_TURN radians per step, with h′ and h″ at every grid point from the phasor recurrence. With
// M = Σ|λ|³·fH, a bound on |h‴|, an interval is proved free of zeros of h′ (a second-order bound from both
// ends) or proved to hold exactly one (h′ changes sign while h″ provably keeps its sign). Any other
// interval is expanded in a Taylor series about its midpoint (exact to rounding: the grid turn is small)
// and bisected on that polynomial under the same two proofs until each piece is settled. Roots are then
// polished by Newton's method inside the bracket, with bisection as the fallback, to 1e-8 h (36 µs).

import { MS_PER_DAY, newWindow, type PhasorWindow, type Predictor } from './predict.js';
import type { TideEvent } from './types.js';

const MS_PER_HOUR = 3_600_000;
const GRID_TURN = 1; // radians of the fastest constituent per grid step
const ROOT_TOLERANCE_H = 1e-8; // polishing stops when the bracket is this narrow (hours)
const SPLIT_FLOOR_H = 1e-6; // pieces narrower than 3.6 ms are not split further

/** Zeros of h′ cannot lie in [0, L] (measured from a) when both ends and the curvature bound say so. */
function provedNoZero(da: number, db: number, ca: number, cb: number, L: number, M: number): boolean {
  const slack = (M * L * L) / 8;
  if (da > 0 && db > 0) return da + (ca * L) / 2 - slack > 0 && db - (cb * L) / 2 - slack > 0;
  if (da < 0 && db < 0) return -da - (ca * L) / 2 - slack > 0 && -db + (cb * L) / 2 - slack > 0;
  return false;
}

/** h″ keeps one sign on the interval, so h′ is monotone there. */
function provedMonotone(ca: number, cb: number, L: number, M: number): boolean {
  if (ca > 0 && cb > 0) return ca + cb - M * L > 0;
  if (ca < 0 && cb < 0) return -ca - cb - M * L > 0;
  return false;
}

/** Taylor polynomial of the oscillating part of h about an interval's midpoint, with h′ and h″. */
interface Taylor {
  coef: Float64Array; // h(mid + τ) − Z0 = Σ coef[n]·τⁿ, τ in hours
  degree: number;
  value: number; // results of the last evaluate()
  d1: number;
  d2: number;
}

function evaluate(p: Taylor, tau: number): void {
  const a = p.coef;
  let v = a[p.degree]!;
  let d1 = 0;
  let d2 = 0;
  for (let n = p.degree - 1; n >= 0; n--) {
    d2 = d2 * tau + d1;
    d1 = d1 * tau + v;
    v = v * tau + a[n]!;
  }
  p.value = v;
  p.d1 = d1;
  p.d2 = 2 * d2;
}

/** Newton's method inside a bracket [lo, hi] of h′, bisection when a step leaves it. */
function polishRoot(p: Taylor, lo: number, hi: number, dlo: number, dhi: number): number {
  const rising = dlo > 0;
  let x = dhi !== dlo ? lo - (dlo * (hi - lo)) / (dhi - dlo) : (lo + hi) / 2;
  if (!(x > lo && x < hi)) x = (lo + hi) / 2;
  for (let iter = 0; iter < 200 && hi - lo > ROOT_TOLERANCE_H; iter++) {
    evaluate(p, x);
    if (p.d1 > 0 === rising) lo = x;
    else hi = x;
    const step = p.d2 !== 0 ? p.d1 / p.d2 : Infinity;
    const next = x - step;
    if (Math.abs(step) < ROOT_TOLERANCE_H / 4 && next > lo && next < hi) return next;
    x = next > lo && next < hi ? next : (lo + hi) / 2;
  }
  return (lo + hi) / 2;
}

interface Scratch {
  X: Float64Array;
  Y: Float64Array;
  D: Float64Array;
  C: Float64Array;
  halfC: Float64Array;
  halfS: Float64Array;
  taylor: Taylor;
  stack: number[];
}

/** All high and low waters in [start, end) (UTC ms), in time order. */
export function findExtrema(predictor: Predictor, start: number, end: number): TideEvent[] {
  const events: TideEvent[] = [];
  const n = predictor.names.length;
  if (!(end > start) || n === 0) return events;
  const maxSteps = Math.max(1, Math.ceil((24 * predictor.fastestSpeed) / GRID_TURN));
  const scratch: Scratch = {
    X: new Float64Array(n * (maxSteps + 1)),
    Y: new Float64Array(n * (maxSteps + 1)),
    D: new Float64Array(maxSteps + 1),
    C: new Float64Array(maxSteps + 1),
    halfC: new Float64Array(n),
    halfS: new Float64Array(n),
    taylor: { coef: new Float64Array(64), degree: 0, value: 0, d1: 0, d2: 0 },
    stack: [],
  };
  const w = newWindow(n);
  let carried: number | null = null; // h′ at the end of the previous window: the one value both windows use
  for (let ws = start; ws < end; ws += MS_PER_DAY) {
    const we = Math.min(ws + MS_PER_DAY, end);
    carried = scanWindow(predictor, predictor.window(ws, we, w), scratch, carried, events);
  }
  return events.filter((e) => e.time >= start && e.time < end);
}

function scanWindow(
  predictor: Predictor,
  w: PhasorWindow,
  s: Scratch,
  carried: number | null,
  events: TideEvent[],
): number {
  const n = w.re.length;
  const L = (w.end - w.start) / MS_PER_HOUR;
  const steps = Math.max(1, Math.ceil((L * predictor.fastestSpeed) / GRID_TURN));
  const dt = L / steps;
  const cols = steps + 1;
  const { X, Y, D, C, halfC, halfS } = s;
  D.fill(0, 0, cols);
  C.fill(0, 0, cols);
  let M = 0;
  let fastestRate = 0;
  for (let k = 0; k < n; k++) {
    const beta = w.beta[k]!;
    const omega = w.omega[k]!;
    const rate = Math.sqrt(beta * beta + omega * omega);
    fastestRate = Math.max(fastestRate, rate);
    const size = Math.sqrt(w.re[k]! * w.re[k]! + w.im[k]! * w.im[k]!);
    M += rate * rate * rate * size * (1 + 2 * Math.abs(beta) * L); // bounds e^{|β|L}: |β|L < 1e-3
    const half = (beta * dt) / 2;
    const g = 1 + half * (1 + half / 2); // e^{β·dt/2}, |β·dt/2| < 1e-5
    const hc = g * Math.cos((omega * dt) / 2);
    const hs = g * Math.sin((omega * dt) / 2);
    halfC[k] = hc;
    halfS[k] = hs;
    const rc = hc * hc - hs * hs;
    const rs = 2 * hc * hs;
    // Re(λz) and Re(λ²z) for λ = β + iω
    const a1 = beta;
    const b1 = -omega;
    const a2 = beta * beta - omega * omega;
    const b2 = -2 * beta * omega;
    let x = w.re[k]!;
    let y = w.im[k]!;
    const row = k * cols;
    for (let j = 0; j < cols; j++) {
      X[row + j] = x;
      Y[row + j] = y;
      D[j]! += a1 * x + b1 * y;
      C[j]! += a2 * x + b2 * y;
      const t = x * rc - y * rs;
      y = x * rs + y * rc;
      x = t;
    }
  }
  M *= 1 + 1e-12;
  // Taylor degree: the truncated h″ term (θ/2)^(K−1)/(K−1)! stays below 1e-17 of the sum's size
  const theta = (fastestRate * dt) / 2;
  let degree = 1;
  for (let term = 1; term > 1e-17 && degree < 60; degree++) term *= theta / degree; // term = θ^(degree−1)/(degree−1)!
  degree = Math.max(degree, 4);

  for (let j = 0; j < steps; j++) {
    const da = j === 0 && carried !== null ? carried : D[j]!;
    const db = D[j + 1]!;
    const ca = C[j]!;
    const cb = C[j + 1]!;
    const sameSign = da > 0 === db > 0;
    if (sameSign && provedNoZero(da, db, ca, cb, dt, M)) continue;
    buildTaylor(s, w, n, cols, j, degree);
    isolate(s, predictor.meanLevel, w.start + (j + 0.5) * dt * MS_PER_HOUR, dt, da, db, ca, cb, M, events);
  }
  return D[steps]!;
}

function buildTaylor(s: Scratch, w: PhasorWindow, n: number, cols: number, j: number, degree: number): void {
  const coef = s.taylor.coef;
  coef.fill(0, 0, degree + 1);
  for (let k = 0; k < n; k++) {
    const x0 = s.X[k * cols + j]!;
    const y0 = s.Y[k * cols + j]!;
    // phasor at the midpoint: half a step on from the grid point
    let x = x0 * s.halfC[k]! - y0 * s.halfS[k]!;
    let y = x0 * s.halfS[k]! + y0 * s.halfC[k]!;
    const beta = w.beta[k]!;
    const omega = w.omega[k]!;
    for (let m = 0; m <= degree; m++) {
      coef[m]! += x;
      const t = x * beta - y * omega;
      y = x * omega + y * beta;
      x = t;
    }
  }
  let factorial = 1;
  for (let m = 1; m <= degree; m++) {
    factorial *= m;
    coef[m]! /= factorial;
  }
  s.taylor.degree = degree;
}

/** Settle the interval [mid − L/2, mid + L/2] on the Taylor polynomial; push its events in time order. */
function isolate(
  s: Scratch,
  z0: number,
  midMs: number,
  L: number,
  da: number,
  db: number,
  ca: number,
  cb: number,
  M: number,
  events: TideEvent[],
): void {
  const p = s.taylor;
  const stack = s.stack;
  stack.length = 0;
  stack.push(-L / 2, L / 2, da, db, ca, cb);
  while (stack.length > 0) {
    const chi = stack.pop()!;
    const clo = stack.pop()!;
    const dhi = stack.pop()!;
    const dlo = stack.pop()!;
    const hi = stack.pop()!;
    const lo = stack.pop()!;
    const width = hi - lo;
    if (dlo > 0 === dhi > 0) {
      if (width < SPLIT_FLOOR_H || provedNoZero(dlo, dhi, clo, chi, width, M)) continue;
    } else if (width < SPLIT_FLOOR_H || provedMonotone(clo, chi, width, M)) {
      const tau = polishRoot(p, lo, hi, dlo, dhi);
      evaluate(p, tau);
      events.push({ time: Math.round(midMs + tau * MS_PER_HOUR), type: dlo > 0 ? 'high' : 'low', height: z0 + p.value });
      continue;
    }
    const mid = (lo + hi) / 2;
    evaluate(p, mid);
    const dm = p.d1;
    const cm = p.d2;
    stack.push(mid, hi, dm, dhi, cm, chi); // right half waits
    stack.push(lo, mid, dlo, dm, clo, cm); // left half first: events come out in time order
  }
}
