// One day of a month page: spring/neap badge, date, moon, the high-water lane above the low-water
// lane (each in time order), the day's curve, and sunrise/sunset.
import type { AlmanacEvent, DayEntry } from '../../engine/index.js';
import { dayLanes } from '../day-lanes.js';
import type { Words } from '../locale/index.js';
import { drawDayCurve } from './day-curve.js';
import { belowDatumMark, clockGlyph, laneMark, moonGlyph, springNeapBadge, sunGlyph, sunGlyphWidth } from './glyphs.js';
import type { Columns } from './month-layout.js';
import { NOTE_BAND } from './month-layout.js';
import type { HeightUnits } from './options.js';
import type { StationView } from './station-view.js';
import { FAINT, INK, MID } from './style.js';
import type { TextStyle } from './text.js';
import { put, putFitted, widthOf } from './text.js';

export interface RowFrame {
  cols: Columns;
  top: number;
  height: number; // the day itself, without the clock-change band
  u: number;
  units: HeightUnits;
  words: Words;
}

/** Where the two lanes' baselines sit within a row. */
export function laneBaselines(top: number, height: number): { high: number; low: number } {
  return { high: top + height * 0.43, low: top + height * 0.84 };
}

interface LaneEntry { clock: string; offset: string | null; height: string; below: boolean }

function drawLane(doc: PDFKit.PDFDocument, view: StationView, events: AlmanacEvent[], type: 'high' | 'low',
  day: DayEntry, f: RowFrame, baseline: number): void {
  const { lanes } = f.cols;
  const u = f.u;
  const markSize = 7.5 * u;
  laneMark(doc, type, lanes.x, baseline, markSize);
  const start = lanes.x + markSize * 0.55 + 3.5 * u;
  const slots = Math.max(3, events.length);
  const slotW = (lanes.x + lanes.w - start) / slots;
  // on a clock-change day each time carries its own offset, so the repeated hour is never ambiguous
  const entries: LaneEntry[] = events.map((e) => ({
    clock: e.clock,
    offset: day.offsetChange ? view.words.offset(e.offset) : null,
    height: view.words.heightNumber(e.height, e.belowDatum),
    below: e.belowDatum,
  }));
  const styles = (k: number) => ({
    time: { font: type === 'high' ? 'narrow-bold' : 'narrow', size: 9.6 * u * k } as TextStyle,
    offset: { font: 'narrow', size: 5.4 * u * k, color: MID } as TextStyle,
    height: { font: 'narrow', size: 8.6 * u * k, color: type === 'high' ? INK : '#222222' } as TextStyle,
    below: { font: 'narrow-bold', size: 8.9 * u * k } as TextStyle,
    gap: 2.6 * u * k,
  });
  const width = (e: LaneEntry, k: number) => {
    const st = styles(k);
    return widthOf(doc, e.clock, st.time) + (e.offset ? widthOf(doc, e.offset, st.offset) + 1 * u * k : 0) + st.gap
      + widthOf(doc, e.height, e.below ? st.below : st.height) + (e.below ? 6.5 * u * k : 0);
  };
  // shrink the whole lane if its widest entry would run into the next slot
  const widest = Math.max(0, ...entries.map((e) => width(e, 1)));
  const k = Math.min(1, (slotW - 3.5 * u) / Math.max(widest, 1e-9));
  const st = styles(k);
  entries.forEach((e, i) => {
    let x = start + i * slotW;
    x += put(doc, e.clock, x, baseline, st.time);
    if (e.offset) x += put(doc, e.offset, x + 0.4 * u * k, baseline - 3.2 * u * k, st.offset) + 1 * u * k;
    x += st.gap;
    const w = put(doc, e.height, x, baseline, e.below ? st.below : st.height);
    if (e.below) {
      belowDatumMark(doc, x + w + 0.8 * u, baseline, 8.6 * u * k);
      // underlined as well: the mark survives a poor photocopy
      doc.save().lineWidth(0.7 * u).moveTo(x, baseline + 1.4 * u).lineTo(x + w, baseline + 1.4 * u).stroke(INK).restore();
    }
  });
}

