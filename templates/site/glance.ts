// Geometry of the year-at-a-glance: for each month a strip of daily range bars (one bar per day, all
// months on the station-year's own scale), moon quarters above the bars, springs and neaps lettered
// below, and the same facts in words for readers who do not read charts.
import type { MonthEntry, MoonPhaseName, StationYear } from '../../engine/index.js';

export const GLANCE_PITCH = 8;
export const GLANCE_BAR = 6;
export const GLANCE_LEFT = 2;
export const GLANCE_WIDTH = GLANCE_LEFT + 31 * GLANCE_PITCH;
const BARS_TOP = 16;
const BARS_BOTTOM = 56;
export const GLANCE_HEIGHT = 70;

export interface GlanceBar {
  day: number;
  x: number; // left edge
  cx: number; // centre, for marks above and below
  y: number;
  height: number;
  range: number | null; // metres
  mark: 'spring' | 'neap' | null;
}

export interface GlanceMoon {
  day: number;
  cx: number;
  phase: MoonPhaseName;
}

export interface GlanceMonth {
  month: number;

  slug: string;
  bars: GlanceBar[];
  moons: GlanceMoon[];
  barsTop: number;
  barsBottom: number;
  markY: number; // baseline of the S / N letters
  moonY: number; // centre of the moon glyphs
  springDays: number[];
  neapDays: number[];
}

/** Largest daily range of the year (metres); the glance bars are drawn against it. */
export function yearMaxRange(model: StationYear): number {
  let max = 0;
  for (const d of model.days) if (d.range !== null && d.range > max) max = d.range;
  return max > 0 ? max : 1;
}

export function glanceMonth(model: StationYear, month: MonthEntry, maxRange: number): GlanceMonth {
  const bars: GlanceBar[] = [];
  const moons: GlanceMoon[] = [];
  const springDays: number[] = [];
  const neapDays: number[] = [];
  const usable = BARS_BOTTOM - BARS_TOP;
  const days = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
  for (const [i, day] of days.entries()) {
    const x = GLANCE_LEFT + i * GLANCE_PITCH;
    const cx = x + GLANCE_BAR / 2;
    const h = day.range === null ? 0 : Math.round((day.range / maxRange) * usable * 10) / 10;
    bars.push({ day: day.dayOfMonth, x, cx, y: BARS_BOTTOM - h, height: h, range: day.range, mark: day.springNeap });
    if (day.springNeap === 'spring') springDays.push(day.dayOfMonth);
    if (day.springNeap === 'neap') neapDays.push(day.dayOfMonth);
    if (day.moonPhase) moons.push({ day: day.dayOfMonth, cx, phase: day.moonPhase });
  }
  return {
    month: month.month, slug: month.slug, bars, moons,
    barsTop: BARS_TOP, barsBottom: BARS_BOTTOM, markY: GLANCE_HEIGHT - 2, moonY: 7,
    springDays, neapDays,
  };
}
