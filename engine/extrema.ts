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

import { newPhasorWindow, type PhasorWindow, type Predictor } from './predict.js';
import { IndexOutOfRangeError, itemAt, numberAt } from './item.js';
import type { TideEvent } from './types.js';

const MS_PER_HOUR = 3_600_000;
const MS_PER_DAY = 86_400_000; // windows of the kernel are at most a day long
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
  let v = numberAt(a, p.degree, 'taylor coefficients');
  let d1 = 0;
  let d2 = 0;
  for (let n = p.degree - 1; n >= 0; n--) {
    d2 = d2 * tau + d1;
    d1 = d1 * tau + v;
    v = v * tau + numberAt(a, n, 'taylor coefficients');
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
  X: Float64Array; // phasor of constituent k at grid point j: X[k·cols + j] + i·Y[k·cols + j]
  Y: Float64Array;
  H: Float64Array; // h − Z0 at the grid points
  D: Float64Array; // h′ at the grid points
  C: Float64Array; // h″ at the grid points
  // per constituent, padded with zeros to a multiple of four: start phasor, step rotation, half step,
  // coefficients of Re(λz) and Re(λ²z) for λ = β + iω, and the Taylor degree it needs
  re: Float64Array;
  im: Float64Array;
  rc: Float64Array;
  rs: Float64Array;
  halfC: Float64Array;
  halfS: Float64Array;
  a1: Float64Array;
  b1: Float64Array;
  a2: Float64Array;
  b2: Float64Array;
  degree: Float64Array; // whole numbers
  taylor: Taylor;
  stack: Float64Array;
}

/** All high and low waters in [start, end) (UTC ms), in time order. */
export function findExtrema(predictor: Predictor, start: number, end: number): TideEvent[] {
  return scanTides(predictor, start, end, []).events;
}

/** High and low waters, and where the curve crosses each level, found in one pass. */
export interface TideScan {
  events: TideEvent[];
  /** Per level: whether h ≥ level at `start`, and every instant in [start, end) where that changes, in time order. */
  levels: LevelCrossings[];
}

export interface LevelCrossings {
  level: number;
  aboveAtStart: boolean;
  times: number[];
}

/**
 * High and low waters in [start, end) and the crossings of each level, in one pass over the kernel.
 * Between consecutive breakpoints (the grid points and the high and low waters) the curve is monotone,
 * so it crosses a level there at most once, exactly when the level lies between the two heights; that
 * crossing is found on the interval's Taylor polynomial (Newton's method inside the bracket, bisection
 * as the fallback) to ROOT_TOLERANCE_H.
 */
export function scanTides(predictor: Predictor, start: number, end: number, levels: readonly number[]): TideScan {
  const events: TideEvent[] = [];
  const n = predictor.names.length;
  const crossings: LevelState[] = levels.map((level) => ({
    level, above: false, aboveAtStart: false, times: [],
  }));
  const walk: Walk = { started: false, lastTime: start, lastHeight: 0 };
  const result = (): TideScan => ({
    events: events.filter((e) => e.time >= start && e.time < end),
    levels: crossings.map((c) => ({
      level: c.level,
      aboveAtStart: walk.started ? c.aboveAtStart : predictor.heightAt(start) >= c.level,
      times: c.times.filter((t) => t >= start && t < end),
    })),
  });
  if (!(end > start) || n === 0) return result();
  const padded = Math.ceil(n / 4) * 4;
  const cols = Math.max(1, Math.ceil((24 * predictor.fastestSpeed) / GRID_TURN)) + 1;
  const perConstituent = () => new Float64Array(padded);
  const scratch: Scratch = {
    X: new Float64Array(padded * cols),
    Y: new Float64Array(padded * cols),
    H: new Float64Array(cols),
    D: new Float64Array(cols),
    C: new Float64Array(cols),
    re: perConstituent(),
    im: perConstituent(),
    rc: perConstituent(),
    rs: perConstituent(),
    halfC: perConstituent(),
    halfS: perConstituent(),
    a1: perConstituent(),
    b1: perConstituent(),
    a2: perConstituent(),
    b2: perConstituent(),
    degree: new Float64Array(padded),
    taylor: { coef: new Float64Array(64), degree: 0, value: 0, d1: 0, d2: 0 },
    stack: new Float64Array(6 * 64),
  };
  const w = newPhasorWindow(n);
  let carried: number | null = null; // h′ at the end of the previous window: the one value both windows use
  for (let ws = start; ws < end; ws += MS_PER_DAY) {
    const we = Math.min(ws + MS_PER_DAY, end);
    carried = scanWindow(predictor, predictor.window(ws, we, w), scratch, carried, events, crossings, walk);
  }
  return result();
}

