// A month on one panel of the pocket table: a line per day with its high waters and, where they fit at
// the legible minimum, its low waters. Whether they fit is decided once per table by measuring the
// widest times and heights of the year in the faces and sizes used.
import { firstOf, type AlmanacEvent, type DayEntry, type MonthEntry, type StationYear } from '../../../engine/index.js';
import type { Words } from '../../locale/index.js';
import type { Box } from '../geometry.js';
import { clockGlyph, laneMark, moonGlyph } from '../glyphs.js';
import { FAINT, HAIRLINE, INK, LABEL_MIN, MID, RULE, WHITE } from '../style.js';
import type { TextStyle } from '../text.js';
import { group, tag } from '../tags.js';
import { paragraph, put, putFitted, widthOf } from '../text.js';

export interface PocketMonthLayout {
  size: number; // type size of times and heights, ≥ LABEL_MIN
  lows: boolean; // low waters shown (they fit beside the highs at `size`)
  highSlots: number; // most high waters on one day in the year
  lowSlots: number;
  entry: { high: number; low: number }; // width of one time-and-height entry
  gap: number;
  dayW: number; // day number
  weekdayW: number;
  moonW: number;
  header: number; // height above the first day
  footer: number; // height kept below the last day for a clock-change note
  row: number;
}

const SIZES = [7.2, 7, 6.8, 6.6, 6.4, 6.2, LABEL_MIN];
const HEADER = 23;
const SLOT_PAD = 1.2; // space after each entry, in gaps

const timeStyle = (type: 'high' | 'low', size: number): TextStyle => ({ font: type === 'high' ? 'narrow-bold' : 'narrow', size });
const heightStyle = (size: number): TextStyle => ({ font: 'narrow', size, color: '#222222' });

function perDay(model: StationYear, type: 'high' | 'low'): number {
  return Math.max(1, ...model.days.map((d) => d.events.filter((e) => e.type === type).length));
}

/** The largest size (down to the minimum) at which highs and lows fit side by side; highs alone otherwise. */
export function pocketMonthLayout(doc: PDFKit.PDFDocument, model: StationYear, box: Box, words: Words): PocketMonthLayout {
  const heights = model.events.map((e) => words.heightNumber(e.height, e.belowDatum));
  const widest = (texts: string[], style: TextStyle) => Math.max(...texts.map((t) => widthOf(doc, t, style)));
  const clocks = [...new Set(model.events.map((e) => e.clock))];
  const highSlots = perDay(model, 'high');
  const lowSlots = perDay(model, 'low');
  const rows = Math.max(...model.months.map((m) => m.dayCount));
  const footer = model.offsetChanges.length > 0 ? 2.5 * LABEL_MIN * 1.2 : 2; // two lines of clock-change note
  const plan = (size: number, lows: boolean): PocketMonthLayout => {
    const gap = size * 0.35;
    const h = widest([...new Set(heights)], heightStyle(size));
    const entry = {
      high: widest(clocks, timeStyle('high', size)) + gap + h,
      low: widest(clocks, timeStyle('low', size)) + gap + h,
    };
    return {
      size, lows, highSlots, lowSlots, entry, gap,
      dayW: widest(['28', '30', '31'], { font: 'bold', size: size + 0.4 }) + 3,
      weekdayW: widest([1, 2, 3, 4, 5, 6, 7].map((d) => words.weekdayShort(d)), { font: 'narrow', size }) + 1.5,
      moonW: size * 1.1,
      header: HEADER,
      footer,
      row: (box.height - HEADER - footer) / rows,
    };
  };
  const width = (p: PocketMonthLayout) => p.dayW + p.weekdayW + p.moonW + 2 * p.gap
    + p.highSlots * (p.entry.high + SLOT_PAD * p.gap) + (p.lows ? 2 * p.gap + p.lowSlots * (p.entry.low + SLOT_PAD * p.gap) : 0);
  const tall = (p: PocketMonthLayout) => p.row >= p.size * 1.1;
  for (const lows of [true, false]) {
    for (const size of SIZES) {
      const p = plan(size, lows);
      if (width(p) <= box.width && tall(p)) return p;
    }
  }
  return plan(LABEL_MIN, false);
}

function springNeapDay(doc: PDFKit.PDFDocument, day: DayEntry, x: number, right: number, baseline: number,
  size: number): void {
  const text = String(day.dayOfMonth);
  const style: TextStyle = { font: 'bold', size: size + 0.4 };
  const top = baseline - size * 0.92;
  const h = size * 1.18;
  if (day.springNeap === 'spring') {
    doc.save().roundedRect(x, top, right - x, h, 1.2).fill(INK).restore();
    put(doc, text, right - 1.5, baseline, { ...style, color: WHITE }, 'right');
  } else if (day.springNeap === 'neap') {
    doc.save().lineWidth(0.7).roundedRect(x + 0.35, top + 0.35, right - x - 0.7, h - 0.7, 1.2).stroke(INK).restore();
    put(doc, text, right - 1.5, baseline, style, 'right');
  } else {
    put(doc, text, right - 1.5, baseline, style, 'right');
  }
}

