// Secondary ports: high and low waters derived from the reference port's events by time and height
// differences, interpolated between their spring and neap values by the reference port's own range.
import { StationFileError } from './errors.js';
import type {
  DifferencePair, ReferenceStation, SecondaryDifferences, SecondaryStation, Station, TideEvent,
} from './types.js';
import { itemAt } from './item.js';

/** What the secondary-port code needs of a station set (a `StationSet` fits). */
export interface StationLookup {
  byId: ReadonlyMap<string, Station>;
}

const MINUTE = 60_000;
const DAY = 86_400_000;

function fileOf(station: Station): string {
  return station.sourceFile ?? `station ${station.id}`;
}

/**
 * The reference port of a secondary port, checked here as well as by the loader: a missing reference,
 * a reference that is itself secondary, or a chain that loops back is a StationFileError.
 */
export function referencePortOf(station: SecondaryStation, set: StationLookup): ReferenceStation {
  const seen = new Set<string>([station.id]);
  const target = set.byId.get(station.reference);
  if (!target) {
    throw new StationFileError(fileOf(station), 'reference',
      `no station with id "${station.reference}" in this station set`,
      'write the id of a reference port from the same folder');
  }
  if (target.kind === 'secondary') {
    let cursor: Station | undefined = target;
    while (cursor && cursor.kind === 'secondary') {
      if (seen.has(cursor.id)) {
        throw new StationFileError(fileOf(station), 'reference',
          `the chain of references loops back to "${cursor.id}"`,
          'point the reference at a reference port (kind: reference)');
      }
      seen.add(cursor.id);
      cursor = set.byId.get(cursor.reference);
    }
    throw new StationFileError(fileOf(station), 'reference',
      `"${target.id}" is itself a secondary port`,
      'point the reference at a reference port (kind: reference)');
  }
  return target;
}

/** Mean spring and neap ranges of a reference port from M2 and S2: 2(H_M2 ± H_S2) (Pugh 1987). */
export function springNeapRanges(reference: ReferenceStation): { springs: number; neaps: number } {
  const m2 = reference.constituents['M2']?.amplitude ?? 0;
  const s2 = reference.constituents['S2']?.amplitude ?? 0;
  return { springs: 2 * (m2 + s2), neaps: 2 * (m2 - s2) };
}

/** The spring/neap factor k = (R − Rn)/(Rs − Rn): 0 at mean neaps, 1 at mean springs, linear beyond. */
export function springNeapFactor(range: number, springRange: number, neapRange: number): number {
  return (range - neapRange) / (springRange - neapRange);
}

/** A difference interpolated (and extrapolated) linearly in k: neaps + k·(springs − neaps). */
export function interpolateDifference(
  neaps: DifferencePair, springs: DifferencePair, k: number,
): DifferencePair {
  return {
    time: neaps.time + k * (springs.time - neaps.time),
    height: neaps.height + k * (springs.height - neaps.height),
  };
}

/** Range of reference event i: to the next event of the other type, else the previous one. */
function eventRange(events: readonly TideEvent[], i: number): number | null {
  const e = itemAt(events, i, 'events');
  for (let j = i + 1; j < events.length; j++) {
    if (itemAt(events, j, 'events').type !== e.type) return Math.abs(e.height - itemAt(events, j, 'events').height);
  }
  for (let j = i - 1; j >= 0; j--) {
    if (itemAt(events, j, 'events').type !== e.type) return Math.abs(e.height - itemAt(events, j, 'events').height);
  }
  return null;
}

function checkedRanges(reference: ReferenceStation, secondary: SecondaryStation) {
  const { springs, neaps } = springNeapRanges(reference);
  // Rs − Rn = 4·H_S2: without S2 springs and neaps cannot be told apart.
  if (!(springs - neaps > 1e-6)) {
    throw new StationFileError(fileOf(reference), 'constituents.S2',
      `reference port of "${secondary.id}" has no S2 amplitude, so its spring and neap ranges are equal`,
      'give the reference port its S2 constant (amplitude > 0)');
  }
  return { springs, neaps };
}

/**
 * Secondary-port events from the reference port's events (UTC ms, metres), in time order.
 * Each event is shifted on its UTC instant, never on a wall clock. Events without any event of the
 * other type to measure a range against (a lone event) are dropped.
 */
export function secondaryEventsFrom(
  referenceEvents: readonly TideEvent[],
  reference: ReferenceStation,
  secondary: SecondaryStation,
): TideEvent[] {
  const { springs, neaps } = checkedRanges(reference, secondary);
  const d: SecondaryDifferences = secondary.differences;
  const out: TideEvent[] = [];
  for (let i = 0; i < referenceEvents.length; i++) {
    const e = itemAt(referenceEvents, i, 'referenceEvents');
    const range = eventRange(referenceEvents, i);
    if (range === null) continue;
    const k = springNeapFactor(range, springs, neaps);
    const pair = e.type === 'high' ? d.high_water : d.low_water;
    const diff = interpolateDifference(pair.neaps, pair.springs, k);
    out.push({ time: e.time + Math.round(diff.time * MINUTE), type: e.type, height: e.height + diff.height });
  }
  // Different high- and low-water differences could in principle swap two close events.
  out.sort((a, b) => a.time - b.time);
  return out;
}

/**
 * How far beyond [from, to) the reference events must reach: the largest time difference (either
 * way, even extrapolated to k = ±1 past the table) plus two days so the last event still has its
 * range neighbour. The same secondary event then comes out the same whatever window asked for it.
 */
export function secondaryPaddingMs(secondary: SecondaryStation): number {
  const d = secondary.differences;
  const times = [d.high_water.springs.time, d.high_water.neaps.time, d.low_water.springs.time,
    d.low_water.neaps.time];
  const spread = Math.max(...times.map(Math.abs)) + Math.max(...times) - Math.min(...times);
  return Math.ceil(spread * MINUTE) + 2 * DAY;
}
