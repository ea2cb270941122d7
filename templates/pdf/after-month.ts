// Pages that follow a month in a book: the month's access windows (for a station that has them) and,
// when the project asks for it (hourly: true), its heights on every hour of local time.
import { itemAt, type DayEntry, type StationYear } from '../../engine/index.js';
import { drawDayCurve } from './day-curve.js';
import { inUnits } from '../locale/index.js';
import type { LogicalPage, PageContext } from './page.js';
import type { StationView } from './station-view.js';
import type { MonthEntry } from '../../engine/index.js';
import { HAIRLINE, INK, MID, RULE } from './style.js';
import { put, putFitted, widthOf } from './text.js';

const HEADER = 46; // design points at unit 1

function monthDays(model: StationYear, month: MonthEntry): DayEntry[] {
  return model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
}

/**
 * Heading shared by both pages: month and year, the station, then the notes (wrapped); returns the
 * baseline for the column heads.
 */
function heading(ctx: PageContext, view: StationView, month: MonthEntry, title: string, notes: string[]): number {
  const { doc, box } = ctx;
  const u = ctx.settings.geometry.scale;
  const w = put(doc, view.words.monthName(month.month), box.x, box.y + 15 * u, { font: 'bold', size: 17 * u });
  put(doc, `${view.model.year} \u00b7 ${title}`, box.x + w + 5 * u, box.y + 15 * u, { font: 'regular', size: 11 * u, color: MID });
  putFitted(doc, view.name, box.x + box.width, box.y + 6 * u, { font: 'bold', size: 8 * u }, box.width / 2, 5 * u, 'right');
  const size = 6.6 * u;
  let y = box.y + 26 * u;
  for (const note of notes) {
    for (const line of noteLines(doc, note, box.width, size)) {
      put(doc, line, box.x, y, { font: 'narrow', size, color: INK });
      y += size * 1.25;
    }
    y += 1.5 * u;
  }
  return Math.max(box.y + HEADER * u, y + 10 * u);
}

