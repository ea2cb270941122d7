// Access windows: when the predicted tide stands at or above (or at or below) a level.
//
// Method. Between two consecutive high and low waters the curve is monotone (they are every zero of
// h′ where it changes sign; a horizontal inflection does not break monotony), so it meets a level at
// most once there, and it does exactly when the level lies between the heights at the two ends. Each
// such crossing is bracketed and found as a root, never by sampling:
// - reference ports: on the harmonic prediction itself (Newton's method on h − L with the analytic h′,
//   bisection when a step leaves the bracket), to under a millisecond;
// - secondary ports: on the secondary curve, the half-cosine between the port's own high and low
//   waters, h = h1 + (h2 − h1)(1 − cos πx)/2, solved in closed form x = acos(1 − 2(L − h1)/(h2 − h1))/π.
//   That curve is an approximation between the port's events; the note at the end of this file says how good.
import { findExtrema } from './extrema.js';
import { newPhasorWindow, type Predictor } from './predict.js';
import type { EngineContext } from './context.js';
import { cosineCurve, predictorFor, tideEvents, type StationLookup } from './tides.js';
import type { Station, TideEvent, WindowSide } from './types.js';

export type { WindowSide } from './types.js';

/** An interval of UTC ms during which the window is open: start ≤ t < end. */
export interface OpenInterval {
  start: number;
  end: number;
}

/** How the crossings of a station are found: 'harmonic' on the prediction, 'secondary-curve' otherwise. */
export type WindowMethod = 'harmonic' | 'secondary-curve';

const DAY = 86_400_000;
const ROOT_TOLERANCE_MS = 10; // crossings are printed to the second (model) and the minute (pages)
const HALLEY_ACCEPT_MS = 5_000; // Halley leaves an error ~K·step³: measured under 5 ms after a 5 s step, even next to a high or low water

/** A monotone piece of the curve: consecutive breakpoints with their heights. */
interface Breakpoints {
  times: number[];
  heights: number[];
  crossing(i: number, level: number): number; // the instant in (times[i], times[i+1]) where h = level
}

/**
 * Height and rate of rise of the kernel together (one cosine and sine per constituent for both), on the
 * same UTC-day windows as Predictor.heightAt, so the values are those of the prediction itself. Keeps
 * the last two day windows: roots are sought in time order and a piece may straddle a midnight.
 */
export function kernelEvaluator(predictor: Predictor): (t: number, out: KernelValue) => void {
  const n = predictor.names.length;
  const slots = [newPhasorWindow(n), newPhasorWindow(n)];
  const days = [Number.NaN, Number.NaN];
  let next = 0;
  return (t, out) => {
    const day = Math.floor(t / DAY);
    let w = days[0] === day ? slots[0]! : days[1] === day ? slots[1]! : null;
    if (!w) {
      w = predictor.window(day * DAY, (day + 1) * DAY, slots[next]!);
      days[next] = day;
      next = 1 - next;
    }
    const tau = (t - w.start) / 3_600_000;
    let h = 0;
    let rate = 0;
    let curvature = 0;
    for (let i = 0; i < n; i++) {
      const beta = w.beta[i]!;
      const b = beta * tau;
      const grow = 1 + b * (1 + b / 2); // e^{βτ}, as the kernel grows it
      const c = Math.cos(w.omega[i]! * tau);
      const s = Math.sin(w.omega[i]! * tau);
      const x = grow * (w.re[i]! * c - w.im[i]! * s);
      const y = grow * (w.re[i]! * s + w.im[i]! * c);
      const omega = w.omega[i]!;
      h += x;
      rate += beta * x - omega * y;
      curvature += (beta * beta - omega * omega) * x - 2 * beta * omega * y; // Re(λ²z), λ = β + iω
    }
    out.h = predictor.meanLevel + h;
    out.rate = rate;
    out.curvature = curvature;
  };
}

/** h (m), h′ (m/h) and h″ (m/h²) at one instant. */
export interface KernelValue {
  h: number;
  rate: number;
  curvature: number;
}

type Evaluate = ReturnType<typeof kernelEvaluator>;

/** Degree of the Taylor series a crossing is solved on, the bound's factorial, and its origins' spacing. */
const SERIES_DEGREE = 11;
const NEXT_FACTORIAL = 479_001_600; // (SERIES_DEGREE + 1)!
const MARK_HOURS = 1;
const MARKS = 24 / MARK_HOURS + 1; // both midnights of a kernel day window
const REUSE_MS = 7_200_000; // a series is tried again for a crossing this near its origin

