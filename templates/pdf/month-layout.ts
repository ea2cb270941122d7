// How a month is split over pages and where each column of a day row sits. Pure geometry: the
// design is drawn for A5 (unit 1) and scaled to the other formats.
import type { DayEntry, MonthEntry, StationYear } from '../../engine/index.js';
import type { Box, PageGeometry } from './geometry.js';
import { contentBox } from './geometry.js';
import { LABEL_MIN, READING_MIN } from './style.js';

// design sizes at unit 1 (A5), in points
export const HEADER_HEIGHT = 50;
const MIN_ROW = 25;
const MAX_ROW = 33;
const NOTE_BAND = 10; // extra strip under a day on which the clocks change

/** Height of the clock-change strip: room for its note at the legible minimum. */
export function noteBand(u: number): number {
  return Math.max(NOTE_BAND * u, READING_MIN * 1.4);
}

// fixed columns, left to right; the lanes and the curve share what is left over
const FIXED = { badge: 15, gap1: 3, day: 26, moon: 17, gap2: 4, gap3: 7, gap4: 5, sun: 32 };
const FLEX = { lanes: 168, curve: 73 };
const DESIGN_WIDTH = Object.values(FIXED).reduce((a, b) => a + b, 0) + FLEX.lanes + FLEX.curve;

export interface Columns {
  badge: { x: number; w: number };
  day: { x: number; w: number };
  moon: { x: number; w: number };
  lanes: { x: number; w: number };
  curve: { x: number; w: number } | null; // dropped where the lanes would not fit beside it
  sun: { x: number; w: number };
}

export interface MonthPart {
  month: MonthEntry;
  partIndex: number; // 0-based
  partCount: number;
  days: DayEntry[];
}

/** Element scale for month pages: the format's type scale, reduced if the design would not fit. */
export function monthUnit(g: PageGeometry): number {
  const width = contentBox(g, 1).width;
  return Math.min(g.scale, width / DESIGN_WIDTH);
}

/** Type sizes of a month page at scale u, never below the legible minimums. */
export function monthType(u: number): { time: number; height: number; clock: number; offset: number; label: number } {
  return {
    time: Math.max(READING_MIN, 9.6 * u), // high- and low-water times
    height: Math.max(READING_MIN, 8.6 * u),
    clock: Math.max(READING_MIN, 7.4 * u), // sunrise, sunset and the minute of a moon quarter
    offset: Math.max(LABEL_MIN, 5.4 * u), // the UTC offset beside a time on a clock-change day
    label: Math.max(LABEL_MIN, 6.3 * u), // column heads, weekdays, hour ticks
  };
}

// widths in em of the widest strings, measured in DejaVu Sans Condensed (Bold for high-water times)
const EM = { time: 2.87, height: 2.01, clock: 2.6 };
const LANE_SLOTS = 3;

/** Width a lane needs for three tides (times and heights) at the legible minimum. */
function laneNeed(u: number): number {
  const t = monthType(u);
  const slot = EM.time * t.time + 2.6 * u + EM.height * t.height + Math.max(3.5 * u, 5);
  return 7.5 * u * 0.55 + 3.5 * u + LANE_SLOTS * slot;
}

// A sun column that must hold two clock times on one line (two sunrises or two sunsets in a day,
// near the polar circles) takes this much more from the lanes.
const WIDE_SUN_EXTRA = 16;

/** True when some day has two sunrises or two sunsets (they share one line of the sun column). */
export function needsWideSun(days: readonly DayEntry[]): boolean {
  return days.some((d) => ['rise', 'set'].some((type) => d.sky.filter((e) => e.body === 'sun' && e.type === type).length > 1));
}

const MIN_CURVE = 48; // points: a day curve narrower than this shows too little to be worth its room

export function columns(box: Box, u: number, wideSun = false): Columns {
  const t = monthType(u);
  // the moon's minute is centred under its glyph, clear of the weekday; the sun's times sit beside theirs
  const moonW = Math.max(FIXED.moon * u, EM.clock * t.clock + 5);
  const sunW = Math.max(FIXED.sun * u, 7.4 * u * 1.23 + 1.5 * u + EM.clock * t.clock) + (wideSun ? WIDE_SUN_EXTRA * u : 0);
  const fixed = (FIXED.badge + FIXED.gap1 + FIXED.day + FIXED.gap2 + FIXED.gap3 + FIXED.gap4) * u + moonW + sunW;
  const flex = box.width - fixed;
  // spare room goes to lanes and curve; a shortfall (a wide sun column) comes out of the lanes first
  const spare = flex - (FLEX.lanes + FLEX.curve) * u;
  let lanesW = FLEX.lanes * u + (spare > 0 ? spare * 0.6 : spare);
  let curveW: number | null = FLEX.curve * u + Math.max(0, spare) * 0.4;
  const need = laneNeed(u);
  if (lanesW < need) { curveW -= need - lanesW; lanesW = need; }
  if (curveW < MIN_CURVE) { lanesW += curveW + FIXED.gap3 * u; curveW = null; }
  let x = box.x;
  const take = (w: number) => { const c = { x, w }; x += w; return c; };
  const badge = take(FIXED.badge * u);
  x += FIXED.gap1 * u;
  const day = take(FIXED.day * u);
  const moon = take(moonW);
  x += FIXED.gap2 * u;
  const lanes = take(lanesW);
  let curve: Columns['curve'] = null;
  if (curveW !== null) {
    x += FIXED.gap3 * u;
    curve = take(curveW);
  }
  x += FIXED.gap4 * u;
  const sun = take(box.x + box.width - x);
  return { badge, day, moon, lanes, curve, sun };
}

function rowsHeight(days: DayEntry[], row: number, u: number): number {
  const notes = days.filter((d) => d.offsetChange !== null).length;
  return days.length * row + notes * noteBand(u);
}

/** Splits each month into the fewest pages whose rows still meet the minimum row height. */
export function monthParts(model: StationYear, g: PageGeometry): MonthPart[] {
  const u = monthUnit(g);
  const avail = contentBox(g, 1).height - HEADER_HEIGHT * u;
  const parts: MonthPart[] = [];
  for (const month of model.months) {
    const days = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
    let count = 1;
    for (;; count++) {
      const per = Math.ceil(days.length / count);
      const chunks = Array.from({ length: count }, (_, i) => days.slice(i * per, (i + 1) * per));
      if (chunks.every((c) => rowsHeight(c, MIN_ROW * u, u) <= avail) || count >= days.length) {
        chunks.forEach((c, i) => parts.push({ month, partIndex: i, partCount: count, days: c }));
        break;
      }
    }
  }
  return parts;
}

/** One row height for the whole book, so every month page has the same rhythm. */
export function rowHeight(parts: MonthPart[], g: PageGeometry): number {
  const u = monthUnit(g);
  const avail = contentBox(g, 1).height - HEADER_HEIGHT * u;
  let row = MAX_ROW * u;
  for (const p of parts) {
    const notes = p.days.filter((d) => d.offsetChange !== null).length;
    row = Math.min(row, (avail - notes * noteBand(u)) / p.days.length);
  }
  return row;
}