/** Wraps a note into lines of at most `width` (words kept whole). */
function noteLines(doc: PDFKit.PDFDocument, text: string, width: number, size: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    const next = line ? `${line} ${word}` : word;
    if (line && widthOf(doc, next, { font: 'narrow', size }) > width) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/** The access windows of a month: a row per day, a column per window, openings to the minute. */
export function windowsPage(view: StationView, month: MonthEntry): LogicalPage {
  const { model } = view;
  return {
    kind: 'windows',
    footer: { invented: model.invented, label: view.name },
    draw(ctx: PageContext) {
      const { doc, box } = ctx;
      const u = ctx.settings.geometry.scale;
      const units = ctx.settings.units;
      const w = view.words;
      const rules = model.windows.map((win) => `${win.name}: ${w.t(win.side === 'above' ? 'window.ruleAbove' : 'window.ruleBelow', { level: w.height(win.level) })}`);
      const top = heading(ctx, view, month, w.t('book.windowsTitle'), [
        w.t('book.windowsNote', { rules: rules.join('; ') }),
        ...(model.windows.some((win) => win.method === 'secondary-curve') ? [w.t('window.secondaryNote')] : []),
      ]);
      const days = monthDays(model, month);
      const dayW = 31 * u;
      const cellText = (win: (typeof model.windows)[number], i: number): string => {
        const d = itemAt(win.days, month.firstDayIndex + i, 'window days');
        return d.state === 'open' ? w.t('window.allDay') : d.state === 'closed' ? w.t('window.noOpening') : d.pieces.map((p) => `${p.startClock}\u2013${p.endClock}`).join('  ');
      };
      // columns as wide as their longest line; one smaller type size for all if they would not fit
      const row = Math.min(16 * u, (box.y + box.height - top) / days.length);
      let size = Math.min(7.2 * u, row * 0.6);
      const gap = 8 * u;
      const natural = model.windows.map((w) => Math.max(widthOf(doc, w.name.toUpperCase(), { font: 'narrow-bold', size: 6.6 * u }),
        ...days.map((_, i) => widthOf(doc, cellText(w, i), { font: 'regular', size }))) + gap);
      const avail = box.width - dayW;
      const total = natural.reduce((a, b) => a + b, 0);
      const shrink = Math.min(1, avail / total);
      size *= shrink;
      let x = box.x + dayW;
      const columns = model.windows.map((win, k) => {
        const left = x;
        const n = itemAt(natural, k, 'natural column widths');
        x += total <= avail ? n + (avail - total) / natural.length : n * shrink;
        return { win, left, width: (k === natural.length - 1 ? box.x + box.width : x) - left };
      });
      const head = { font: 'narrow-bold' as const, size: 6.6 * u, color: MID };
      for (const { win, left, width } of columns) putFitted(doc, win.name.toUpperCase(), left, top - 4 * u, head, width - gap / 2, 4.5 * u);
      doc.save().lineWidth(0.8 * u).strokeColor(INK).moveTo(box.x, top - 1 * u).lineTo(box.x + box.width, top - 1 * u).stroke().restore();
      days.forEach((day, i) => {
        const y = top + (i + 1) * row - row * 0.3;
        put(doc, `${view.words.weekdayShort(day.weekday)} ${day.dayOfMonth}`, box.x, y, { font: day.weekday === 7 ? 'narrow-bold' : 'narrow', size: Math.min(7.2 * u, row * 0.6) });
        for (const { win, left, width } of columns) {
          const state = itemAt(win.days, month.firstDayIndex + i, 'window days').state;
          const style = { font: state === 'some' ? 'regular' as const : 'narrow' as const, size, color: state === 'closed' ? MID : INK };
          putFitted(doc, cellText(win, i), left, y, style, width - gap / 2, size * 0.7);
        }
        doc.save().lineWidth(HAIRLINE * u).strokeColor(RULE)
          .moveTo(box.x, top + (i + 1) * row).lineTo(box.x + box.width, top + (i + 1) * row).stroke().restore();
      });
    },
  };
}

/** Heights on every hour of a month: a row per day, 24 clock hours, the day's curve at the end. */
export function hoursPage(view: StationView, month: MonthEntry): LogicalPage {
  const { model } = view;
  return {
    kind: 'hours',
    footer: { invented: model.invented, label: view.name },
    draw(ctx: PageContext) {
      const { doc, box } = ctx;
      const u = ctx.settings.geometry.scale;
      const units = ctx.settings.units;
      const days = monthDays(model, month);
      const offsets = [...new Set(days.flatMap((d) => [d.offsetStart, d.offsetEnd]))].map((o) => view.words.offset(o)).join(', ');
      const top = heading(ctx, view, month, view.words.t('book.hoursTitle'), [
        view.words.t('hours.intro', { unit: view.words.unitName(), datum: model.station.datum, zone: offsets }),
        ...(model.hourly.method === 'secondary-curve' ? [view.words.t('window.secondaryNote')] : []),
      ]);
      const dayW = 22 * u;
      const curveW = Math.min(48 * u, box.width * 0.12);
      const cellW = (box.width - dayW - curveW - 3 * u) / 24;
      const head = { font: 'narrow-bold' as const, size: 6 * u, color: MID };
      for (let h = 0; h < 24; h++) put(doc, String(h).padStart(2, '0'), box.x + dayW + (h + 1) * cellW - 1 * u, top - 4 * u, head, 'right');
      doc.save().lineWidth(0.8 * u).strokeColor(INK).moveTo(box.x, top - 1 * u).lineTo(box.x + box.width, top - 1 * u).stroke().restore();
      const row = Math.min(15 * u, (box.y + box.height - top) / days.length);
      const size = Math.min(6.4 * u, row * 0.55, cellW * 0.42);
      days.forEach((day, i) => {
        const hourly = model.hourly.days[month.firstDayIndex + i];
        const y = top + (i + 1) * row - row * 0.3;
        put(doc, `${view.words.weekdayShort(day.weekday)} ${day.dayOfMonth}`, box.x, y, { font: day.weekday === 7 ? 'narrow-bold' : 'narrow', size });
        const cells: string[][] = Array.from({ length: 24 }, () => []);
        hourly?.clocks.forEach((c, k) => {
          const v = inUnits(itemAt(hourly.heights, k, 'hourly heights'), units);
          itemAt(cells, Number(c.slice(0, 2)), 'clock hours').push(view.words.number(Math.round(v * 10) / 10 + 0, 1));
        });
        cells.forEach((values, h) => {
          const right = box.x + dayW + (h + 1) * cellW - 1 * u;
          const [first = '\u2013', second] = values;
          if (second !== undefined) {
            // the repeated hour: before the change above, after it below, in smaller type
            const small = { font: 'narrow' as const, size: size * 0.85 };
            putFitted(doc, first, right, y - size * 0.5, small, cellW - 1 * u, size * 0.4, 'right');
            putFitted(doc, second, right, y + size * 0.45, small, cellW - 1 * u, size * 0.4, 'right');
            return;
          }
          putFitted(doc, first, right, y, { font: 'narrow' as const, size }, cellW - 1 * u, size * 0.5, 'right');
        });
        drawDayCurve(doc, day, { x: box.x + box.width - curveW, y: top + i * row + row * 0.12, width: curveW, height: row * 0.76 }, view.curve, u);
        doc.save().lineWidth(HAIRLINE * u).strokeColor(RULE)
          .moveTo(box.x, top + (i + 1) * row).lineTo(box.x + box.width - curveW - 2 * u, top + (i + 1) * row).stroke().restore();
      });
    },
  };
}
