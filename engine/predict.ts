// Harmonic prediction: h(t) = Z0 + Σ fᵢ Hᵢ cos(Vᵢ(t) + uᵢ(t) − gᵢ) (Schureman 1958).
// The kernel works on windows of at most a day. At both ends of a window V, f and u are evaluated
// exactly; inside it each constituent is the phasor fH·e^{i(V+u−g)} turning at the window's own rate
// (the constituent's speed plus the drift of u) and growing at the window's own rate of f, so the kernel
// meets the exact evaluation at every window end and strays from it by under 1e-7 m in between (the
// curvature of u and f over a day). Series advance the phasors by complex multiplication, which drifts
// by ~1e-13 of the amplitude over a window.

import { normalizeDegrees } from './astro.js';
import { StationFileError } from './errors.js';
import { compileAstronomicalTerms, type AstronomicalTerms } from './nodal.js';
import { findConstituent, CONSTITUENT_NAMES } from './constituents.js';
import type { ReferenceStation } from './types.js';
import { numberAt } from './item.js';

const DEG = Math.PI / 180;
const TWO_PI = 2 * Math.PI;
const MS_PER_HOUR = 3_600_000;
const MS_PER_DAY = 86_400_000;

/** A stretch of the kernel: z_k(t) = (re_k + i·im_k)·e^{(beta_k + i·omega_k)·(t − start)/1 h}. */
export interface PhasorWindow {
  start: number; // UTC ms
  end: number;
  re: Float64Array; // fH cos(V + u − g) at start, metres
  im: Float64Array;
  omega: Float64Array; // radians per hour
  beta: Float64Array; // growth rate of fH, per hour
}

export interface Predictor {
  readonly station: ReferenceStation;
  /** Canonical names of the constituents in the kernel (those with non-zero amplitude). */
  readonly names: readonly string[];
  readonly meanLevel: number;
  /** Speed of the fastest constituent, radians per hour (0 for a station with none). */
  readonly fastestSpeed: number;
  /** Σ H over the constituents, metres: with the largest node factor, a bound on the swing about Z0. */
  readonly amplitudeSum: number;
  heightAt(t: number): number;
  /** Rate of rise, metres per hour: the analytic derivative of the kernel. */
  rateAt(t: number): number;
  heights(start: number, stepMs: number, count: number): Float64Array;
  /**
   * The kernel over [start, end] (end − start ≤ 1 day keeps it within 1e-7 m of the exact sum).
   * Pass `into` to reuse its arrays; consecutive windows sharing an end compute that anchor once.
   */
  window(start: number, end: number, into?: PhasorWindow): PhasorWindow;
}

interface CompiledConstants {
  names: string[];
  H: Float64Array;
  g: Float64Array; // degrees
  speed: Float64Array; // degrees per hour
  terms: AstronomicalTerms;
  V: Float64Array; // scratch for terms.evaluate
  f: Float64Array;
  u: Float64Array;
}

function stationFile(station: ReferenceStation): string {
  return station.sourceFile ?? `station ${station.id}`;
}

function compileConstants(station: ReferenceStation): CompiledConstants {
  const names: string[] = [];
  const H: number[] = [];
  const g: number[] = [];
  const seen = new Map<string, string>();
  for (const [name, constant] of Object.entries(station.constituents)) {
    const c = findConstituent(name);
    if (!c) {
      throw new StationFileError(
        stationFile(station),
        `constituents.${name}`,
        `unknown constituent "${name}"`,
        `use one of ${CONSTITUENT_NAMES.join(', ')}`,
      );
    }
    const previous = seen.get(c.name);
    if (previous !== undefined) {
      throw new StationFileError(
        stationFile(station),
        `constituents.${name}`,
        `"${name}" is the same constituent as "${previous}"`,
        'give each constituent once',
      );
    }
    seen.set(c.name, name);
    if (constant.amplitude === 0) continue;
    names.push(c.name);
    H.push(constant.amplitude);
    g.push(constant.phase);
  }
  const terms = compileAstronomicalTerms(names);
  return {
    names,
    H: Float64Array.from(H),
    g: Float64Array.from(g),
    speed: Float64Array.from(terms.constituents.map((c) => c.speed)),
    terms,
    V: new Float64Array(names.length),
    f: new Float64Array(names.length),
    u: new Float64Array(names.length),
  };
}

/** Exact phase (radians, V + u − g) and amplitude fH of each constituent at instant t. */
interface Anchor {
  t: number;
  phase: Float64Array;
  amplitude: Float64Array;
}

// Typed arrays this size live outside the JavaScript heap and are slow to make: kernels reuse them.
function newAnchor(n: number): Anchor {
  return { t: NaN, phase: new Float64Array(n), amplitude: new Float64Array(n) };
}