/** A Taylor series of the prediction: h(origin + δ) ≈ Σ coef[n]·δⁿ (δ in hours), within remainder·|δ|^(d+1). */
export interface KernelSeries {
  origin: number; // UTC ms
  coef: Float64Array;
  remainder: number;
}

export function newKernelSeries(): KernelSeries {
  return { origin: Number.NaN, coef: new Float64Array(SERIES_DEGREE + 1), remainder: Number.NaN };
}

/**
 * The Taylor series of the prediction about the half-hour mark (UTC) nearest an instant, from one pass over
 * the constituents: each is a phasor w = fH·e^{i(V+u−g)} turning as e^{λτ} (λ = β + iω), so
 * h⁽ⁿ⁾ = Re Σ λⁿw. The turn to each mark of a kernel day window is tabulated once per window (one cosine
 * and sine per constituent, then products), so a series costs no trigonometry. The remainder is Lagrange's,
 * with |h⁽ᵈ⁺¹⁾| ≤ Σ|λ|^(d+1)|w| and a margin of 1 % for fH's growth over the step.
 */
export function kernelSeries(predictor: Predictor): (t: number, out: KernelSeries) => void {
  const n = predictor.names.length;
  const newSlot = () => ({
    day: Number.NaN, w: newPhasorWindow(n), turnRe: new Float64Array(n * MARKS), turnIm: new Float64Array(n * MARKS),
  });
  const slots = [newSlot(), newSlot()];
  let next = 0;
  const slotFor = (day: number) => {
    for (const slot of slots) if (slot.day === day) return slot;
    const slot = slots[next]!;
    next = 1 - next;
    const w = predictor.window(day * DAY, (day + 1) * DAY, slot.w);
    for (let i = 0; i < n; i++) {
      const stepRe = Math.cos(w.omega[i]! * MARK_HOURS);
      const stepIm = Math.sin(w.omega[i]! * MARK_HOURS);
      let re = w.re[i]!;
      let im = w.im[i]!;
      for (let j = 0; j < MARKS; j++) {
        slot.turnRe[i * MARKS + j] = re;
        slot.turnIm[i * MARKS + j] = im;
        const r = re * stepRe - im * stepIm;
        im = re * stepIm + im * stepRe;
        re = r;
      }
    }
    slot.day = day;
    return slot;
  };
  return (t, out) => {
    const day = Math.floor(t / DAY);
    const { w, turnRe, turnIm } = slotFor(day);
    const j = Math.min(MARKS - 1, Math.max(0, Math.round((t - w.start) / (MARK_HOURS * 3_600_000))));
    const tau = j * MARK_HOURS;
    const coef = out.coef;
    coef.fill(0);
    let bound = 0;
    for (let i = 0; i < n; i++) {
      const beta = w.beta[i]!;
      const omega = w.omega[i]!;
      const b = beta * tau;
      const grow = 1 + b * (1 + b / 2); // e^{βτ}, as the kernel grows it
      let x = grow * turnRe[i * MARKS + j]!;
      let y = grow * turnIm[i * MARKS + j]!;
      for (let k = 0; k <= SERIES_DEGREE; k++) {
        coef[k] = coef[k]! + x;
        const nx = beta * x - omega * y; // multiply by λ
        y = beta * y + omega * x;
        x = nx;
      }
      bound += Math.sqrt(x * x + y * y); // |λ^(d+1)·w|
    }
    let factorial = 1;
    for (let k = 1; k <= SERIES_DEGREE; k++) {
      factorial *= k;
      coef[k] = coef[k]! / factorial;
    }
    coef[0] = coef[0]! + predictor.meanLevel;
    out.origin = w.start + tau * 3_600_000;
    out.remainder = (1.01 * bound) / NEXT_FACTORIAL;
  };
}

/**
 * Root of h − level between a and b, where h(a) − level and h(b) − level differ in sign. The first
 * guess is the half-cosine between the two ends (close to a tide's shape). About it the prediction is
 * expanded once in its Taylor series (kernelSeries) and the root of the polynomial found by Newton's
 * method; it is taken when it lies in the bracket and the series' remainder bound puts it within the
 * tolerance of the true crossing. Otherwise Halley's method runs on the prediction itself, with the
 * analytic h′ and h″ (cubic convergence: a step under 5 s leaves an error of a few milliseconds, so it is
 * taken without another evaluation), falling back to bisection whenever a step would leave the bracket.
 */