/** A level's state as the scan walks the breakpoints. */
interface LevelState {
  level: number;
  above: boolean; // h ≥ level at the last breakpoint
  aboveAtStart: boolean;
  times: number[];
}

/** The last breakpoint the scan passed. */
interface Walk {
  started: boolean;
  lastTime: number; // UTC ms
  lastHeight: number; // h − Z0
}


function scanWindow(
  predictor: Predictor,
  w: PhasorWindow,
  s: Scratch,
  carried: number | null,
  events: TideEvent[],
  levels: LevelState[],
  walk: Walk,
): number {
  const n = w.re.length;
  const L = (w.end - w.start) / MS_PER_HOUR;
  const steps = Math.max(1, Math.ceil((L * predictor.fastestSpeed) / GRID_TURN));
  const dt = L / steps;
  const cols = steps + 1;
  let M = 0;
  let curvature = 0;
  for (let k = 0; k < n; k++) {
    const beta = numberAt(w.beta, k, 'growth rates');
    const omega = numberAt(w.omega, k, 'speeds');
    const re = numberAt(w.re, k, 'phasors');
    const im = numberAt(w.im, k, 'phasors');
    const rate = Math.sqrt(beta * beta + omega * omega);
    const size = Math.sqrt(re * re + im * im) * (1 + 2 * Math.abs(beta) * L); // e^{|β|L} < 1 + 2|β|L
    M += rate * rate * rate * size;
    curvature += rate * rate * size;
    const half = (beta * dt) / 2;
    const g = 1 + half * (1 + half / 2); // e^{β·dt/2}, |β·dt/2| < 1e-5
    const hc = g * Math.cos((omega * dt) / 2);
    const hs = g * Math.sin((omega * dt) / 2);
    s.re[k] = re;
    s.im[k] = im;
    s.halfC[k] = hc;
    s.halfS[k] = hs;
    s.rc[k] = hc * hc - hs * hs;
    s.rs[k] = 2 * hc * hs;
    s.a1[k] = beta;
    s.b1[k] = -omega;
    s.a2[k] = beta * beta - omega * omega;
    s.b2[k] = -2 * beta * omega;
  }
  M *= 1 + 1e-12;
  // Taylor degree of each constituent: its dropped terms move h″ by under 1e-13 of Σ|λ|²fH (and h by
  // less still: far below a micrometre, a microsecond)
  const theta = dt / 2;
  for (let k = 0; k < n; k++) {
    const a1 = numberAt(s.a1, k, 'rate coefficients');
    const b1 = numberAt(s.b1, k, 'rate coefficients');
    const re = numberAt(s.re, k, 'phasors');
    const im = numberAt(s.im, k, 'phasors');
    const rate = Math.sqrt(a1 * a1 + b1 * b1);
    let term = rate * rate * Math.sqrt(re * re + im * im); // |λ|²A·(|λ|θ)^(K−1)/(K−1)!
    let degree = 1;
    while (term > 1e-13 * curvature && degree < 60) term *= (rate * theta) / degree++;
    s.degree[k] = Math.max(degree, 2);
  }
  scanGrid(s, cols);

  const { D, C, H } = s;
  const z0 = predictor.meanLevel;
  if (!walk.started && levels.length > 0) {
    const h0 = numberAt(H, 0, 'grid heights');
    for (const c of levels) c.above = c.aboveAtStart = z0 + h0 >= c.level;
    walk.started = true;
    walk.lastTime = w.start;
    walk.lastHeight = h0;
  }
  const piece: Piece = { s, w, n, cols, j: 0, built: false, midMs: 0, z0 };
  for (let j = 0; j < steps; j++) {
    const da = j === 0 && carried !== null ? carried : numberAt(D, j, 'grid rates');
    const db = numberAt(D, j + 1, 'grid rates');
    const ca = numberAt(C, j, 'grid curvatures');
    const cb = numberAt(C, j + 1, 'grid curvatures');
    piece.j = j;
    piece.built = false;
    piece.midMs = w.start + (j + 0.5) * dt * MS_PER_HOUR;
    if (!(da > 0 === db > 0 && provedNoZero(da, db, ca, cb, dt, M))) {
      buildTaylor(s, w, n, cols, j);
      piece.built = true;
      const first = events.length;
      isolate(s, z0, piece.midMs, dt, da, db, ca, cb, M, events);
      for (let e = first; e < events.length && levels.length > 0; e++) {
        const event = itemAt(events, e, 'events of the piece');
        passBreakpoint(piece, levels, walk, event.time, event.height - z0);
      }
    }
    if (levels.length > 0) passBreakpoint(piece, levels, walk, w.start + (j + 1) * dt * MS_PER_HOUR, numberAt(H, j + 1, 'grid heights'));
  }
  return numberAt(D, steps, 'grid rates');
}

