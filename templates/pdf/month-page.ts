// A month page: heading with the month, the station, the clock offsets in force and the height
// unit; column heads; then one row per day.
import { firstOf, lastOf, type DayEntry } from '../../engine/index.js';
import type { Words } from '../locale/index.js';
import { drawDayRow } from './day-row.js';
import { laneMark } from './glyphs.js';
import { drawMonthTab } from './month-tab.js';
import { drawWindowKey } from './window-bars.js';
import { group, tag } from './tags.js';
import type { MonthPart } from './month-layout.js';
import { columns, HEADER_HEIGHT, monthType, monthUnit, needsWideSun } from './month-layout.js';
import type { LogicalPage, PageContext } from './page.js';
import type { StationView } from './station-view.js';
import { HAIRLINE, INK, MID, RULE } from './style.js';
import { put, putFitted, widthOf } from './text.js';

/** "Times UTC+00:00, UTC+01:00 from 28 March" — the offsets of the month (the day itself says when). */
export function offsetStatement(days: DayEntry[], w: Words): string {
  const first = firstOf(days, 'days of the month').offsetStart;
  const changes = days.filter((d) => d.offsetChange !== null);
  if (changes.length === 0) return w.t('book.allTimes', { offset: w.offset(first) });
  const pieces = changes.map((d) => w.t('zone.fromDate', { offset: w.offset(d.offsetChange!.to), date: w.date(d.date, { year: false }) }));
  return w.t('book.timesChanging', { offset: w.offset(first), changes: pieces.join(', ') });
}

export function monthPage(view: StationView, part: MonthPart, row: number): LogicalPage {
  const { model } = view;
  const monthDays = model.days.slice(part.month.firstDayIndex, part.month.firstDayIndex + part.month.dayCount);
  return {
    kind: 'month',
    footer: { invented: model.invented, label: view.name },
    outline: part.partIndex === 0 ? { title: `${view.words.monthName(part.month.month)} ${model.year}`, level: 1 } : undefined,
    draw(ctx: PageContext) {
      const { doc, box } = ctx;
      const u = monthUnit(ctx.settings.geometry);
      const cols = columns(box, u, needsWideSun(part.days));
      const units = ctx.settings.units;
      const y0 = box.y;

      // heading: month and year large on the left; station and day span on the right
      const monthStyle = { font: 'bold' as const, size: 21 * u };
      const mw = tag(doc, 'H1', {}, () => {
        const w = put(doc, view.words.monthName(part.month.month), box.x, y0 + 17 * u, monthStyle);
        put(doc, String(model.year), box.x + w + 6 * u, y0 + 17 * u, { font: 'regular', size: 21 * u, color: MID });
        return w;
      });
      const rightX = box.x + box.width;
      const headW = box.width - mw - widthOf(doc, ` ${model.year}`, { font: 'regular', size: 21 * u }) - 14 * u;
      putFitted(doc, view.name, rightX, y0 + 8 * u, { font: 'bold', size: 9.5 * u }, headW, 6 * u, 'right');
      const first = firstOf(part.days, 'days of the month part').dayOfMonth;
      const last = lastOf(part.days, 'days of the month part').dayOfMonth;
      const w = view.words;
      const span = part.partCount > 1
        ? w.t('book.daySpan', { first, last, count: part.month.dayCount })
        : w.t('book.dayCount', { count: part.month.dayCount });
      put(doc, span, rightX, y0 + 17.5 * u, { font: 'narrow', size: 7.6 * u, color: MID }, 'right');

      const info = `${offsetStatement(monthDays, w)} \u00b7 ${w.t('site.heightsAbove', { unit: w.unitName(), datum: model.station.datum })}`;
      const keyWidth = model.windows.length
        ? drawWindowKey(doc, model.windows, w, rightX, y0 + 29 * u, box.width * 0.45, u) + 6 * u
        : 0;
      putFitted(doc, info, box.x, y0 + 29 * u, { font: 'narrow', size: 7.6 * u }, box.width - keyWidth, 5 * u);

      // the month's table: a row of column heads, then a row per day
      group(doc, 'Table', { title: `${w.monthName(part.month.month)} ${model.year}` }, () => {
        const hy = y0 + 42 * u;
        const head = { font: 'narrow-bold' as const, size: monthType(u).label, color: MID };
        group(doc, 'TR', {}, () => {
          tag(doc, 'TH', { scope: 'Column' }, () => put(doc, w.t('site.colDay').toLocaleUpperCase(w.tag), cols.day.x + cols.day.w - 2 * u, hy, head, 'right'));
          tag(doc, 'TH', { scope: 'Column', actual: `${w.springNeapName('spring')}, ${w.springNeapName('neap')}` }, () => undefined);
          const mark = 7.5 * u;
          let hx = cols.lanes.x;
          tag(doc, 'TH', { scope: 'Column' }, () => {
            laneMark(doc, 'high', hx, hy, mark);
            hx += mark * 0.55 + 3.5 * u;
            hx += put(doc, w.eventName('high').toLocaleUpperCase(w.tag), hx, hy, head) + 8 * u;
          });
          tag(doc, 'TH', { scope: 'Column' }, () => {
            laneMark(doc, 'low', hx, hy, mark);
            hx += mark * 0.55 + 3 * u;
            hx += put(doc, w.eventName('low').toLocaleUpperCase(w.tag), hx, hy, head) + 8 * u;
            put(doc, w.t('book.timeHeight'), hx, hy, { ...head, font: 'narrow' });
          });
          const tick = { font: 'narrow' as const, size: Math.max(monthType(u).label, 5.6 * u), color: MID };
          const curve = cols.curve;
          if (curve) {
            tag(doc, 'TH', { scope: 'Column', actual: w.t('key.curve') }, () => {
              ['0', '6', '12', '18', '24'].forEach((label, i) => {
                const tx = curve.x + (i / 4) * curve.w;
                put(doc, label, tx, hy, tick, i === 0 ? 'left' : i === 4 ? 'right' : 'center');
              });
            });
          }
          tag(doc, 'TH', { scope: 'Column' }, () => put(doc, w.t('site.colSun').toLocaleUpperCase(w.tag), cols.sun.x, hy, head));
        });
        doc.save().lineWidth(0.9 * u).strokeColor(INK)
          .moveTo(box.x, y0 + HEADER_HEIGHT * u - 3 * u).lineTo(rightX, y0 + HEADER_HEIGHT * u - 3 * u).stroke().restore();

        drawMonthTab(ctx, part.month.month);
        let top = y0 + HEADER_HEIGHT * u;
        for (const day of part.days) {
          const h = drawDayRow(doc, view, day, { cols, top, height: row, u, units, words: w });
          top += h;
          const weekEnd = day.weekday === 7;
          doc.save().lineWidth(weekEnd ? 0.9 * u : HAIRLINE).strokeColor(weekEnd ? INK : RULE)
            .moveTo(cols.day.x, top).lineTo(rightX, top).stroke().restore();
        }
      });
    },
  };
}
