// Secondary-port differences from a short gauge record: the record's high and low waters are matched
// to the reference port's predicted events of the same type nearest in time, and each difference d is
// fitted against the reference range factor k (the one the almanac interpolates with, engine/secondary.ts)
// by least squares, d = d_neaps + k·(d_springs − d_neaps), separately for high- and low-water time and height.

import { RecordFileError } from '../errors.js';
import { springNeapFactor, springNeapRanges } from '../secondary.js';
import { tideEvents } from '../tides.js';
import type { ReferenceStation, SecondaryDifferences, TideEvent } from '../types.js';
import { summariseRecord, type RecordSummary } from './coverage.js';
import { fitAgainstRangeFactor, type DifferenceFit } from './difference-fit.js';
import { recordExtrema } from './record-extrema.js';
import type { GaugeRecord } from './record.js';
import { itemAt } from '../item.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;
const MINUTE = 60_000;

export interface MatchedEvent {
  observed: TideEvent; // at the secondary port, from the record
  reference: TideEvent; // the reference port's predicted event it was matched to
  k: number; // the reference event's range factor
  timeDifference: number; // minutes, + later at the secondary port
  heightDifference: number; // metres
}

export interface DifferenceAnalysis {
  record: GaugeRecord;
  summary: RecordSummary;
  reference: ReferenceStation;
  observed: TideEvent[];
  matched: MatchedEvent[];
  unmatched: TideEvent[]; // observed events with no reference event of their type within the window
  differences: SecondaryDifferences; // time minutes, height metres
  fits: { highTime: DifferenceFit; highHeight: DifferenceFit; lowTime: DifferenceFit; lowHeight: DifferenceFit };
  kRange: [number, number];
}

export interface DifferenceOptions {
  windowHours?: number; // largest time difference a match may have, default 5
}

/** Range of event i: to the next event of the other type, else the previous (as the almanac does). */
function rangeAt(events: readonly TideEvent[], i: number): number | null {
  const e = itemAt(events, i, 'events');
  for (let j = i + 1; j < events.length; j++) if (itemAt(events, j, 'events').type !== e.type) return Math.abs(e.height - itemAt(events, j, 'events').height);
  for (let j = i - 1; j >= 0; j--) if (itemAt(events, j, 'events').type !== e.type) return Math.abs(e.height - itemAt(events, j, 'events').height);
  return null;
}

/** Each observed event with the same-type reference event nearest in time; each reference event used once. */
function match(observed: readonly TideEvent[], reference: readonly TideEvent[], window: number): { pairs: [number, number][]; unmatched: number[] } {
  const best = new Map<number, number>(); // reference index → observed index
  const unmatched: number[] = [];
  observed.forEach((e, i) => {
    let nearest = -1;
    for (let j = 0; j < reference.length; j++) {
      const r = itemAt(reference, j, 'reference');
      if (r.type !== e.type) continue;
      if (nearest < 0 || Math.abs(r.time - e.time) < Math.abs(itemAt(reference, nearest, 'reference').time - e.time)) nearest = j;
    }
    if (nearest < 0 || Math.abs(itemAt(reference, nearest, 'reference').time - e.time) > window) {
      unmatched.push(i);
      return;
    }
    const other = best.get(nearest);
    if (other === undefined) best.set(nearest, i);
    else {
      const keepNew = Math.abs(e.time - itemAt(reference, nearest, 'reference').time) < Math.abs(itemAt(observed, other, 'observed').time - itemAt(reference, nearest, 'reference').time);
      unmatched.push(keepNew ? other : i);
      if (keepNew) best.set(nearest, i);
    }
  });
  const pairs = [...best.entries()].map(([r, o]) => [o, r] as [number, number]).sort((a, b) => a[0] - b[0]);
  return { pairs, unmatched: unmatched.sort((a, b) => a - b) };
}

/** Fits the differences of a secondary record against a reference port's predictions. */
export function analyseDifferences(
  record: GaugeRecord, reference: ReferenceStation, options: DifferenceOptions = {},
): DifferenceAnalysis {
  const summary = summariseRecord(record);
  const { springs, neaps } = springNeapRanges(reference);
  if (!(springs - neaps > 1e-6)) {
    throw new RecordFileError(reference.sourceFile ?? reference.id, 'constituents.S2',
      'the reference port has no S2 amplitude, so its spring and neap ranges are the same',
      'give the reference port its S2 constant (amplitude > 0)');
  }
  const observed = recordExtrema(record);
  const referenceEvents = tideEvents(reference, { byId: new Map([[reference.id, reference]]) },
    summary.start - 2 * DAY, summary.end + 2 * DAY);
  const window = (options.windowHours ?? 5) * HOUR;
  const { pairs, unmatched } = match(observed, referenceEvents, window);
  const matched: MatchedEvent[] = [];
  for (const [o, r] of pairs) {
    const range = rangeAt(referenceEvents, r);
    if (range === null) continue;
    const obs = itemAt(observed, o, 'observed'), ref = itemAt(referenceEvents, r, 'referenceEvents');
    matched.push({
      observed: obs,
      reference: ref,
      k: springNeapFactor(range, springs, neaps),
      timeDifference: (obs.time - ref.time) / MINUTE,
      heightDifference: obs.height - ref.height,
    });
  }
  const highs = matched.filter((m) => m.observed.type === 'high');
  const lows = matched.filter((m) => m.observed.type === 'low');
  for (const [list, words] of [[highs, 'high'], [lows, 'low']] as const) {
    if (list.length < 4) {
      throw new RecordFileError(record.file, 'time',
        `only ${list.length} ${words} waters of the record could be matched to the reference port's predictions`,
        'supply a record of at least two weeks (a spring-neap cycle) taken while the reference port\'s constants apply');
    }
  }
  const fit = (list: MatchedEvent[], pick: (m: MatchedEvent) => number, floor: number) =>
    fitAgainstRangeFactor(list.map((m) => m.k), list.map(pick), floor);
  const fits = {
    highTime: fit(highs, (m) => m.timeDifference, 2),
    highHeight: fit(highs, (m) => m.heightDifference, 0.02),
    lowTime: fit(lows, (m) => m.timeDifference, 2),
    lowHeight: fit(lows, (m) => m.heightDifference, 0.02),
  };
  const ks = matched.map((m) => m.k);
  return {
    record,
    summary,
    reference,
    observed,
    matched,
    unmatched: unmatched.map((i) => itemAt(observed, i, 'observed')),
    differences: {
      high_water: {
        springs: { time: fits.highTime.springs, height: fits.highHeight.springs },
        neaps: { time: fits.highTime.neaps, height: fits.highHeight.neaps },
      },
      low_water: {
        springs: { time: fits.lowTime.springs, height: fits.lowHeight.springs },
        neaps: { time: fits.lowTime.neaps, height: fits.lowHeight.neaps },
      },
    },
    fits,
    kRange: [Math.min(...ks), Math.max(...ks)],
  };
}
