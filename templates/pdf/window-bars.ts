// Access windows on the month page: under each day's curve a bar runs while a window is open (one bar
// per window, the first lowest), and the window's level crosses the curve as a dotted line, so a reader
// sees at a glance when the sill or bridge can be passed; the minutes are on the page after the month.
import type { DayEntry, WindowDay, WindowYear } from '../../engine/index.js';
import { instant, type Words } from '../locale/index.js';
import type { CurveScale } from './day-curve.js';
import type { Box } from './geometry.js';
import { DARK, LABEL_MIN } from './style.js';
import { putFitted, widthOf } from './text.js';

/** The windows of a station with, for each, its days by local date. */
export interface WindowLookup {
  windows: readonly WindowYear[];
  byDate: readonly Map<string, WindowDay>[];
}

export function windowLookup(windows: readonly WindowYear[]): WindowLookup {
  return { windows, byDate: windows.map((w) => new Map(w.days.map((d) => [d.date, d]))) };
}

/** Height of one bar and the gap between bars, in design points. */
const BAR = 1.3;
const BAR_GAP = 0.5;

/** Room the bars take under a curve box. */
export function barsHeight(count: number, u: number): number {
  return count === 0 ? 0 : (count * BAR + (count - 1) * BAR_GAP + 0.4) * u;
}

/** The fractions of the local day [from, to] during which a window is open. */
function openSpans(day: DayEntry, d: WindowDay | undefined): [number, number][] {
  if (!d || d.state === 'closed') return [];
  if (d.state === 'open') return [[0, 1]];
  const start = instant(day.start);
  const length = instant(day.end) - start;
  return d.pieces.map((p) => [(instant(p.start) - start) / length, (instant(p.end) - start) / length]);
}

/** Bars just under `box` and the levels across it; `scale` is the curve's vertical scale. */
export function drawWindowBars(
  doc: PDFKit.PDFDocument, lookup: WindowLookup, day: DayEntry, box: Box, scale: CurveScale, u: number,
): void {
  const { windows, byDate } = lookup;
  doc.save();
  windows.forEach((w, k) => {
    if (w.level > scale.low && w.level < scale.high) {
      const y = box.y + box.height - ((w.level - scale.low) / (scale.high - scale.low)) * box.height;
      doc.lineWidth(0.45 * u).strokeColor(DARK).dash(0.5 * u, { space: 1.1 * u })
        .moveTo(box.x, y).lineTo(box.x + box.width, y).stroke().undash();
    }
    const y = box.y + box.height + 0.4 * u + k * (BAR + BAR_GAP) * u;
    for (const [a, b] of openSpans(day, byDate[k]?.get(day.date))) {
      doc.rect(box.x + a * box.width, y, Math.max((b - a) * box.width, 0.6 * u), BAR * u).fill(DARK);
    }
  });
  doc.restore();
}

/** The day's openings in words, for the curve's alternative text. */
export function windowsAlt(lookup: WindowLookup, day: DayEntry, words: Words): string {
  return lookup.windows.map((w, k) => {
    const d = lookup.byDate[k]?.get(day.date);
    const state = !d || d.state === 'closed' ? words.t('window.noOpening')
      : d.state === 'open' ? words.t('window.allDay')
        : words.list(d.pieces.map((p) => `${p.startClock}\u2013${p.endClock}`));
    return `${w.name}: ${state}`;
  }).join('; ');
}

/**
 * The key at the right of the month heading's second line, right-aligned at `right`: a sample bar and
 * "open: <window>" for each window, the lowest bar's first. Returns the width it took.
 */
export function drawWindowKey(
  doc: PDFKit.PDFDocument, windows: readonly WindowYear[], words: Words, right: number, y: number, maxWidth: number, u: number,
): number {
  const style = { font: 'narrow' as const, size: Math.max(7.2 * u, LABEL_MIN), color: DARK };
  const sample = 8 * u;
  const gap = 2.5 * u;
  const labels = windows.map((w) => words.t('window.barKey', { window: w.name }));
  const share = maxWidth / Math.max(1, windows.length) - sample - 2 * gap;
  let x = right;
  for (const label of [...labels].reverse()) {
    const w = Math.min(widthOf(doc, label, style), share);
    x -= w;
    putFitted(doc, label, x, y, style, share, LABEL_MIN);
    x -= gap + sample;
    doc.save().rect(x, y - 2.4 * u, sample, BAR * u).fill(DARK).restore();
    x -= 2 * gap;
  }
  return right - x;
}
