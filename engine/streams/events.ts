// Slack water and the strongest flood and ebb of a stream station.
//
// Definitions (ours, written down so the tests can check them):
// - The strongest flood or ebb is every local maximum of the speed |v|, that is every zero of
//   d(|v|²)/dt = 2(e·e′ + n·n′) where it falls from positive to negative; it is a flood when the
//   component toward the flood direction is ≥ 0 there, an ebb otherwise.
// - Between a flood maximum and the next ebb maximum (or the other way round) lies one slack: the
//   instant the component toward the flood direction crosses zero (the crossing of least speed, should
//   there be several). For a rotary stream (./predict.ts: its main ellipse is round enough that the speed
//   never nears zero) the slack is instead the least speed between the two maxima, with that speed.
// - Two maxima of the same kind in a row (a double flood) have no slack between them.
// For a to-and-fro stream (every minor axis 0, one inclination, no cross current) |v| = |s| with s the
// component along the axis, so the maxima are the extrema of s and the slacks its zero crossings: the
// height engine's high and low waters and zero crossings of the same sum of cosines.
//
// Method: the speed's rate and the along-flood component are sampled from the kernels' fast series
// (rates with f and u held over the step) on a grid anchored at the epoch, where the fastest constituent
// turns 0.05 rad per step (|v|² turns twice as fast); every sign change, confirmed on exact values, is
// refined by the Illinois variant of regula falsi to 5 ms on the kernel's exact values and rates.

import type { StreamPredictor } from './predict.js';
import { bearingOf } from './predict.js';
import type { StreamEvent } from './types.js';
import { itemAt, numberAt } from '../item.js';

const MS_PER_HOUR = 3_600_000;
const PAD_MS = 86_400_000; // events are found a day beyond the span, so a slack has both its maxima
const GRID_TURN = 0.05; // radians of the fastest constituent per grid step
const MAX_STEP_MS = 600_000;
const ROOT_TOLERANCE_MS = 5;
/** Below this speed (knots) a slack has no direction worth printing. */
export const SLACK_SET_THRESHOLD = 0.05;

/** A zero of fn in [lo, hi] where fn(lo) and fn(hi) differ in sign (Illinois regula falsi). */
export function refineRoot(fn: (t: number) => number, lo: number, hi: number, flo: number, fhi: number): number {
  let side = 0;
  for (let i = 0; i < 100 && hi - lo > ROOT_TOLERANCE_MS; i++) {
    const t = (lo * fhi - hi * flo) / (fhi - flo);
    const x = t > lo && t < hi ? t : (lo + hi) / 2;
    const fx = fn(x);
    if (fx === 0) return x;
    if (fx > 0 === flo > 0) {
      lo = x;
      flo = fx;
      if (side === -1) fhi /= 2;
      side = -1;
    } else {
      hi = x;
      fhi = fx;
      if (side === 1) flo /= 2;
      side = 1;
    }
  }
  return (lo + hi) / 2;
}

interface Critical {
  t: number;
  east: number;
  north: number;
  along: number;
  speed: number;
}

/** Every slack and strongest flood and ebb with from ≤ time < to (UTC ms), in time order. */
export function streamEvents(p: StreamPredictor, from: number, to: number): StreamEvent[] {
  if (!(to > from)) return [];
  const DEG = Math.PI / 180;
  const fx = Math.sin(p.floodDirection * DEG);
  const fy = Math.cos(p.floodDirection * DEG);
  const { east, north } = p;
  const speedRate = (t: number) => east.heightAt(t) * east.rateAt(t) + north.heightAt(t) * north.rateAt(t);
  const along = (t: number) => east.heightAt(t) * fx + north.heightAt(t) * fy;
  const at = (t: number): Critical => {
    const e = east.heightAt(t);
    const n = north.heightAt(t);
    return { t, east: e, north: n, along: e * fx + n * fy, speed: Math.hypot(e, n) };
  };

  // whole-millisecond steps on a grid anchored at the epoch: an event comes out the same whatever span asked for it
  const step = Math.floor(p.fastestSpeed > 0 ? Math.min(MAX_STEP_MS, (GRID_TURN / (2 * p.fastestSpeed)) * MS_PER_HOUR) : MAX_STEP_MS);
  const start = Math.floor((from - PAD_MS) / step) * step;
  const end = to + PAD_MS;
  const maxima: Critical[] = [];
  const minima: Critical[] = [];
  const crossings: Critical[] = [];
  // the scan samples the kernels' fast series; each bracket is then refined on exact values and rates
  const count = Math.ceil((end - start) / step) + 1;
  const v = p.series(start, step, count);
  const r = p.rateSeries(start, step, count);
  let g0 = NaN;
  let s0 = NaN;
  for (let i = 0; i < count; i++) {
    const t1 = start + i * step;
    const g1 = numberAt(v.east, i, 'east') * numberAt(r.east, i, 'east') + numberAt(v.north, i, 'north') * numberAt(r.north, i, 'north');
    const s1 = numberAt(v.east, i, 'east') * fx + numberAt(v.north, i, 'north') * fy;
    if (i > 0) {
      const t0 = t1 - step;
      if (g0 > 0 !== g1 > 0) {
        const lo = speedRate(t0);
        const hi = speedRate(t1);
        if (lo > 0 !== hi > 0) (lo > 0 ? maxima : minima).push(at(refineRoot(speedRate, t0, t1, lo, hi)));
      }
      if (s0 >= 0 !== s1 >= 0) {
        const lo = along(t0);
        const hi = along(t1);
        if (lo >= 0 !== hi >= 0) crossings.push(at(refineRoot(along, t0, t1, lo, hi)));
      }
    }
    g0 = g1;
    s0 = s1;
  }

  const events: StreamEvent[] = [];
  const event = (c: Critical, type: StreamEvent['type']): StreamEvent => ({
    time: Math.round(c.t),
    type,
    speed: c.speed,
    direction: type === 'slack' && c.speed < SLACK_SET_THRESHOLD ? null : bearingOf(c.east, c.north),
  });
  const least = (list: Critical[], a: number, b: number): Critical | undefined =>
    list.filter((c) => c.t > a && c.t < b).reduce<Critical | undefined>((best, c) => (!best || c.speed < best.speed ? c : best), undefined);
  for (let i = 0; i < maxima.length; i++) {
    const m = itemAt(maxima, i, 'maxima');
    const kind = m.along >= 0 ? 'flood' : 'ebb';
    const previous = maxima[i - 1];
    if (previous && (previous.along >= 0 ? 'flood' : 'ebb') !== kind) {
      const slack = (p.rotary ? least(minima, previous.t, m.t) : undefined) ?? least(crossings, previous.t, m.t);
      if (slack) events.push(event(slack, 'slack'));
    }
    events.push(event(m, kind));
  }
  return events.filter((e) => e.time >= from && e.time < to);
}