function entries(doc: PDFKit.PDFDocument, events: AlmanacEvent[], type: 'high' | 'low', x: number, baseline: number,
  slotW: number, L: PocketMonthLayout, words: Words): void {
  events.forEach((e, i) => {
    const ex = x + i * slotW;
    const w = put(doc, e.clock, ex, baseline, timeStyle(type, L.size));
    const hs = e.belowDatum ? { font: 'narrow-bold' as const, size: L.size } : heightStyle(L.size);
    const hx = ex + w + L.gap;
    const hw = put(doc, words.heightNumber(e.height, e.belowDatum), hx, baseline, hs);
    // below chart datum: minus sign, bold and underlined
    if (e.belowDatum) doc.save().lineWidth(0.5).moveTo(hx, baseline + 1).lineTo(hx + hw, baseline + 1).stroke(INK).restore();
  });
}

export function drawPocketMonth(doc: PDFKit.PDFDocument, model: StationYear, month: MonthEntry, box: Box,
  L: PocketMonthLayout, words: Words, southern: boolean): void {
  const days = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
  const head = { font: 'narrow-bold' as const, size: LABEL_MIN, color: MID };
  const monthName = words.monthName(month.month);
  tag(doc, 'H2', {}, () => put(doc, monthName, box.x, box.y + 9, { font: 'bold', size: 10 }));
  const change = days.find((d) => d.offsetChange !== null);
  const start = firstOf(days, 'days of the month').offsetStart;
  const offsets = change ? `${words.offset(start)} \u2192 ${words.offset(change.offsetChange!.to)}` : words.offset(start);
  putFitted(doc, offsets, box.x + box.width, box.y + 9, { font: 'narrow', size: LABEL_MIN, color: MID }, box.width * 0.45, LABEL_MIN, 'right');

  const dayX = box.x;
  const wdX = dayX + L.dayW + L.gap;
  const moonX = wdX + L.weekdayW;
  const highX = moonX + L.moonW + L.gap;
  const highSlot = L.entry.high + SLOT_PAD * L.gap;
  const lowX = highX + L.highSlots * highSlot + L.gap;
  const lowSlot = L.entry.low + SLOT_PAD * L.gap;
  const hy = box.y + L.header - 4;
  let top = box.y + L.header;
  group(doc, 'Table', { title: monthName }, () => {
    group(doc, 'TR', {}, () => {
      tag(doc, 'TH', { scope: 'Column', actual: words.t('site.colDay') }, () => undefined);
      tag(doc, 'TH', { scope: 'Column', actual: words.t('site.colMoon') }, () => undefined);
      tag(doc, 'TH', { scope: 'Column' }, () => {
        laneMark(doc, 'high', highX, hy, LABEL_MIN + 1);
        put(doc, words.eventShort('high'), highX + LABEL_MIN * 0.8, hy, head);
      });
      if (L.lows) {
        tag(doc, 'TH', { scope: 'Column' }, () => {
          laneMark(doc, 'low', lowX, hy, LABEL_MIN + 1);
          put(doc, words.eventShort('low'), lowX + LABEL_MIN * 0.8, hy, head);
        });
      }
    });
    doc.save().lineWidth(0.6).strokeColor(INK).moveTo(box.x, box.y + L.header - 1.5).lineTo(box.x + box.width, box.y + L.header - 1.5).stroke().restore();

    for (const day of days) {
      const baseline = top + L.row * 0.5 + L.size * 0.36;
      const weekend = day.weekday >= 6;
      if (weekend) doc.save().rect(wdX - L.gap * 0.5, top, L.weekdayW, L.row).fill(FAINT).restore();
      const mark = day.springNeap ? `, ${words.springNeapName(day.springNeap)}` : '';
      group(doc, 'TR', {}, () => {
        tag(doc, 'TH', { scope: 'Row', actual: `${day.dayOfMonth} ${words.weekdayShort(day.weekday)}${mark}` }, () => {
          springNeapDay(doc, day, dayX, dayX + L.dayW, baseline, L.size);
          put(doc, words.weekdayShort(day.weekday), wdX, baseline, { font: 'narrow', size: L.size, color: weekend ? INK : MID });
        });
        group(doc, 'TD', {}, () => {
          const moon = day.moonPhase;
          if (day.offsetChange) {
            tag(doc, 'Figure', { alt: words.offsetChange(day.offsetChange) }, () => clockGlyph(doc, moonX + L.moonW / 2, top + L.row / 2, L.size * 0.42));
          } else if (moon) {
            tag(doc, 'Figure', { alt: words.phaseName(moon) }, () => moonGlyph(doc, moon, moonX + L.moonW / 2, top + L.row / 2, L.size * 0.42, southern));
          }
        });
        tag(doc, 'TD', {}, () => entries(doc, day.events.filter((e) => e.type === 'high'), 'high', highX, baseline, highSlot, L, words));
        if (L.lows) tag(doc, 'TD', {}, () => entries(doc, day.events.filter((e) => e.type === 'low'), 'low', lowX, baseline, lowSlot, L, words));
      });
      top += L.row;
      const weekEnd = day.weekday === 7;
      doc.save().lineWidth(weekEnd ? 0.6 : HAIRLINE).strokeColor(weekEnd ? INK : RULE)
        .moveTo(box.x, top).lineTo(box.x + box.width, top).stroke().restore();
    }
  });
  if (L.lows) {
    doc.save().lineWidth(HAIRLINE).strokeColor(RULE).moveTo(lowX - L.gap, box.y + L.header).lineTo(lowX - L.gap, top).stroke().restore();
  }
  if (change) {
    paragraph(doc, `${change.dayOfMonth}: ${words.offsetChange(change.offsetChange!)}`, box.x, top + LABEL_MIN + 1, box.width,
      { font: 'narrow-bold', size: LABEL_MIN }, LABEL_MIN * 1.2, 2);
  }
}
