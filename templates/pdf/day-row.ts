// One day of a month page: spring/neap badge, date, moon, the high-water lane above the low-water
// lane (each in time order), the day's curve, and sunrise/sunset.
import type { AlmanacEvent, DayEntry } from '../../engine/index.js';
import { dayLanes } from '../day-lanes.js';
import type { Words } from '../locale/index.js';
import { drawDayCurve } from './day-curve.js';
import { barsHeight, drawWindowBars, windowsAlt } from './window-bars.js';
import { belowDatumMark, clockGlyph, laneMark, moonGlyph, springNeapBadge, sunGlyph, sunGlyphWidth } from './glyphs.js';
import type { Columns } from './month-layout.js';
import { monthType, noteBand } from './month-layout.js';
import type { HeightUnits } from './options.js';
import type { StationView } from './station-view.js';
import { FAINT, INK, LABEL_MIN, MID, READING_MIN } from './style.js';
import { group, tag } from './tags.js';
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
  let slots = Math.max(3, events.length);
  let slotW = (lanes.x + lanes.w - start) / slots;
  // on a clock-change day each time carries its own offset, so the repeated hour is never ambiguous
  const entries: LaneEntry[] = events.map((e) => ({
    clock: e.clock,
    // the offset in full but without its "UTC" (the month's heading names it), so the lane keeps legible type
    offset: day.offsetChange ? view.words.offset(e.offset).replace(/^UTC/, '') : null,
    height: view.words.heightNumber(e.height, e.belowDatum),
    below: e.belowDatum,
  }));
  const type0 = monthType(u);
  // sizes scaled by k, but not below the legible minimum where the design size was above it
  const at = (size: number, k: number, min: number) => Math.max(Math.min(size, min), size * k);
  const styles = (k: number, min: number) => ({
    time: { font: type === 'high' ? 'narrow-bold' : 'narrow', size: at(type0.time, k, min) } as TextStyle,
    offset: { font: 'narrow', size: at(type0.offset, k, Math.min(min, LABEL_MIN)), color: MID } as TextStyle,
    height: { font: 'narrow', size: at(type0.height, k, min), color: type === 'high' ? INK : '#222222' } as TextStyle,
    below: { font: 'narrow-bold', size: at(type0.height * (8.9 / 8.6), k, min) } as TextStyle,
    gap: 2.6 * u * k,
  });
  type LaneStyles = ReturnType<typeof styles>;
  const width = (e: LaneEntry, st: LaneStyles) => widthOf(doc, e.clock, st.time)
    + (e.offset ? widthOf(doc, e.offset, st.offset) + 1 * u : 0) + st.gap
    + widthOf(doc, e.height, e.below ? st.below : st.height) + (e.below ? 6.5 * u : 0);
  // shrink the whole lane if its widest entry would run into the next slot, keeping the legible
  // minimum; entries wider than planned (a clock-change day's offsets) spread over the free slots,
  // and only if even that would collide does the type go below the minimum
  const fit = (n: number) => {
    const room = (lanes.x + lanes.w - start) / n - 3.5 * u;
    const widest = Math.max(0, ...entries.map((e) => width(e, styles(1, 0))));
    const k = Math.min(1, room / Math.max(widest, 1e-9));
    const floored = styles(k, READING_MIN);
    return { n, k, floored, fits: entries.every((e) => width(e, floored) <= room) };
  };
  let plan = fit(slots);
  if (!plan.fits && entries.length < slots) {
    const wider = fit(Math.max(1, entries.length));
    if (wider.fits) plan = wider;
  }
  slots = plan.n;
  slotW = (lanes.x + lanes.w - start) / slots;
  const st = plan.fits ? plan.floored : styles(plan.k, 0);
  entries.forEach((e, i) => {
    let x = start + i * slotW;
    x += put(doc, e.clock, x, baseline, st.time);
    if (e.offset) x += put(doc, e.offset, x + 0.4 * u, baseline - 3.2 * u, st.offset) + 1 * u;
    x += st.gap;
    const w = put(doc, e.height, x, baseline, e.below ? st.below : st.height);
    if (e.below) {
      belowDatumMark(doc, x + w + 0.8 * u, baseline, st.below.size * (8.6 / 8.9));
      // underlined as well: the mark survives a poor photocopy
      doc.save().lineWidth(0.7 * u).moveTo(x, baseline + 1.4 * u).lineTo(x + w, baseline + 1.4 * u).stroke(INK).restore();
    }
  });
}

/** What a reader hears for the day's curve: the tides it shows, in order. */
function curveAlt(day: DayEntry, w: Words): string {
  const times = (type: 'high' | 'low') => `${w.eventName(type)} ${w.list(day.events.filter((e) => e.type === type).map((e) => e.clock))}`;
  return `${w.t('key.curve')} ${times('high')}; ${times('low')}`;
}

