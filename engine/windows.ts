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
//   That curve is an approximation between the port's events; SECONDARY_WINDOW_NOTE says how good.
import { findExtrema } from './extrema.js';
import type { Predictor } from './predict.js';
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
const ROOT_TOLERANCE_MS = 0.5;

/** A monotone piece of the curve: consecutive breakpoints with their heights. */
interface Breakpoints {
  times: number[];
  heights: number[];
  crossing(i: number, level: number): number; // the instant in (times[i], times[i+1]) where h = level
}

/** Root of h − level between a and b, where (h(a) − level) and (h(b) − level) differ in sign. */
export function harmonicCrossing(predictor: Predictor, a: number, b: number, level: number): number {
  let lo = a;
  let hi = b;
  const rising = predictor.heightAt(b) > predictor.heightAt(a);
  let x = (lo + hi) / 2;
  for (let iter = 0; iter < 100 && hi - lo > ROOT_TOLERANCE_MS; iter++) {
    const f = predictor.heightAt(x) - level;
    if (f > 0 === rising) hi = x;
    else lo = x;
    const rate = predictor.rateAt(x) / 3_600_000; // metres per ms
    const next = rate !== 0 ? x - f / rate : Number.NaN;
    if (next > lo && next < hi) {
      if (Math.abs(next - x) < ROOT_TOLERANCE_MS / 2) return next;
      x = next;
    } else {
      x = (lo + hi) / 2;
    }
  }
  return (lo + hi) / 2;
}

/** Where the half-cosine from event a to event b meets the level (closed form; a and b bracket it). */
export function cosineCrossing(a: TideEvent, b: TideEvent, level: number): number {
  const c = 1 - (2 * (level - a.height)) / (b.height - a.height);
  return a.time + ((b.time - a.time) * Math.acos(Math.min(1, Math.max(-1, c)))) / Math.PI;
}

function harmonicBreakpoints(predictor: Predictor, events: readonly TideEvent[], from: number, to: number): Breakpoints {
  // The ends of the span are breakpoints too: the curve is monotone from `from` to the first event.
  const inside = events.filter((e) => e.time > from && e.time < to).map((e) => e.time);
  const times = [from, ...inside, to];
  return {
    times,
    heights: times.map((t) => predictor.heightAt(t)),
    crossing: (i, level) => harmonicCrossing(predictor, times[i]!, times[i + 1]!, level),
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

/** Open intervals over the breakpoints, clipped to [from, to). */
function intervalsOver(bp: Breakpoints, side: WindowSide, level: number, from: number, to: number): OpenInterval[] {
  const out: OpenInterval[] = [];
  const { times, heights } = bp;
  if (times.length === 0) return out;
  let open = isOpen(heights[0]!, side, level);
  let start = open ? times[0]! : Number.NaN;
  for (let i = 0; i + 1 < times.length; i++) {
    const next = isOpen(heights[i + 1]!, side, level);
    if (next === open) continue;
    const t = bp.crossing(i, level);
    if (open) out.push({ start, end: t });
    else start = t;
    open = next;
  }
  if (open) out.push({ start, end: times[times.length - 1]! });
  return out
    .map((w) => ({ start: Math.max(w.start, from), end: Math.min(w.end, to) }))
    .filter((w) => w.end > w.start);
}

/**
 * Every interval in [from, to) when the tide is at or above (`above`) or at or below (`below`) the
 * level, in time order, clipped to the span. `events` may pass high and low waters already computed
 * (they must cover [from − 2 days, to + 2 days) for a secondary port and [from, to) for a reference port).
 */
export function openIntervals(
  station: Station, set: StationLookup, side: WindowSide, level: number, from: number, to: number,
  events?: readonly TideEvent[], ctx?: EngineContext,
): OpenInterval[] {
  if (!(to > from)) return [];
  if (station.kind === 'reference') {
    const predictor = predictorFor(station, ctx);
    const evs = events ?? findExtrema(predictor, from, to);
    return intervalsOver(harmonicBreakpoints(predictor, evs, from, to), side, level, from, to);
  }
  const evs = events ?? tideEvents(station, set, from - 2 * DAY, to + 2 * DAY, ctx);
  return intervalsOver(secondaryBreakpoints(evs), side, level, from, to);
}

/** The method the crossings of a station come from. */
export function windowMethod(station: Station): WindowMethod {
  return station.kind === 'reference' ? 'harmonic' : 'secondary-curve';
}

/** The tide's height at an instant and whether it is rising: harmonic, or the secondary curve. */
export function heightAndTrend(
  station: Station, set: StationLookup, t: number,
): { height: number; trend: 'rising' | 'falling' } {
  if (station.kind === 'reference') {
    const p = predictorFor(station);
    return { height: p.heightAt(t), trend: p.rateAt(t) >= 0 ? 'rising' : 'falling' };
  }
  const events = tideEvents(station, set, t - 2 * DAY, t + 2 * DAY);
  const height = cosineCurve(events, t, 1, 1)[0]!;
  // Between a low and the next high the secondary curve rises.
  const next = events.find((e) => e.time > t);
  return { height, trend: next?.type === 'high' ? 'rising' : 'falling' };
}

/**
 * The caution for windows at a secondary port: how its crossings are found and how far to trust them.
 * Renderers print it beside secondary-port windows and hourly heights.
 */
// Measured on the demo reference ports over 2027 by drawing the same curve through their own high and low
// waters and comparing it with their harmonic prediction (minute steps): height differences up to 0.1 m
// (a symmetric tide) to 0.7 m (strong overtides), crossing times of levels at a quarter, half and three
// quarters of the range moved by up to 11 to 30 minutes, and by hours where a mixed tide stands near the level.
export const SECONDARY_WINDOW_NOTE =
  'At a secondary port, window times and hourly heights come from a half-cosine curve drawn between the '
  + "port's own predicted high and low waters, not from a harmonic prediction. The curve is exact at high "
  + 'and low water only; between them it can be out by 0.1 to 0.7 m and move a window by 10 to 30 minutes, '
  + 'and by hours where the tide stands near the level. Leave a wide margin.';
