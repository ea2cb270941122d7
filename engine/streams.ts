// Tidal stream stations: one door to their events and velocities, for stream and stream-secondary
// stations alike. Stream stations: the height kernel on the velocity's east and north components
// (streams/predict.ts) and their slack and strongest flood and ebb (streams/events.ts). Stream-secondary
// stations: the reference stream station's events by time differences and rate ratios (streams/secondary.ts).

import type { EngineContext } from './context.js';
import { streamEvents } from './streams/events.js';
import { streamPredictorFor } from './streams/predict.js';
import {
  referenceStreamOf, STREAM_SECONDARY_PAD_MS, streamSecondaryAlong, streamSecondaryEventsFrom, streamSecondarySeries,
  type StreamLookup,
} from './streams/secondary.js';
import type { AnyStreamStation, StreamEvent } from './streams/types.js';
import { numberAt } from './item.js';

export type * from './streams/types.js';
export { componentsToEllipse, ellipseToComponents, type ComponentConstant } from './streams/ellipse.js';
export {
  bearingOf, compileStreamPredictor, componentStations, isRotary, KNOTS_PER_METRE_PER_SECOND, ROTARY_MINOR_TO_MAJOR,
  streamPredictorFor, velocity, type StreamPredictor,
} from './streams/predict.js';
export { refineRoot, SLACK_SET_THRESHOLD, streamEvents } from './streams/events.js';
export { ebbDirectionOf, referenceStreamOf, streamSecondaryEventsFrom, type StreamLookup } from './streams/secondary.js';

const DAY = 86_400_000;

/** Every slack and strongest flood and ebb with from ≤ time < to (UTC ms), in time order. */
export function streamEventsFor(
  station: AnyStreamStation, set: StreamLookup, from: number, to: number, ctx?: EngineContext,
): StreamEvent[] {
  if (!(to > from)) return [];
  if (station.kind === 'stream') return streamEvents(streamPredictorFor(station, ctx), from, to);
  const reference = referenceStreamOf(station, set);
  const events = streamEvents(streamPredictorFor(reference, ctx), from - STREAM_SECONDARY_PAD_MS, to + STREAM_SECONDARY_PAD_MS);
  return streamSecondaryEventsFrom(events, station).filter((e) => e.time >= from && e.time < to);
}

/** East and north velocity, knots, at start + i·stepMs for i < count. */
export function streamVelocities(
  station: AnyStreamStation, set: StreamLookup, start: number, stepMs: number, count: number, ctx?: EngineContext,
): { east: Float64Array; north: Float64Array } {
  if (station.kind === 'stream') return streamPredictorFor(station, ctx).series(start, stepMs, count);
  const end = start + stepMs * Math.max(0, count - 1);
  const events = streamEventsFor(station, set, Math.min(start, end) - DAY, Math.max(start, end) + DAY, ctx);
  return streamSecondarySeries(events, station, start, stepMs, count);
}
export { buildStreamYear, streamAlmanacEvent, type StreamYearLookup } from './streams/almanac.js';
export { suspiciousStream, MAX_PLAUSIBLE_MAJOR_KNOTS } from './streams/check.js';

/**
 * The stream toward the flood direction, knots (ebb negative), at start + i·stepMs: for a stream station
 * its component along the flood direction, for a stream-secondary station its drawn rate.
 */
export function streamAlongFlood(
  station: AnyStreamStation, set: StreamLookup, start: number, stepMs: number, count: number, ctx?: EngineContext,
): Float64Array {
  if (station.kind === 'stream-secondary') {
    const end = start + stepMs * Math.max(0, count - 1);
    const events = streamEventsFor(station, set, Math.min(start, end) - DAY, Math.max(start, end) + DAY, ctx);
    return streamSecondaryAlong(events, start, stepMs, count);
  }
  const { east, north } = streamPredictorFor(station, ctx).series(start, stepMs, count);
  const fx = Math.sin((station.flood_direction * Math.PI) / 180);
  const fy = Math.cos((station.flood_direction * Math.PI) / 180);
  const out = new Float64Array(count);
  for (let i = 0; i < count; i++) out[i] = numberAt(east, i, 'east') * fx + numberAt(north, i, 'north') * fy;
  return out;
}
export { isCurrentRecord, parseCurrentRecord, type CurrentRecord } from './streams/current-record.js';
export {
  analyseCurrentRecord, majorAxisBearings, streamStationFrom, streamStationYaml, type CurrentAnalysis,
} from './streams/analysis.js';
