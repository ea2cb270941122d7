// One door to high and low waters and to heights, for reference and secondary ports alike.
// Reference ports: the harmonic predictor and its extrema. Secondary ports: events from the
// reference port's events by interpolated differences (./secondary.ts), heights by the cosine curve.
import { findExtrema } from './extrema.js';
import type { EngineContext } from './context.js';
import { compilePredictor } from './predict.js';
import {
  referencePortOf, secondaryEventsFrom, secondaryPaddingMs, type StationLookup,
} from './secondary.js';
import type { ReferenceStation, SecondaryStation, Station, TideEvent } from './types.js';
import { itemAt } from './item.js';

export type { StationLookup } from './secondary.js';

type Predictor = ReturnType<typeof compilePredictor>;

const DAY = 86_400_000;

/** The compiled harmonic predictor of a reference port, kept in the context per station object. */
export function predictorFor(station: ReferenceStation, ctx?: EngineContext): Predictor {
  let p = ctx?.predictors.get(station);
  if (!p) {
    p = compilePredictor(station);
    ctx?.predictors.set(station, p);
  }
  return p;
}

/** The reference port whose constants drive a station: itself, or a secondary port's reference. */
export function harmonicStationOf(station: Station, set: StationLookup): ReferenceStation {
  return station.kind === 'reference' ? station : referencePortOf(station, set);
}

/** Every high and low water with from ≤ time < to (UTC ms), in time order. */
export function tideEvents(
  station: Station, set: StationLookup, from: number, to: number, ctx?: EngineContext,
): TideEvent[] {
  if (!(to > from)) return [];
  if (station.kind === 'reference') return findExtrema(predictorFor(station, ctx), from, to);
  return secondaryEventsBetween(station, set, from, to, ctx);
}

function secondaryEventsBetween(
  station: SecondaryStation, set: StationLookup, from: number, to: number, ctx?: EngineContext,
): TideEvent[] {
  const reference = referencePortOf(station, set);
  const pad = secondaryPaddingMs(station);
  const refEvents = findExtrema(predictorFor(reference, ctx), from - pad, to + pad);
  return secondaryEventsFrom(refEvents, reference, station).filter((e) => e.time >= from && e.time < to);
}

/**
 * Heights at start + i·stepMs for i < count. Reference ports: the harmonic prediction. Secondary
 * ports: the curve an almanac draws between its own high and low waters,
 * h = h1 + (h2 − h1)(1 − cos(π(t − t1)/(t2 − t1)))/2 — a drawing aid, not a harmonic prediction.
 */
export function tideHeights(
  station: Station, set: StationLookup, start: number, stepMs: number, count: number, ctx?: EngineContext,
): Float64Array {
  if (station.kind === 'reference') return predictorFor(station, ctx).heights(start, stepMs, count);
  const end = start + stepMs * Math.max(0, count - 1);
  const events = secondaryEventsBetween(station, set, Math.min(start, end) - 2 * DAY, Math.max(start, end) + 2 * DAY, ctx);
  return cosineCurve(events, start, stepMs, count);
}

/** Heights between consecutive events by the half-cosine curve; samples must lie inside the events. */
export function cosineCurve(
  events: readonly TideEvent[], start: number, stepMs: number, count: number,
): Float64Array {
  const out = new Float64Array(count);
  if (events.length < 2) {
    out.fill(Number.NaN);
    return out;
  }
  let j = 0;
  for (let i = 0; i < count; i++) {
    const t = start + i * stepMs;
    // Samples are usually ascending; step back if a negative step walks the other way.
    while (j > 0 && t < itemAt(events, j, 'events').time) j--;
    while (j < events.length - 2 && t >= itemAt(events, j + 1, 'events').time) j++;
    const a = itemAt(events, j, 'events');
    const b = itemAt(events, j + 1, 'events');
    if (t < a.time || t > b.time) {
      out[i] = Number.NaN;
      continue;
    }
    const span = b.time - a.time;
    const x = span > 0 ? (t - a.time) / span : 0;
    out[i] = a.height + (b.height - a.height) * (1 - Math.cos(Math.PI * x)) / 2;
  }
  return out;
}