export function drawDayRow(doc: PDFKit.PDFDocument, view: StationView, day: DayEntry, f: RowFrame): number {
  const { cols, top, height, u } = f;
  const weekend = day.weekday >= 6;
  const lanesY = laneBaselines(top, height);
  if (weekend) doc.save().rect(cols.day.x, top, cols.day.w + cols.moon.w, height).fill(FAINT).restore();

  if (day.springNeap) {
    springNeapBadge(doc, day.springNeap, cols.badge.x + cols.badge.w / 2, top + height / 2,
      cols.badge.w, Math.min(height - 4 * u, 21 * u), 10.5 * u,
      f.words.t(day.springNeap === 'spring' ? 'tide.springMark' : 'tide.neapMark'));
  }

  const dayRight = cols.day.x + cols.day.w - 2 * u;
  put(doc, String(day.dayOfMonth), dayRight, top + height * 0.52, { font: 'bold', size: 13.5 * u }, 'right');
  put(doc, view.words.weekdayShort(day.weekday), dayRight, top + height * 0.52 + 8.2 * u,
    { font: weekend ? 'narrow-bold' : 'narrow', size: 6.6 * u, color: weekend ? INK : MID }, 'right');

  if (day.moonPhase) {
    const cx = cols.moon.x + cols.moon.w / 2;
    const cy = top + height * 0.36;
    const r = 4.6 * u;
    moonGlyph(doc, day.moonPhase, cx, cy, r, view.southern);
    const phase = view.model.moonPhases.find((m) => m.date === day.date && m.phase === day.moonPhase);
    if (phase) put(doc, phase.clock, cx, cy + r + 6 * u, { font: 'narrow', size: 5.6 * u, color: MID }, 'center');
  }

  const lanes = dayLanes(day.events);
  drawLane(doc, view, lanes.high, 'high', day, f, lanesY.high);
  drawLane(doc, view, lanes.low, 'low', day, f, lanesY.low);

  const pad = 2.2 * u;
  drawDayCurve(doc, day, { x: cols.curve.x, y: top + pad, width: cols.curve.w, height: height - 2 * pad },
    view.curve, u);

  drawSun(doc, day, f, lanesY);

  if (day.offsetChange) {
    const y = top + height;
    const band = NOTE_BAND * u;
    const r = 3.3 * u;
    clockGlyph(doc, cols.day.x + r + 1 * u, y + band / 2 - 0.5 * u, r);
    putFitted(doc, view.words.offsetChange(day.offsetChange), cols.day.x + 2 * r + 4 * u, y + band * 0.62,
      { font: 'narrow-bold', size: 7 * u }, cols.sun.x + cols.sun.w - cols.day.x - 2 * r - 4 * u, 5 * u);
    return height + band;
  }
  return height;
}

function drawSun(doc: PDFKit.PDFDocument, day: DayEntry, f: RowFrame, y: { high: number; low: number }): void {
  const { sun } = f.cols;
  const u = f.u;
  const style: TextStyle = { font: 'narrow', size: 7.4 * u };
  if (day.sunNote) {
    const w = f.words;
    const words = day.sunNote === 'sun-up-all-day' ? [w.t('sun.upShort'), w.t('sun.allDayShort')] : [w.t('sun.downShort'), w.t('sun.allDayShort')];
    putFitted(doc, words[0], sun.x, y.high, { ...style, font: 'narrow-bold' }, sun.w, 4.5 * u);
    putFitted(doc, words[1], sun.x, y.low, { ...style, font: 'narrow-bold' }, sun.w, 4.5 * u);
    return;
  }
  const glyph = 7.4 * u;
  const textX = sun.x + sunGlyphWidth(glyph) + 1.5 * u;
  // Rises on the upper line, sets on the lower, each in time order: near the polar circles a day
  // can hold two of one kind, and both are printed (narrowed to fit the column if need be).
  const clocks = (type: 'rise' | 'set') => day.sky.filter((e) => e.body === 'sun' && e.type === type).map((e) => e.clock);
  sunGlyph(doc, true, sun.x, y.high, glyph);
  putSunClocks(doc, clocks('rise'), textX, y.high, style, sun.x + sun.w - textX, u);
  sunGlyph(doc, false, sun.x, y.low, glyph);
  putSunClocks(doc, clocks('set'), textX, y.low, style, sun.x + sun.w - textX, u);
}

function putSunClocks(doc: PDFKit.PDFDocument, clocks: string[], x: number, y: number, style: TextStyle,
  width: number, u: number): void {
  if (clocks.length <= 1) {
    put(doc, clocks[0] ?? '\u2014', x, y, style);
    return;
  }
  putFitted(doc, clocks.join(' '), x, y, style, width, 5.2 * u);
}
