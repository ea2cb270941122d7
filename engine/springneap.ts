// Springs and neaps from the station's own predicted range: the fortnightly envelope of the daily
// range, its peaks (springs) and troughs (neaps), each paired with the syzygy or quadrature it follows.
import type { DaySpan } from './sky.js';
import type { MoonPhaseName, SpringNeapKind, TideEvent } from './types.js';
import { itemAt, numberAt } from './item.js';

const HOUR = 3_600_000;
// Half the envelope window: peaks of a fortnightly envelope stand at least ~10 days apart.
const HALF_WINDOW_DAYS = 5;
// The envelope's day value is taken over the day's middle ± 13 h, so every day holds at least one
// high and one low water even where the tide is diurnal (period 24.84 h) or the day has 23 hours.
const ENVELOPE_HALF_SPAN = 13 * HOUR;

export interface QuarterInstant {
  time: number; // UTC ms
  phase: MoonPhaseName;
}

export interface SpringNeapMarker {
  date: string;
  kind: SpringNeapKind;
  time: number; // UTC ms of the envelope's peak or trough (refined between day centres)
  envelope: number; // higher high minus lower low around that day, metres
  astronomical: number; // UTC ms of the syzygy (spring) or quadrature (neap) it belongs to
  astronomicalPhase: MoonPhaseName;
  lagHours: number; // time − astronomical
}

/** Largest range between consecutive high and low waters with at least one of them in [start, end). */
export function dayRange(events: readonly TideEvent[], start: number, end: number): number | null {
  let best: number | null = null;
  for (let i = 0; i + 1 < events.length; i++) {
    const a = itemAt(events, i, 'events');
    const b = itemAt(events, i + 1, 'events');
    if (b.time < start || a.time >= end || a.type === b.type) continue;
    if (!((a.time >= start && a.time < end) || (b.time >= start && b.time < end))) continue;
    const r = Math.abs(a.height - b.height);
    if (best === null || r > best) best = r;
  }
  return best;
}

/** Higher high minus lower low within [from, to), NaN without both. Events in time order. */
function highLowSpread(events: readonly TideEvent[], from: number, to: number, first: number): number {
  let hi = -Infinity;
  let lo = Infinity;
  for (let i = first; i < events.length && itemAt(events, i, 'events').time < to; i++) {
    const e = itemAt(events, i, 'events');
    if (e.time < from) continue;
    if (e.type === 'high') hi = Math.max(hi, e.height);
    else lo = Math.min(lo, e.height);
  }
  return hi > -Infinity && lo < Infinity ? hi - lo : Number.NaN;
}

/** The envelope of daily range: higher high − lower low around each day, then smoothed 1-2-1. */
export function rangeEnvelope(events: readonly TideEvent[], days: readonly DaySpan[]): { raw: Float64Array; smooth: Float64Array } {
  const n = days.length;
  const raw = new Float64Array(n);
  let first = 0;
  for (let j = 0; j < n; j++) {
    const mid = (itemAt(days, j, 'days').start + itemAt(days, j, 'days').end) / 2;
    while (first < events.length && itemAt(events, first, 'events').time < mid - ENVELOPE_HALF_SPAN) first++;
    raw[j] = highLowSpread(events, mid - ENVELOPE_HALF_SPAN, mid + ENVELOPE_HALF_SPAN, first);
  }
  const smooth = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const a = numberAt(raw, Math.max(0, j - 1), 'raw');
    const b = numberAt(raw, j, 'raw');
    const c = numberAt(raw, Math.min(n - 1, j + 1), 'raw');
    smooth[j] = (a + 2 * b + c) / 4;
  }
  return { raw, smooth };
}

interface Turn { index: number; kind: SpringNeapKind }

// Peaks and troughs: extreme within ± HALF_WINDOW_DAYS (first of equal values wins), then forced to
// alternate, keeping the more extreme of two neighbours of the same kind.
function turningPoints(s: Float64Array): Turn[] {
  const turns: Turn[] = [];
  // Only where the whole window fits: a truncated window near the ends would invent turning points.
  for (let j = HALF_WINDOW_DAYS; j + HALF_WINDOW_DAYS < s.length; j++) {
    let isMax = true;
    let isMin = true;
    for (let k = j - HALF_WINDOW_DAYS; k <= j + HALF_WINDOW_DAYS; k++) {
      if (k === j) continue;
      if (numberAt(s, k, 's') > numberAt(s, j, 's') || (k < j && s[k] === s[j])) isMax = false;
      if (numberAt(s, k, 's') < numberAt(s, j, 's') || (k < j && s[k] === s[j])) isMin = false;
    }
    if (Number.isNaN(numberAt(s, j, 's'))) continue;
    if (isMax) turns.push({ index: j, kind: 'spring' });
    else if (isMin) turns.push({ index: j, kind: 'neap' });
  }
  const out: Turn[] = [];
  for (const t of turns) {
    const last = out[out.length - 1];
    if (last && last.kind === t.kind) {
      const better = t.kind === 'spring' ? numberAt(s, t.index, 's') > numberAt(s, last.index, 's') : numberAt(s, t.index, 's') < numberAt(s, last.index, 's');
      if (better) out[out.length - 1] = t;
    } else out.push(t);
  }
  return out;
}

// Vertex of the parabola through three equally spaced samples, as an offset in samples (−0.5..0.5).
function parabolicOffset(a: number, b: number, c: number): number {
  const den = a - 2 * b + c;
  if (!(Math.abs(den) > 1e-12)) return 0;
  return Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / den));
}

/**
 * Spring and neap markers. `days` must reach about ten days beyond the span wanted (edges cannot
 * show a turning point); `quarters` must cover the days and some days before. `expectedLagHours`
 * (the age of the tide from the constants) picks which syzygy or quadrature a marker belongs to:
 * the one whose lag is closest to it.
 */
export function springNeapMarkers(
  events: readonly TideEvent[],
  days: readonly DaySpan[],
  quarters: readonly QuarterInstant[],
  expectedLagHours: number,
): SpringNeapMarker[] {
  const { raw, smooth } = rangeEnvelope(events, days);
  const out: SpringNeapMarker[] = [];
  for (const turn of turningPoints(smooth)) {
    const j = turn.index;
    const mid = (k: number) => (itemAt(days, k, 'days').start + itemAt(days, k, 'days').end) / 2;
    const delta = parabolicOffset(numberAt(smooth, j - 1, 'smooth'), numberAt(smooth, j, 'smooth'), numberAt(smooth, j + 1, 'smooth'));
    const time = mid(j) + (delta >= 0 ? delta * (mid(j + 1) - mid(j)) : delta * (mid(j) - mid(j - 1)));
    const wanted = turn.kind === 'spring' ? ['new', 'full'] : ['first-quarter', 'last-quarter'];
    let best: QuarterInstant | null = null;
    for (const q of quarters) {
      if (!wanted.includes(q.phase)) continue;
      const miss = Math.abs((time - q.time) / HOUR - expectedLagHours);
      if (!best || miss < Math.abs((time - best.time) / HOUR - expectedLagHours)) best = q;
    }
    if (!best) continue;
    out.push({
      date: itemAt(days, j, 'days').date,
      kind: turn.kind,
      time: Math.round(time),
      envelope: numberAt(raw, j, 'raw'),
      astronomical: best.time,
      astronomicalPhase: best.phase,
      lagHours: (time - best.time) / HOUR,
    });
  }
  return out;
}
