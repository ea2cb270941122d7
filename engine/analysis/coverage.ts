// How much of its span a gauge record covers, its usual sampling interval and its gaps; and the two
// refusals: a record too short to separate M2 from S2, or one with more than half its span missing.

import { RecordFileError } from '../errors.js';
import type { GaugeRecord } from './record.js';
import { numberAt } from '../item.js';

const HOUR = 3_600_000;

export interface RecordGap {
  from: number; // UTC ms of the last reading before the gap
  to: number; // UTC ms of the first reading after it
  hours: number;
}

export interface RecordSummary {
  start: number; // UTC ms
  end: number;
  spanHours: number;
  count: number;
  intervalHours: number; // median spacing of the readings
  coverage: number; // share of the span that has readings, 0..1
  gaps: RecordGap[]; // spacings over 3 sampling intervals, longest first
}

function median(values: Float64Array): number {
  if (values.length === 0) return 0;
  const sorted = Float64Array.from(values).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? numberAt(sorted, mid, 'sorted') : (numberAt(sorted, mid - 1, 'sorted') + numberAt(sorted, mid, 'sorted')) / 2;
}

/** Span, sampling interval, coverage and gaps of a (sorted, de-duplicated) record. */
export function summariseRecord(record: GaugeRecord): RecordSummary {
  const { times } = record;
  const n = times.length;
  const start = times[0] ?? 0;
  const end = times[n - 1] ?? 0;
  const spanHours = (end - start) / HOUR;
  const steps = new Float64Array(Math.max(0, n - 1));
  for (let i = 1; i < n; i++) steps[i - 1] = (numberAt(times, i, 'times') - numberAt(times, i - 1, 'times')) / HOUR;
  const intervalHours = median(steps);
  // A reading stands for up to 1.5 sampling intervals of the span; the rest of a longer step is a gap.
  let covered = 0;
  const gaps: RecordGap[] = [];
  for (let i = 0; i < steps.length; i++) {
    const step = numberAt(steps, i, 'steps');
    covered += Math.min(step, 1.5 * intervalHours);
    if (step > 3 * intervalHours) gaps.push({ from: numberAt(times, i, 'times'), to: numberAt(times, i + 1, 'times'), hours: step });
  }
  gaps.sort((a, b) => b.hours - a.hours);
  const coverage = spanHours > 0 ? Math.min(1, covered / spanHours) : 0;
  return { start, end, spanHours, count: n, intervalHours, coverage, gaps };
}

function isoMinute(t: number): string {
  return new Date(t).toISOString().slice(0, 16) + 'Z';
}

/**
 * Refuses a record the harmonic analysis cannot use: shorter than `minimumHours` (the M2/S2 Rayleigh
 * separation, 14.77 days) or with more than half its span missing.
 */
export function checkAnalysable(record: GaugeRecord, summary: RecordSummary, minimumHours: number): void {
  const days = (h: number): string => (h / 24).toFixed(2);
  if (summary.spanHours < minimumHours) {
    throw new RecordFileError(record.file, 'time',
      `the record spans ${days(summary.spanHours)} days (${isoMinute(summary.start)} to ${isoMinute(summary.end)}), ` +
        `shorter than the ${days(minimumHours)} days needed to separate M2 from S2`,
      `supply at least ${days(minimumHours)} days of readings (a month or more is better)`);
  }
  if (summary.coverage < 0.5) {
    const worst = summary.gaps[0];
    const where = worst === undefined ? '' :
      `; the longest gap is ${days(worst.hours)} days from ${isoMinute(worst.from)} to ${isoMinute(worst.to)}`;
    throw new RecordFileError(record.file, 'time',
      `${Math.round((1 - summary.coverage) * 100)} % of the record's span has no readings${where}`,
      'fill the gaps or analyse a shorter stretch where at least half of the span has readings');
  }
}