export function newPhasorWindow(n: number): PhasorWindow {
  const a = () => new Float64Array(n);
  return { start: NaN, end: NaN, re: a(), im: a(), omega: a(), beta: a() };
}

function fillAnchor(k: CompiledConstants, t: number, into: Anchor): Anchor {
  const { V, f, u } = k;
  k.terms.evaluate(t, V, f, u);
  for (let i = 0; i < V.length; i++) {
    into.phase[i] = normalizeDegrees(numberAt(V, i, 'equilibrium arguments') + numberAt(u, i, 'nodal angles') - numberAt(k.g, i, 'phase lags')) * DEG;
    into.amplitude[i] = numberAt(f, i, 'node factors') * numberAt(k.H, i, 'amplitudes');
  }
  into.t = t;
  return into;
}

function windowBetween(k: CompiledConstants, a: Anchor, b: Anchor, w: PhasorWindow): PhasorWindow {
  const n = k.names.length;
  const hours = (b.t - a.t) / MS_PER_HOUR;
  w.start = a.t;
  w.end = b.t;
  for (let i = 0; i < n; i++) {
    const amplitude = numberAt(a.amplitude, i, 'anchor amplitudes'), phase = numberAt(a.phase, i, 'anchor phases');
    const speed = numberAt(k.speed, i, 'speeds');
    w.re[i] = amplitude * Math.cos(phase);
    w.im[i] = amplitude * Math.sin(phase);
    const nominal = speed * DEG * hours;
    if (hours > 0) {
      // unwrap: the measured turn differs from speed × time only by the small change of u
      const measured = numberAt(b.phase, i, 'anchor phases') - phase;
      const turn = measured + TWO_PI * Math.round((nominal - measured) / TWO_PI);
      w.omega[i] = turn / hours;
      w.beta[i] = amplitude > 0 ? logRatio(numberAt(b.amplitude, i, 'anchor amplitudes'), amplitude) / hours : 0;
    } else {
      w.omega[i] = speed * DEG;
      w.beta[i] = 0;
    }
  }
  return w;
}

/** ln(b/a); f changes by ~1e-5 a day, where three terms of the series are exact to rounding. */
function logRatio(b: number, a: number): number {
  const e = (b - a) / a;
  return Math.abs(e) < 1e-4 ? e * (1 - e * (0.5 - e / 3)) : Math.log(b / a);
}

/** Compile a reference port's constants into a prediction kernel. */
export function compilePredictor(station: ReferenceStation): Predictor {
  const k = compileConstants(station);
  const n = k.names.length;
  const z0 = station.mean_level;
  // two anchors kept: window(a, b) then window(b, c) computes the shared b once
  const slots = [newAnchor(n), newAnchor(n)];
  const anchor = (t: number, keep?: Anchor): Anchor => {
    for (const slot of slots) if (slot.t === t) return slot;
    const [s0, s1] = slots as [Anchor, Anchor];
    const older = s1.t < s0.t || Number.isNaN(s0.t) ? s0 : s1;
    return fillAnchor(k, t, keep === s0 ? s1 : keep === s1 ? s0 : older);
  };
  const windowOf = (start: number, end: number, into: PhasorWindow): PhasorWindow => {
    const a = anchor(start);
    return windowBetween(k, a, anchor(end, a), into);
  };
  // a few day windows kept for heightAt/rateAt, which callers use near each other in time
  const cache = new Map<number, PhasorWindow>();
  const dayWindow = (t: number): PhasorWindow => {
    const day = Math.floor(t / MS_PER_DAY);
    let w = cache.get(day);
    if (!w) {
      if (cache.size >= 8) cache.delete(cache.keys().next().value!);
      w = windowOf(day * MS_PER_DAY, (day + 1) * MS_PER_DAY, newPhasorWindow(n));
      cache.set(day, w);
    }
    return w;
  };

  const evaluate = (t: number, derivative: boolean): number => {
    const w = dayWindow(t);
    const tau = (t - w.start) / MS_PER_HOUR;
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const beta = numberAt(w.beta, i, 'growth rates'), omega = numberAt(w.omega, i, 'angular speeds');
      const re = numberAt(w.re, i, 'phasors'), im = numberAt(w.im, i, 'phasors');
      const b = beta * tau;
      const grow = 1 + b * (1 + b / 2); // e^{βτ}; |βτ| < 1e-4 over a day
      const c = Math.cos(omega * tau);
      const s = Math.sin(omega * tau);
      const x = grow * (re * c - im * s);
      if (!derivative) {
        sum += x;
      } else {
        const y = grow * (re * s + im * c);
        sum += beta * x - omega * y;
      }
    }
    return derivative ? sum : z0 + sum;
  };

  return {
    station,
    names: k.names,
    meanLevel: z0,
    fastestSpeed: k.speed.reduce((m, s) => Math.max(m, Math.abs(s)), 0) * DEG,
    amplitudeSum: k.H.reduce((a, b) => a + b, 0),
    heightAt: (t) => evaluate(t, false),
    rateAt: (t) => evaluate(t, true),
    window: (start, end, into) => windowOf(start, end, into ?? newPhasorWindow(n)),
    heights(start, stepMs, count) {
      if (!(stepMs > 0) || !Number.isFinite(stepMs)) {
        throw new RangeError(`heights: the step must be a positive number of milliseconds, not ${stepMs}`);
      }
      const out = new Float64Array(count).fill(z0);
      const perWindow = Math.max(1, Math.floor(MS_PER_DAY / stepMs));
      let a = fillAnchor(k, start, newAnchor(n));
      let b = newAnchor(n);
      const w = newPhasorWindow(n);
      const rotation = { cos: new Float64Array(n), sin: new Float64Array(n) };
      for (let j0 = 0; j0 < count; j0 += perWindow) {
        const m = Math.min(perWindow, count - j0);
        fillAnchor(k, start + (j0 + m) * stepMs, b);
        accumulateWindow(windowBetween(k, a, b, w), stepMs / MS_PER_HOUR, rotation, out, j0, m);
        [a, b] = [b, a];
      }
      return out;
    },
  };
}

