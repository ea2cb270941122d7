// One secondary-port high water worked from its reference port's event, step by step: the example a
// compact section of the combined volumes prints, with the arithmetic of secondaryEventsFrom.
import { interpolateDifference, springNeapFactor, springNeapRanges } from './secondary.js';
import type { EventType, ReferenceStation, SecondaryStation } from './types.js';
import { itemAt } from './item.js';

interface PrintedEvent { time: string; type: EventType; height: number }

export interface DifferenceExample {
  referenceIndex: number; // the reference port's high water, an index into the events given
  lowIndex: number; // the low water its range is measured to
  range: number; // metres, the reference port's range of that tide
  springRange: number; // the reference port's mean ranges, 2(H_M2 ± H_S2)
  neapRange: number;
  factor: number; // k: 0 at mean neaps, 1 at mean springs
  timeDifference: number; // minutes, interpolated in k
  heightDifference: number; // metres, interpolated in k
  time: number; // UTC ms of the secondary port's high water
  height: number; // metres above the secondary port's datum
}

/**
 * The first high water of the reference port at or after `from` (ISO UTC) that has a following low
 * water, worked into the secondary port's high water; null when the events hold none.
 */
export function differenceExample(events: readonly PrintedEvent[], reference: ReferenceStation,
  secondary: SecondaryStation, from: string): DifferenceExample | null {
  const start = Date.parse(from);
  const { springs, neaps } = springNeapRanges(reference);
  if (!(springs - neaps > 1e-6)) return null;
  for (let i = 0; i < events.length; i++) {
    const e = itemAt(events, i, 'events');
    if (e.type !== 'high' || Date.parse(e.time) < start) continue;
    const lowIndex = events.findIndex((l, j) => j > i && l.type === 'low');
    if (lowIndex < 0) return null;
    const range = Math.abs(e.height - itemAt(events, lowIndex, 'events').height);
    const factor = springNeapFactor(range, springs, neaps);
    const d = secondary.differences.high_water;
    const diff = interpolateDifference(d.neaps, d.springs, factor);
    return {
      referenceIndex: i, lowIndex, range, springRange: springs, neapRange: neaps, factor,
      timeDifference: diff.time, heightDifference: diff.height,
      time: Date.parse(e.time) + Math.round(diff.time * 60_000), height: e.height + diff.height,
    };
  }
  return null;
}
