// Geometry of the small stream curve of each day on a stream month page: the component toward the
// flood direction from local midnight to the next (the model's `curve`), flood above the slack line and
// ebb below it, on one scale per stream-year so days compare at a glance.
import type { StreamDayEntry, StreamYear } from '../../engine/index.js';

export const STREAM_CURVE_WIDTH = 240;
export const STREAM_CURVE_HEIGHT = 44;
const PAD = 3;

export interface StreamCurve {
  line: string; // SVG path of the curve
  flood: string; // closed path between the curve and the slack line where the stream floods (and ebbs: same path, clipped by CSS fill)
  slackY: number; // y of zero (slack)
}

/** The largest rate either way over the year, knots (at least 0.1 so a still station draws). */
export function streamScale(model: StreamYear): number {
  let max = 0.1;
  for (const day of model.days) for (const v of day.curve) max = Math.max(max, Math.abs(v));
  return max;
}

const r1 = (v: number): number => Math.round(v * 10) / 10;

export function streamCurve(day: StreamDayEntry, max: number): StreamCurve {
  const n = day.curve.length;
  const mid = STREAM_CURVE_HEIGHT / 2;
  const yOf = (v: number): number => r1(mid - (v / max) * (mid - PAD));
  const xOf = (i: number): number => r1(n > 1 ? (i / (n - 1)) * STREAM_CURVE_WIDTH : 0);
  const points = day.curve.map((v, i) => `${xOf(i)} ${yOf(v)}`);
  const line = points.length > 0 ? `M${points.join('L')}` : '';
  const flood = points.length > 0 ? `M0 ${r1(mid)}L${points.join('L')}L${STREAM_CURVE_WIDTH} ${r1(mid)}Z` : '';
  return { line, flood, slackY: r1(mid) };
}