export function harmonicCrossing(
  evaluate: Evaluate, series: ReturnType<typeof kernelSeries>, scratch: KernelSeries,
  a: number, b: number, level: number, ha: number, hb: number,
): number {
  let x = cosineCrossing({ time: a, height: ha, type: 'low' }, { time: b, height: hb, type: 'high' }, level);
  if (!(x > a && x < b)) x = (a + b) / 2;
  // The series of the previous crossing often serves the next level on the same piece.
  let fromSeries = Math.abs(x - scratch.origin) < REUSE_MS ? seriesRoot(scratch, (x - scratch.origin) / 3_600_000, level) : Number.NaN;
  if (!(fromSeries > a && fromSeries < b)) {
    series(x, scratch);
    fromSeries = seriesRoot(scratch, (x - scratch.origin) / 3_600_000, level);
  }
  if (fromSeries > a && fromSeries < b) return fromSeries;
  let lo = a;
  let hi = b;
  const rising = hb > ha;
  const v: KernelValue = { h: 0, rate: 0, curvature: 0 };
  for (let iter = 0; iter < 100 && hi - lo > ROOT_TOLERANCE_MS; iter++) {
    evaluate(x, v);
    const f = v.h - level;
    if (f > 0 === rising) hi = x;
    else lo = x;
    // in hours: Halley's step 2ff′/(2f′² − ff″)
    const denominator = 2 * v.rate * v.rate - f * v.curvature;
    const step = denominator !== 0 ? ((2 * f * v.rate) / denominator) * 3_600_000 : Number.NaN;
    const next = x - step;
    if (Math.abs(step) < HALLEY_ACCEPT_MS) return Math.min(hi, Math.max(lo, next));
    x = next > lo && next < hi ? next : (lo + hi) / 2;
  }
  return (lo + hi) / 2;
}

/**
 * The crossing of the level by a Taylor series, by Newton's method from δ0 hours after its origin, in UTC
 * ms, when the remainder bound proves it within ROOT_TOLERANCE_MS / 2 of the prediction's own; else NaN.
 */
function seriesRoot(series: KernelSeries, d0: number, level: number): number {
  const { coef, remainder, origin } = series;
  let d = d0;
  for (let iter = 0; iter < 30; iter++) {
    let p = coef[SERIES_DEGREE]!;
    let slope = 0;
    for (let k = SERIES_DEGREE - 1; k >= 0; k--) {
      slope = slope * d + p;
      p = p * d + coef[k]!;
    }
    if (slope === 0) return Number.NaN;
    const step = (p - level) / slope;
    d -= step;
    if (Math.abs(step) < 1e-10) {
      const heightError = remainder * Math.abs(d) ** (SERIES_DEGREE + 1);
      return (heightError / Math.abs(slope)) * 3_600_000 < ROOT_TOLERANCE_MS / 2 ? origin + d * 3_600_000 : Number.NaN;
    }
  }
  return Number.NaN;
}

/** Where the half-cosine from event a to event b meets the level (closed form; a and b bracket it). */
export function cosineCrossing(a: TideEvent, b: TideEvent, level: number): number {
  const c = 1 - (2 * (level - a.height)) / (b.height - a.height);
  return a.time + ((b.time - a.time) * Math.acos(Math.min(1, Math.max(-1, c)))) / Math.PI;
}

function harmonicBreakpoints(predictor: Predictor, events: readonly TideEvent[], from: number, to: number): Breakpoints {
  const evaluate = kernelEvaluator(predictor);
  const series = kernelSeries(predictor);
  const scratch = newKernelSeries();
  // The ends of the span are breakpoints too: the curve is monotone from `from` to the first event.
  const inside = events.filter((e) => e.time > from && e.time < to);
  const times = [from, ...inside.map((e) => e.time), to];
  const heights = [predictor.heightAt(from), ...inside.map((e) => e.height), predictor.heightAt(to)];
  return {
    times,
    heights,
    crossing: (i, level) => harmonicCrossing(
      evaluate, series, scratch, times[i]!, times[i + 1]!, level, heights[i]!, heights[i + 1]!,
    ),
  };
}

function secondaryBreakpoints(events: readonly TideEvent[]): Breakpoints {
  return {
    times: events.map((e) => e.time),
    heights: events.map((e) => e.height),
    crossing: (i, level) => cosineCrossing(events[i]!, events[i + 1]!, level),
  };
}