/** The grid interval being scanned, with its Taylor polynomial once built. */
interface Piece {
  s: Scratch;
  w: PhasorWindow;
  n: number;
  cols: number;
  j: number;
  built: boolean;
  midMs: number; // the polynomial's origin
  z0: number;
}

/** Moves the walk on to the next breakpoint (t, h − Z0), recording each level crossed since the last. */
function passBreakpoint(piece: Piece, levels: LevelState[], walk: Walk, t: number, h: number): void {
  for (const c of levels) {
    const above = piece.z0 + h >= c.level;
    if (above === c.above) continue;
    if (!piece.built) {
      buildTaylor(piece.s, piece.w, piece.n, piece.cols, piece.j);
      piece.built = true;
    }
    const target = c.level - piece.z0;
    const tau = crossingOnPolynomial(
      piece.s.taylor, (walk.lastTime - piece.midMs) / MS_PER_HOUR, (t - piece.midMs) / MS_PER_HOUR,
      walk.lastHeight - target, h - target, target,
    );
    c.times.push(Math.round(piece.midMs + tau * MS_PER_HOUR));
    c.above = above;
  }
  walk.lastTime = t;
  walk.lastHeight = h;
}

/** Root of p(τ) = target in [lo, hi], where p − target is flo at lo and fhi at hi (opposite signs or zero). */
function crossingOnPolynomial(p: Taylor, lo: number, hi: number, flo: number, fhi: number, target: number): number {
  if (flo === 0) return lo;
  if (fhi === 0) return hi;
  const rising = fhi > 0;
  let x = lo + ((hi - lo) * flo) / (flo - fhi); // where the chord crosses
  if (!(x > lo && x < hi)) x = (lo + hi) / 2;
  for (let iter = 0; iter < 200 && hi - lo > ROOT_TOLERANCE_H; iter++) {
    evaluate(p, x);
    const f = p.value - target;
    if (f === 0) return x;
    if (f > 0 === rising) hi = x;
    else lo = x;
    const step = p.d1 !== 0 ? f / p.d1 : Infinity;
    const next = x - step;
    if (Math.abs(step) < ROOT_TOLERANCE_H / 4 && next > lo && next < hi) return next;
    x = next > lo && next < hi ? next : (lo + hi) / 2;
  }
  return (lo + hi) / 2;
}

/** Phasors, h, h′ and h″ at every grid point: four constituents at a time, four independent recurrences. */
function scanGrid(s: Scratch, cols: number): void {
  const { X, Y, H, D, C } = s;
  H.fill(0, 0, cols);
  D.fill(0, 0, cols);
  C.fill(0, 0, cols);
  for (let k = 0; k < s.re.length; k += 4) {
    // Spelled out read by read: a helper returning the four as a tuple measured ~50 % slower here.
    let x0 = numberAt(s.re, k, 'phasors'), x1 = numberAt(s.re, k + 1, 'phasors');
    let x2 = numberAt(s.re, k + 2, 'phasors'), x3 = numberAt(s.re, k + 3, 'phasors');
    let y0 = numberAt(s.im, k, 'phasors'), y1 = numberAt(s.im, k + 1, 'phasors');
    let y2 = numberAt(s.im, k + 2, 'phasors'), y3 = numberAt(s.im, k + 3, 'phasors');
    const c0 = numberAt(s.rc, k, 'step turns'), c1 = numberAt(s.rc, k + 1, 'step turns');
    const c2 = numberAt(s.rc, k + 2, 'step turns'), c3 = numberAt(s.rc, k + 3, 'step turns');
    const s0 = numberAt(s.rs, k, 'step turns'), s1 = numberAt(s.rs, k + 1, 'step turns');
    const s2 = numberAt(s.rs, k + 2, 'step turns'), s3 = numberAt(s.rs, k + 3, 'step turns');
    const p0 = numberAt(s.a1, k, 'rate coefficients'), p1 = numberAt(s.a1, k + 1, 'rate coefficients');
    const p2 = numberAt(s.a1, k + 2, 'rate coefficients'), p3 = numberAt(s.a1, k + 3, 'rate coefficients');
    const q0 = numberAt(s.b1, k, 'rate coefficients'), q1 = numberAt(s.b1, k + 1, 'rate coefficients');
    const q2 = numberAt(s.b1, k + 2, 'rate coefficients'), q3 = numberAt(s.b1, k + 3, 'rate coefficients');
    const u0 = numberAt(s.a2, k, 'curvature coefficients'), u1 = numberAt(s.a2, k + 1, 'curvature coefficients');
    const u2 = numberAt(s.a2, k + 2, 'curvature coefficients'), u3 = numberAt(s.a2, k + 3, 'curvature coefficients');
    const v0 = numberAt(s.b2, k, 'curvature coefficients'), v1 = numberAt(s.b2, k + 1, 'curvature coefficients');
    const v2 = numberAt(s.b2, k + 2, 'curvature coefficients'), v3 = numberAt(s.b2, k + 3, 'curvature coefficients');
    const r0 = k * cols, r1 = r0 + cols, r2 = r1 + cols, r3 = r2 + cols;
    for (let j = 0; j < cols; j++) {
      X[r0 + j] = x0; Y[r0 + j] = y0; X[r1 + j] = x1; Y[r1 + j] = y1;
      X[r2 + j] = x2; Y[r2 + j] = y2; X[r3 + j] = x3; Y[r3 + j] = y3;
      // the check is written out, not a call: this is the engine's hottest loop
      const h = H[j], d = D[j], c = C[j];
      if (h === undefined || d === undefined || c === undefined) throw new IndexOutOfRangeError('grid sums', j, D.length);
      H[j] = h + (x0 + x1 + (x2 + x3));
      D[j] = d + (p0 * x0 + q0 * y0 + (p1 * x1 + q1 * y1) + (p2 * x2 + q2 * y2) + (p3 * x3 + q3 * y3));
      C[j] = c + (u0 * x0 + v0 * y0 + (u1 * x1 + v1 * y1) + (u2 * x2 + v2 * y2) + (u3 * x3 + v3 * y3));
      let t = x0 * c0 - y0 * s0;
      y0 = x0 * s0 + y0 * c0;
      x0 = t;
      t = x1 * c1 - y1 * s1;
      y1 = x1 * s1 + y1 * c1;
      x1 = t;
      t = x2 * c2 - y2 * s2;
      y2 = x2 * s2 + y2 * c2;
      x2 = t;
      t = x3 * c3 - y3 * s3;
      y3 = x3 * s3 + y3 * c3;
      x3 = t;
    }
  }
}

