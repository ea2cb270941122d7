// Access windows: when the predicted tide stands at or above (or at or below) a level.
//
// Method. Between two consecutive high and low waters the curve is monotone (they are every zero of
// h′ where it changes sign; a horizontal inflection does not break monotony), so it meets a level at
// most once there, and it does exactly when the level lies between the heights at the two ends. Each
// such crossing is bracketed and found as a root, never by sampling:
// - reference ports: on the harmonic prediction itself, in the same pass over the kernel that finds the
//   high and low waters (engine/extrema.ts scanTides: the grid points and the events split the curve into
//   monotone pieces, and each crossing is solved on its piece's Taylor polynomial), to under a millisecond;
// - secondary ports: on the secondary curve, the half-cosine between the port's own high and low
//   waters, h = h1 + (h2 − h1)(1 − cos πx)/2, solved in closed form x = acos(1 − 2(L − h1)/(h2 − h1))/π.
//   That curve is an approximation between the port's events; the note at the end of this file says how good.
import { scanTides, type LevelCrossings } from './extrema.js';
import { firstOf, itemAt, lastOf, numberAt } from './item.js';
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

/** Where the half-cosine from event a to event b meets the level (closed form; a and b bracket it). */
export function cosineCrossing(a: TideEvent, b: TideEvent, level: number): number {
  const c = 1 - (2 * (level - a.height)) / (b.height - a.height);
  return a.time + ((b.time - a.time) * Math.acos(Math.min(1, Math.max(-1, c)))) / Math.PI;
}

const isOpen = (h: number, side: WindowSide, level: number): boolean => (side === 'above' ? h >= level : h <= level);

/** A level and the side of it on which a window is open. */
export interface WindowLevel {
  side: WindowSide;
  level: number;
}

/** Intervals clipped to [from, to), empty ones dropped and touching ones joined. */
function tidy(intervals: readonly OpenInterval[], from: number, to: number): OpenInterval[] {
  const out: OpenInterval[] = [];
  for (const w of intervals) {
    const start = Math.max(w.start, from);
    const end = Math.min(w.end, to);
    if (!(end > start)) continue;
    const last = out[out.length - 1];
    if (last && start <= last.end) last.end = Math.max(last.end, end);
    else out.push({ start, end });
  }
  return out;
}

/**
 * A reference port's open intervals from the scan's crossings: the tide is at or above the level from
 * `start` (when it was there) and from each upward crossing until the next downward one. At or below
 * is the complement; a level the tide only touches at one instant opens or closes nothing.
 */
function harmonicIntervals(c: LevelCrossings, side: WindowSide, from: number, to: number): OpenInterval[] {
  const out: OpenInterval[] = [];
  let open = side === 'above' ? c.aboveAtStart : !c.aboveAtStart;
  let since = from;
  for (const t of c.times) {
    if (open) out.push({ start: since, end: t });
    else since = t;
    open = !open;
  }
  if (open) out.push({ start: since, end: to });
  return tidy(out, from, to);
}

/** A secondary port's open intervals: the half-cosine between its own consecutive events. */
function secondaryIntervals(events: readonly TideEvent[], l: WindowLevel, from: number, to: number): OpenInterval[] {
  if (events.length === 0) return [];
  const out: OpenInterval[] = [];
  let previous = firstOf(events, 'tide events');
  let open = isOpen(previous.height, l.side, l.level);
  let since = previous.time;
  for (let i = 1; i < events.length; i++) {
    const e = itemAt(events, i, 'tide events');
    const next = isOpen(e.height, l.side, l.level);
    if (next !== open) {
      const t = cosineCrossing(previous, e, l.level);
      if (open) out.push({ start: since, end: t });
      else since = t;
      open = next;
    }
    previous = e;
  }
  if (open) out.push({ start: since, end: lastOf(events, 'tide events').time });
  return tidy(out, from, to);
}

/**
 * For each level, every interval in [from, to) when the tide is at or above (`above`) or at or below
 * (`below`) it, in time order, clipped to the span. For a secondary port `events` may pass its high and
 * low waters already computed, covering [from − 2 days, to + 2 days); a reference port's are found in the
 * same pass as the crossings.
 */
export function openIntervalsOf(
  station: Station, set: StationLookup, levels: readonly WindowLevel[], from: number, to: number,
  events?: readonly TideEvent[], ctx?: EngineContext,
): OpenInterval[][] {
  if (!(to > from)) return levels.map(() => []);
  if (station.kind === 'reference') {
    const scan = scanTides(predictorFor(station, ctx), from, to, levels.map((l) => l.level));
    return levels.map((l, k) => harmonicIntervals(itemAt(scan.levels, k, 'scanned levels'), l.side, from, to));
  }
  const evs = events ?? tideEvents(station, set, from - 2 * DAY, to + 2 * DAY, ctx);
  return levels.map((l) => secondaryIntervals(evs, l, from, to));
}

/** The open intervals of one level (see openIntervalsOf). */
export function openIntervals(
  station: Station, set: StationLookup, side: WindowSide, level: number, from: number, to: number,
  events?: readonly TideEvent[], ctx?: EngineContext,
): OpenInterval[] {
  return firstOf(openIntervalsOf(station, set, [{ side, level }], from, to, events, ctx), 'intervals of one level');
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
  const height = numberAt(cosineCurve(events, t, 1, 1), 0, 'secondary curve');
  // Between a low and the next high the secondary curve rises.
  const next = events.find((e) => e.time > t);
  return { height, trend: next?.type === 'high' ? 'rising' : 'falling' };
}

// How far to trust windows at a secondary port (the catalogue's window.secondaryNote words it for readers):
// Measured on the demo reference ports over 2027 by drawing the same curve through their own high and low
// waters and comparing it with their harmonic prediction (minute steps): height differences up to 0.1 m
// (a symmetric tide) to 0.7 m (strong overtides), crossing times of levels at a quarter, half and three
// quarters of the range moved by up to 11 to 30 minutes, and by hours where a mixed tide stands near the level.