const isOpen = (h: number, side: WindowSide, level: number): boolean => (side === 'above' ? h >= level : h <= level);

/** A level and the side of it on which a window is open. */
export interface WindowLevel {
  side: WindowSide;
  level: number;
}

/**
 * Open intervals of every level over the breakpoints, clipped to [from, to). The pieces are walked
 * once in time order for all levels together, so the kernel's day windows are each built once.
 */
function intervalsOver(bp: Breakpoints, levels: readonly WindowLevel[], from: number, to: number): OpenInterval[][] {
  const { times, heights } = bp;
  const out: OpenInterval[][] = levels.map(() => []);
  if (times.length === 0) return out;
  const open = levels.map((l) => isOpen(heights[0]!, l.side, l.level));
  const start = open.map((o) => (o ? times[0]! : Number.NaN));
  for (let i = 0; i + 1 < times.length; i++) {
    levels.forEach((l, k) => {
      const next = isOpen(heights[i + 1]!, l.side, l.level);
      if (next === open[k]) return;
      const t = bp.crossing(i, l.level);
      if (open[k]) out[k]!.push({ start: start[k]!, end: t });
      else start[k] = t;
      open[k] = next;
    });
  }
  levels.forEach((_, k) => {
    if (open[k]) out[k]!.push({ start: start[k]!, end: times[times.length - 1]! });
  });
  return out.map((list) => list
    .map((w) => ({ start: Math.max(w.start, from), end: Math.min(w.end, to) }))
    .filter((w) => w.end > w.start));
}

/**
 * For each level, every interval in [from, to) when the tide is at or above (`above`) or at or below
 * (`below`) it, in time order, clipped to the span. `events` may pass high and low waters already
 * computed (covering [from − 2 days, to + 2 days) for a secondary port, [from, to) for a reference port).
 */
export function openIntervalsOf(
  station: Station, set: StationLookup, levels: readonly WindowLevel[], from: number, to: number,
  events?: readonly TideEvent[], ctx?: EngineContext,
): OpenInterval[][] {
  if (!(to > from)) return levels.map(() => []);
  if (station.kind === 'reference') {
    const predictor = predictorFor(station, ctx);
    const evs = events ?? findExtrema(predictor, from, to);
    return intervalsOver(harmonicBreakpoints(predictor, evs, from, to), levels, from, to);
  }
  const evs = events ?? tideEvents(station, set, from - 2 * DAY, to + 2 * DAY, ctx);
  return intervalsOver(secondaryBreakpoints(evs), levels, from, to);
}

/** The open intervals of one level (see openIntervalsOf). */
export function openIntervals(
  station: Station, set: StationLookup, side: WindowSide, level: number, from: number, to: number,
  events?: readonly TideEvent[], ctx?: EngineContext,
): OpenInterval[] {
  return openIntervalsOf(station, set, [{ side, level }], from, to, events, ctx)[0]!;
}

/** The method the crossings of a station come from. */
export function windowMethod(station: Station): WindowMethod {
  return station.kind === 'reference' ? 'harmonic' : 'secondary-curve';
}

/** The tide's height at an instant and whether it is rising: harmonic, or the secondary curve. */
export function heightAndTrend(
  station: Station, set: StationLookup, t: number, ctx?: EngineContext,
): { height: number; trend: 'rising' | 'falling' } {
  if (station.kind === 'reference') {
    const p = predictorFor(station, ctx);
    return { height: p.heightAt(t), trend: p.rateAt(t) >= 0 ? 'rising' : 'falling' };
  }
  const events = tideEvents(station, set, t - 2 * DAY, t + 2 * DAY, ctx);
  const height = cosineCurve(events, t, 1, 1)[0]!;
  // Between a low and the next high the secondary curve rises.
  const next = events.find((e) => e.time > t);
  return { height, trend: next?.type === 'high' ? 'rising' : 'falling' };
}

// How far to trust windows at a secondary port (the catalogue's window.secondaryNote words it for readers):
// Measured on the demo reference ports over 2027 by drawing the same curve through their own high and low
// waters and comparing it with their harmonic prediction (minute steps): height differences up to 0.1 m
// (a symmetric tide) to 0.7 m (strong overtides), crossing times of levels at a quarter, half and three
// quarters of the range moved by up to 11 to 30 minutes, and by hours where a mixed tide stands near the level.

