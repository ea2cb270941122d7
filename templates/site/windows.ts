// View helpers for access windows and hourly heights: what each day's window line and hour row read.
// The numbers come from the model (StationYear.windows, StationYear.hourly); nothing is recomputed.
import { itemAt, type DayEntry, type StationYear, type WindowDay, type WindowYear } from '../../engine/index.js';
import { inUnits, type Words } from '../locale/index.js';

export interface DayWindowLine {
  id: string;
  name: string;
  state: WindowDay['state'];
  spans: string[]; // "04:33–12:03", to the minute; 00:00 / 24:00 where open across midnight
}

export interface HourCell {
  clock: string; // "00".."23"
  values: string[]; // 0 (the hour the clocks skip), 1, or 2 (the repeated hour) heights to 0.1
  below: boolean; // a value below datum
}

const indexes = new WeakMap<StationYear, Map<string, number>>();

function dayIndex(model: StationYear, date: string): number {
  let byDate = indexes.get(model);
  if (!byDate) {
    byDate = new Map(model.days.map((d, i) => [d.date, i]));
    indexes.set(model, byDate);
  }
  return byDate.get(date) ?? -1;
}

/** Each window's line for one day. */
export function dayWindows(day: DayEntry, model: StationYear): DayWindowLine[] {
  const i = dayIndex(model, day.date);
  if (i < 0) return [];
  return model.windows.map((w) => {
    const d = itemAt(w.days, i, 'window days');
    return { id: w.id, name: w.name, state: d.state, spans: d.pieces.map((p) => `${p.startClock}–${p.endClock}`) };
  });
}

/** "open while the tide is at or above 2.40 m" in the reader's words and units. */
export function windowRule(w: WindowYear, words: Words): string {
  return words.t(w.side === 'above' ? 'window.ruleAbove' : 'window.ruleBelow', { level: words.height(w.level) });
}

/** The 24 clock hours of a day with their heights to a tenth (a repeated hour has two, a skipped one none). */
export function hourCells(day: DayEntry, model: StationYear, words: Words,
  tenths: (value: number) => string = (value) => words.number(value, 1)): HourCell[] {
  const i = dayIndex(model, day.date);
  const hourly = model.hourly.days[i];
  const cells: HourCell[] = Array.from({ length: 24 }, (_, h) => ({ clock: String(h).padStart(2, '0'), values: [], below: false }));
  if (!hourly) return cells;
  hourly.clocks.forEach((c, k) => {
    const cell = itemAt(cells, Number(c.slice(0, 2)), 'clock hours');
    const metres = itemAt(hourly.heights, k, 'hourly heights');
    const value = inUnits(metres, words.units);
    cell.values.push(Number.isFinite(value) ? tenths(Math.round(value * 10) / 10 + 0).replace('-', '\u2212') : '–');
    if (metres < 0) cell.below = true;
  });
  return cells;
}

export function windowFilters(words: Words): Record<string, (...args: never[]) => unknown> {
  // 8,760 heights a year to a tenth, of a hundred or so different values: each worded once
  const worded = new Map<number, string>();
  const tenths = (value: number): string => {
    let text = worded.get(value);
    if (text === undefined) {
      text = words.number(value, 1);
      worded.set(value, text);
    }
    return text;
  };
  return {
    dayWindows: (day: DayEntry, model: StationYear) => dayWindows(day, model),
    windowRule: (w: WindowYear) => windowRule(w, words),
    hourCells: (day: DayEntry, model: StationYear) => hourCells(day, model, words, tenths),
  };
}
