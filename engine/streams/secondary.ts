// Stream-secondary stations: our own simple method. Each event of the reference stream station is
// shifted by the station's time difference for that kind of event (in UTC), and each rate multiplied
// by its ratio, flood and ebb separately:
//   slack before a flood → + slack_to_flood.time;  slack before an ebb → + slack_to_ebb.time;
//   strongest flood → + flood.time, speed × flood.rate, toward flood_direction;
//   strongest ebb   → + ebb.time,   speed × ebb.rate,   toward ebb_direction (default: opposite the flood).
// A slack keeps the reference slack's speed times the ratio of the stream that follows it, and no direction.
// Between its events the velocity is drawn by the half-cosine curve of the height engine's secondary
// ports (0 at slack, ± the rate at the maxima), along the flood or ebb direction: a drawing aid.

import { StationFileError } from '../errors.js';
import { cosineCurve } from '../tides.js';
import type { TideEvent } from '../types.js';
import type { AnyStreamStation, StreamEvent, StreamSecondaryStation, StreamStation } from './types.js';
import { numberAt } from '../item.js';

const MINUTE = 60_000;
const DEG = Math.PI / 180;
/** Time differences are at most 12 h (schema), so events this far beyond a span cover it. */
export const STREAM_SECONDARY_PAD_MS = 13 * 3_600_000;

export interface StreamLookup {
  streams?: readonly AnyStreamStation[];
}

/** The stream station (kind: stream) a stream-secondary station takes its events from. */
export function referenceStreamOf(station: StreamSecondaryStation, set: StreamLookup): StreamStation {
  const target = set.streams?.find((s) => s.id === station.reference);
  if (!target || target.kind !== 'stream') {
    throw new StationFileError(
      station.sourceFile ?? station.id,
      'reference',
      target ? `"${station.reference}" is not a stream station with constants` : `no stream station "${station.reference}" in the station set`,
      'write the id of a station of kind: stream in the same folder (or give its folder with --stations)',
    );
  }
  return target;
}

export function ebbDirectionOf(station: AnyStreamStation): number {
  return station.ebb_direction ?? (station.flood_direction + 180) % 360;
}

/** The secondary station's events from its reference station's events (in time order, any span). */
export function streamSecondaryEventsFrom(reference: readonly StreamEvent[], station: StreamSecondaryStation): StreamEvent[] {
  const d = station.differences;
  const out: StreamEvent[] = [];
  reference.forEach((e, i) => {
    if (e.type === 'flood') {
      out.push({ time: e.time + d.flood.time * MINUTE, type: 'flood', speed: e.speed * d.flood.rate, direction: station.flood_direction });
    } else if (e.type === 'ebb') {
      out.push({ time: e.time + d.ebb.time * MINUTE, type: 'ebb', speed: e.speed * d.ebb.rate, direction: ebbDirectionOf(station) });
    } else {
      const next = reference.slice(i + 1).find((n) => n.type !== 'slack');
      const previous = reference.slice(0, i).reverse().find((n) => n.type !== 'slack');
      const toFlood = next ? next.type === 'flood' : previous?.type === 'ebb';
      const shift = (toFlood ? d.slack_to_flood.time : d.slack_to_ebb.time) * MINUTE;
      const rate = toFlood ? d.flood.rate : d.ebb.rate;
      out.push({ time: e.time + shift, type: 'slack', speed: e.speed * rate, direction: null });
    }
  });
  return out.sort((a, b) => a.time - b.time);
}

/** The drawn rate of a secondary station at start + i·stepMs: + flood, − ebb, 0 at slack (knots). */
export function streamSecondaryAlong(events: readonly StreamEvent[], start: number, stepMs: number, count: number): Float64Array {
  const signed: TideEvent[] = events.map((e) => ({
    time: e.time,
    type: e.type === 'ebb' ? 'low' : 'high',
    height: e.type === 'flood' ? e.speed : e.type === 'ebb' ? -e.speed : 0,
  }));
  return cosineCurve(signed, start, stepMs, count);
}

/** East and north velocity (knots) of a secondary station at start + i·stepMs, from its events. */
export function streamSecondarySeries(
  events: readonly StreamEvent[], station: StreamSecondaryStation, start: number, stepMs: number, count: number,
): { east: Float64Array; north: Float64Array } {
  const along = streamSecondaryAlong(events, start, stepMs, count);
  const flood = station.flood_direction * DEG;
  const ebb = ebbDirectionOf(station) * DEG;
  const east = new Float64Array(count);
  const north = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const s = numberAt(along, i, 'along');
    const dir = s >= 0 ? flood : ebb;
    east[i] = Math.abs(s) * Math.sin(dir);
    north[i] = Math.abs(s) * Math.cos(dir);
  }
  return { east, north };
}
