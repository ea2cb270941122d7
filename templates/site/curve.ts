// Geometry of the small tide curve drawn for each day of a month page: an SVG path from the model's
// `curve` heights (local midnight to next local midnight), the chart-datum line, event dots and
// clock ticks. One vertical scale per station-year so that days can be compared at a glance.
import { darkSpans } from '../night.js';
import type { DayEntry, StationYear } from '../../engine/index.js';
import { instant, offsetSeconds } from '../locale/index.js';

export const CURVE_WIDTH = 300;
export const CURVE_HEIGHT = 56;
const PAD_TOP = 5;
const PAD_BOTTOM = 5;

export interface HeightScale {
  min: number; // metres at the bottom of the plot
  max: number; // metres at the top
}

export interface CurveDot {
  x: number;
  y: number;
  type: 'high' | 'low';
  belowDatum: boolean;
}

export interface DayCurve {
  line: string; // SVG path data of the curve
  water: string; // closed path: the curve down to the bottom edge (the water body)
  datumY: number; // y of chart datum (height 0)
  dots: CurveDot[];
  ticks: number[]; // x of local 06:00, 12:00 and 18:00
  noon: number; // x of local 12:00 (drawn a little stronger)
  night: { x: number; width: number }[]; // spans with the sun below the horizon
}

/** The plotting range of a station-year: every curve sample, chart datum and HAT fit inside. */
export function heightScale(model: StationYear): HeightScale {
  let min = Math.min(0, model.datums.LAT);
  let max = model.datums.HAT;
  for (const day of model.days) {
    for (const h of day.curve) {
      if (h < min) min = h;
      if (h > max) max = h;
    }
  }
  if (!(max > min)) max = min + 1; // a flat record still gets a drawable box
  return { min, max };
}

const r1 = (v: number): number => Math.round(v * 10) / 10;

function yOf(h: number, scale: HeightScale): number {
  return r1(PAD_TOP + ((scale.max - h) / (scale.max - scale.min)) * (CURVE_HEIGHT - PAD_TOP - PAD_BOTTOM));
}

/**
 * Elapsed minutes from the day's start to a wall-clock hour of this day, across a clock change. Read
 * from the day's own start instant and offsets, so a day whose midnight was skipped (it starts at
 * 01:00) still puts 06:00 five hours in, not six.
 */
function elapsedToClock(day: DayEntry, hour: number): number {
  const start = instant(day.start);
  const w = new Date(start + offsetSeconds(day.offsetStart) * 1000);
  const wallAtStart = w.getUTCHours() * 60 + w.getUTCMinutes() + w.getUTCSeconds() / 60;
  const before = hour * 60 - wallAtStart;
  const change = day.offsetChange;
  if (!change || start + before * 60_000 < instant(change.time)) return before;
  return before - (offsetSeconds(day.offsetEnd) - offsetSeconds(day.offsetStart)) / 60;
}

/** Dark spans of the day in elapsed minutes, from its sunsets and sunrises or the polar note. */
function nightSpans(day: DayEntry, start: number, minutes: number): [number, number][] {
  return darkSpans(day, (iso) => (instant(iso) - start) / 60_000, minutes);
}

export function dayCurve(day: DayEntry, stepMinutes: number, scale: HeightScale): DayCurve {
  const start = instant(day.start);
  const minutes = (instant(day.end) - start) / 60_000;
  const xOf = (elapsed: number): number => r1((elapsed / minutes) * CURVE_WIDTH);
  const line = day.curve.map((h, i) => `${i === 0 ? 'M' : 'L'}${xOf(i * stepMinutes)} ${yOf(h, scale)}`).join('');
  const lastX = xOf((day.curve.length - 1) * stepMinutes);
  const water = day.curve.length > 0 ? `${line}L${lastX} ${CURVE_HEIGHT}L0 ${CURVE_HEIGHT}Z` : '';
  const dots = day.events.map((e) => ({
    x: xOf((instant(e.time) - start) / 60_000),
    y: yOf(e.height, scale),
    type: e.type,
    belowDatum: e.belowDatum,
  }));
  const clockX = (hour: number): number => xOf(elapsedToClock(day, hour));
  const noon = clockX(12);
  const night = nightSpans(day, start, minutes).map(([a, b]) => ({ x: xOf(a), width: r1(xOf(b) - xOf(a)) }));
  return { line, water, datumY: yOf(0, scale), dots, ticks: [clockX(6), noon, clockX(18)], noon, night };
}