/**
 * Adds m samples of a window's phasor sum, one step apart, to out[j0…]. Four constituents at a time,
 * time inside: four independent recurrences keep the processor busy and the phasors in registers.
 */
function accumulateWindow(
  w: PhasorWindow,
  stepHours: number,
  rotation: { cos: Float64Array; sin: Float64Array },
  out: Float64Array,
  j0: number,
  m: number,
): void {
  const n = w.re.length;
  const cr = rotation.cos;
  const ci = rotation.sin;
  for (let i = 0; i < n; i++) {
    const grow = Math.exp(numberAt(w.beta, i, 'growth rates') * stepHours);
    const turn = numberAt(w.omega, i, 'angular speeds') * stepHours;
    cr[i] = grow * Math.cos(turn);
    ci[i] = grow * Math.sin(turn);
  }
  const end = j0 + m;
  let i = 0;
  for (; i + 3 < n; i += 4) {
    let x0 = numberAt(w.re, i, 'phasors'), y0 = numberAt(w.im, i, 'phasors'), x1 = numberAt(w.re, i + 1, 'phasors'), y1 = numberAt(w.im, i + 1, 'phasors');
    let x2 = numberAt(w.re, i + 2, 'phasors'), y2 = numberAt(w.im, i + 2, 'phasors'), x3 = numberAt(w.re, i + 3, 'phasors'), y3 = numberAt(w.im, i + 3, 'phasors');
    const c0 = numberAt(cr, i, 'step rotations'), s0 = numberAt(ci, i, 'step rotations'), c1 = numberAt(cr, i + 1, 'step rotations'), s1 = numberAt(ci, i + 1, 'step rotations');
    const c2 = numberAt(cr, i + 2, 'step rotations'), s2 = numberAt(ci, i + 2, 'step rotations'), c3 = numberAt(cr, i + 3, 'step rotations'), s3 = numberAt(ci, i + 3, 'step rotations');
    for (let j = j0; j < end; j++) {
      out[j] = numberAt(out, j, 'heights') + (x0 + x1 + (x2 + x3));
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
  for (; i < n; i++) {
    let x = numberAt(w.re, i, 'phasors'), y = numberAt(w.im, i, 'phasors');
    const c = numberAt(cr, i, 'step rotations'), s = numberAt(ci, i, 'step rotations');
    for (let j = j0; j < end; j++) {
      out[j] = numberAt(out, j, 'heights') + x;
      const t = x * c - y * s;
      y = x * s + y * c;
      x = t;
    }
  }
}

/**
 * Reference evaluation: a function of the instant that computes V, f and u at that very instant,
 * one cosine per constituent (the constants are compiled once, when it is made).
 */
export function directHeights(station: ReferenceStation): (t: number) => number {
  const k = compileConstants(station);
  return (t: number): number => {
    k.terms.evaluate(t, k.V, k.f, k.u);
    let h = station.mean_level;
    for (let i = 0; i < k.names.length; i++) {
      const amplitude = numberAt(k.f, i, 'node factors') * numberAt(k.H, i, 'amplitudes');
      h += amplitude * Math.cos((numberAt(k.V, i, 'equilibrium arguments') + numberAt(k.u, i, 'nodal angles') - numberAt(k.g, i, 'phase lags')) * DEG);
    }
    return h;
  };
}