/** One day as a table row (day, marks, high waters, low waters, curve, sun), and its clock-change note as a row of its own. */
export function drawDayRow(doc: PDFKit.PDFDocument, view: StationView, day: DayEntry, f: RowFrame): number {
  const { cols, top, height, u } = f;
  const weekend = day.weekday >= 6;
  const lanesY = laneBaselines(top, height);
  if (weekend) doc.save().rect(cols.day.x, top, cols.day.w + cols.moon.w, height).fill(FAINT).restore();

  group(doc, 'TR', {}, () => {
    const dayRight = cols.day.x + cols.day.w - 2 * u;
    tag(doc, 'TH', { scope: 'Row' }, () => {
      put(doc, String(day.dayOfMonth), dayRight, top + height * 0.52, { font: 'bold', size: 13.5 * u }, 'right');
      put(doc, view.words.weekdayShort(day.weekday), dayRight, top + height * 0.52 + 8.2 * u,
        { font: weekend ? 'narrow-bold' : 'narrow', size: Math.max(monthType(u).label, 6.6 * u), color: weekend ? INK : MID }, 'right');
    });

    group(doc, 'TD', {}, () => {
      if (day.springNeap) {
        const kind = day.springNeap;
        tag(doc, 'Figure', { alt: f.words.springNeapName(kind) }, () => springNeapBadge(doc, kind,
          cols.badge.x + cols.badge.w / 2, top + height / 2, cols.badge.w, Math.min(height - 4 * u, 21 * u), 10.5 * u,
          f.words.t(kind === 'spring' ? 'tide.springMark' : 'tide.neapMark')));
      }
      if (day.moonPhase) {
        const moon = day.moonPhase;
        const cx = cols.moon.x + cols.moon.w / 2;
        const cy = top + height * 0.36;
        const r = 4.6 * u;
        const phase = view.model.moonPhases.find((m) => m.date === day.date && m.phase === moon);
        tag(doc, 'Figure', { alt: `${f.words.phaseName(moon)}${phase ? ` ${phase.clock}` : ''}` }, () => {
          moonGlyph(doc, moon, cx, cy, r, view.southern);
          if (phase) put(doc, phase.clock, cx, cy + r + 6 * u, { font: 'narrow', size: monthType(u).clock, color: MID }, 'center');
        });
      }
    });

    const lanes = dayLanes(day.events);
    tag(doc, 'TD', {}, () => drawLane(doc, view, lanes.high, 'high', day, f, lanesY.high));
    tag(doc, 'TD', {}, () => drawLane(doc, view, lanes.low, 'low', day, f, lanesY.low));

    const pad = 2.2 * u;
    const curve = cols.curve;
    if (curve) {
      const windows = view.windows.windows.length;
      const bars = barsHeight(windows, u);
      const box = { x: curve.x, y: top + pad, width: curve.w, height: height - 2 * pad - Math.max(0, bars - pad * 0.6) };
      const alt = windows ? `${curveAlt(day, f.words)}; ${windowsAlt(view.windows, day, f.words)}` : curveAlt(day, f.words);
      group(doc, 'TD', {}, () => tag(doc, 'Figure', { alt }, () => {
        drawDayCurve(doc, day, box, view.curve, u);
        if (windows) drawWindowBars(doc, view.windows, day, box, view.curve, u);
      }));
    }

    group(doc, 'TD', {}, () => drawSun(doc, day, f, lanesY));
  });

  if (day.offsetChange) {
    const change = day.offsetChange;
    const y = top + height;
    const band = noteBand(u);
    const r = 3.3 * u;
    group(doc, 'TR', {}, () => tag(doc, 'TD', {}, () => {
      clockGlyph(doc, cols.day.x + r + 1 * u, y + band / 2 - 0.5 * u, r);
      putFitted(doc, view.words.offsetChange(change), cols.day.x + 2 * r + 4 * u, y + band * 0.62,
        { font: 'narrow-bold', size: Math.max(READING_MIN, 7 * u) }, cols.sun.x + cols.sun.w - cols.day.x - 2 * r - 4 * u, READING_MIN);
    }));
    return height + band;
  }
  return height;
}

function drawSun(doc: PDFKit.PDFDocument, day: DayEntry, f: RowFrame, y: { high: number; low: number }): void {
  const { sun } = f.cols;
  const u = f.u;
  const style: TextStyle = { font: 'narrow', size: monthType(u).clock };
  if (day.sunNote) {
    const w = f.words;
    const upper = w.t(day.sunNote === 'sun-up-all-day' ? 'sun.upShort' : 'sun.downShort');
    putFitted(doc, upper, sun.x, y.high, { ...style, font: 'narrow-bold' }, sun.w, 4.5 * u);
    putFitted(doc, w.t('sun.allDayShort'), sun.x, y.low, { ...style, font: 'narrow-bold' }, sun.w, 4.5 * u);
    return;
  }
  const glyph = 7.4 * u;
  const textX = sun.x + sunGlyphWidth(glyph) + 1.5 * u;
  // Rises on the upper line, sets on the lower, each in time order: near the polar circles a day
  // can hold two of one kind, and both are printed (narrowed to fit the column if need be).
  const clocks = (type: 'rise' | 'set') => day.sky.filter((e) => e.body === 'sun' && e.type === type).map((e) => e.clock);
  tag(doc, 'Figure', { alt: f.words.t('sun.rise') }, () => sunGlyph(doc, true, sun.x, y.high, glyph));
  putSunClocks(doc, clocks('rise'), textX, y.high, style, sun.x + sun.w - textX, u);
  tag(doc, 'Figure', { alt: f.words.t('sun.set') }, () => sunGlyph(doc, false, sun.x, y.low, glyph));
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