/** Taylor coefficients of h − Z0 about the midpoint of grid interval j. */
function buildTaylor(s: Scratch, w: PhasorWindow, n: number, cols: number, j: number): void {
  const coef = s.taylor.coef;
  let degree = 0;
  for (let k = 0; k < n; k++) degree = Math.max(degree, numberAt(s.degree, k, 'taylor degrees'));
  coef.fill(0, 0, degree + 1);
  for (let k = 0; k < n; k++) {
    const x0 = numberAt(s.X, k * cols + j, 'grid phasors');
    const y0 = numberAt(s.Y, k * cols + j, 'grid phasors');
    // phasor at the midpoint: half a step on from the grid point
    let x = x0 * numberAt(s.halfC, k, 'half-step turns') - y0 * numberAt(s.halfS, k, 'half-step turns');
    let y = x0 * numberAt(s.halfS, k, 'half-step turns') + y0 * numberAt(s.halfC, k, 'half-step turns');
    const beta = numberAt(w.beta, k, 'growth rates');
    const omega = numberAt(w.omega, k, 'speeds');
    for (let m = 0, top = numberAt(s.degree, k, 'taylor degrees') | 0; m <= top; m++) {
      const sum = coef[m]; // the check written out, not a call: a hot loop
      if (sum === undefined) throw new IndexOutOfRangeError('taylor coefficients', m, coef.length);
      coef[m] = sum + x;
      const t = x * beta - y * omega;
      y = x * omega + y * beta;
      x = t;
    }
  }
  let factorial = 1;
  for (let m = 1; m <= degree; m++) {
    factorial *= m;
    coef[m] = numberAt(coef, m, 'taylor coefficients') / factorial;
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
  const stack = s.stack; // pieces waiting, six numbers each; halving from a day to SPLIT_FLOOR_H needs < 40
  let top = 0;
  const push = (lo: number, hi: number, dlo: number, dhi: number, clo: number, chi: number) => {
    stack[top] = lo;
    stack[top + 1] = hi;
    stack[top + 2] = dlo;
    stack[top + 3] = dhi;
    stack[top + 4] = clo;
    stack[top + 5] = chi;
    top += 6;
  };
  push(-L / 2, L / 2, da, db, ca, cb);
  while (top > 0) {
    top -= 6;
    const lo = numberAt(stack, top, 'pieces waiting');
    const hi = numberAt(stack, top + 1, 'pieces waiting');
    const dlo = numberAt(stack, top + 2, 'pieces waiting');
    const dhi = numberAt(stack, top + 3, 'pieces waiting');
    const clo = numberAt(stack, top + 4, 'pieces waiting');
    const chi = numberAt(stack, top + 5, 'pieces waiting');
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
    push(mid, hi, dm, dhi, cm, chi); // right half waits
    push(lo, mid, dlo, dm, clo, cm); // left half first: events come out in time order
  }
}
