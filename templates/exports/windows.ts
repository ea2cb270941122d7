// Access windows and hourly heights of a station-year as downloads: windows as CSV and JSON (whole
// intervals, UTC and local), as iCalendar events for the station's calendar, and the hourly heights as CSV.
import { clock, itemAt, type StationYear, type WindowYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { csvField, csvTable, csvText, exportHeight, HEIGHT_DIGITS, heightField, heightFields, type ExportRecord } from './fields.js';
import type { CalendarEvent } from './calendar.js';
import { exportNotes } from './notes.js';

const MINUTE = 60_000;
const DAY = 86_400_000;

/** "open while the tide is at or above 2.40 m" */
function rule(w: WindowYear, words: Words): string {
  return words.t(w.side === 'above' ? 'window.ruleAbove' : 'window.ruleBelow', { level: words.height(w.level).replace('\u00a0', ' ') });
}

function notes(model: StationYear, words: Words, what: 'export.windowsFor' | 'export.hourlyFor', secondary: boolean): string[] {
  const lines = exportNotes(model, words);
  lines[0] = words.t(what, { station: model.station.name.replace(/[\r\n\t]+/g, ' ').trim(), id: model.station.id, year: model.year });
  if (secondary) lines.splice(2, 0, words.t('window.secondaryNote'));
  return lines;
}

export function windowsCsv(model: StationYear, words: Words = wordsFor()): string {
  const units = words.units;
  const secondary = model.windows.some((w) => w.method === 'secondary-curve');
  const lines = notes(model, words, 'export.windowsFor', secondary).map((n) => `# ${n}`);
  for (const w of model.windows) lines.push(`# ${w.id}: ${w.name.replace(/[\r\n\t]+/g, ' ')}, ${rule(w, words)}.`);
  const level = units === 'ft' ? 'level_ft' : 'level_m';
  const records: ExportRecord[] = model.windows.flatMap((w) => w.intervals.map((i) => ({
    station_id: model.station.id, window_id: w.id, side: w.side, [level]: exportHeight(w.level, units),
    start: i.start, start_local: i.startLocal, end: i.end, end_local: i.endLocal,
    duration_min: Math.round((Date.parse(i.end) - Date.parse(i.start)) / MINUTE),
  })));
  const fields = ['station_id', 'window_id', 'side', level, 'start', 'start_local', 'end', 'end_local', 'duration_min'];
  return csvText([...lines, ...csvTable(fields, records, HEIGHT_DIGITS)]);
}

export function windowsJson(model: StationYear, words: Words = wordsFor()): string {
  const st = model.station;
  const doc = {
    kind: 'tidewright-windows',
    version: 2,
    station: { id: st.id, name: st.name, kind: st.kind, timezone: model.timezone, datum: st.datum },
    year: model.year,
    units: 'm',
    invented: model.invented,
    caution: words.caution,
    secondary_note: model.windows.some((w) => w.method === 'secondary-curve') ? words.t('window.secondaryNote') : null,
    provenance: st.provenance,
    generator: model.generator,
    windows: model.windows.map((w) => ({
      window_id: w.id, name: w.name, side: w.side, level_m: w.level, method: w.method, out_of_range: w.outOfRange,
      intervals: w.intervals.map((i) => ({
        station_id: st.id, window_id: w.id, start: i.start, start_local: i.startLocal, end: i.end, end_local: i.endLocal,
        duration_min: Math.round((Date.parse(i.end) - Date.parse(i.start)) / MINUTE),
      })),
    })),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

/** Every window opening ("Marina sill open") as a calendar event, one short line each, for the station-year's calendar. */
export function windowCalendarEvents(model: StationYear, words: Words): CalendarEvent[] {
  const st = model.station;
  return model.windows.flatMap((w) => {
    const secondary = w.method === 'secondary-curve' ? ` ${words.t('window.secondaryNote')}` : '';
    return w.intervals.map((i) => ({
      what: w.id, start: i.start, end: i.end,
      summary: words.t('window.open', { window: w.name }),
      description: `${words.t('window.calendar', { window: w.name, rule: rule(w, words), datum: st.datum, from: clock(Date.parse(i.start), model.timezone), to: clock(Date.parse(i.end), model.timezone) })}${secondary}`,
    }));
  });
}

/** "2027-03-28T01:00:00Z": an instant of whole seconds as the exports write it, the date worded once per UTC day. */
function utcSeconds(dates: Map<number, string>): (ms: number) => string {
  const two = (n: number): string => (n < 10 ? `0${n}` : String(n));
  return (ms) => {
    const day = Math.floor(ms / DAY);
    let date = dates.get(day);
    if (date === undefined) {
      date = new Date(day * DAY).toISOString().slice(0, 10); // throws on an instant that is not one, as toISOString does
      dates.set(day, date);
    }
    const s = Math.round((ms - day * DAY) / 1000);
    return `${date}T${two(Math.floor(s / 3600))}:${two(Math.floor((s % 3600) / 60))}:${two(s % 60)}Z`;
  };
}

/**
 * The hourly heights: 8,760 rows a year, so each row is written straight from the fields of a height
 * record (fields.ts: heightFields, heightRecord's values) rather than through a record object each.
 */
export function hourlyCsv(model: StationYear, words: Words = wordsFor()): string {
  const units = words.units;
  const secondary = model.hourly.method === 'secondary-curve';
  const lines = notes(model, words, 'export.hourlyFor', secondary).map((n) => `# ${n}`);
  const fields = heightFields(units);
  const digits = HEIGHT_DIGITS[heightField(units)];
  lines.push(fields.join(','));
  const id = csvField(model.station.id);
  const utc = utcSeconds(new Map());
  for (const d of model.hourly.days) {
    // The instant of a local clock reading: the day's midnight at that reading's offset (parsed once
    // per day and offset) plus the clock's minutes.
    const midnights = new Map<string, number>();
    d.clocks.forEach((c, i) => {
      const offset = itemAt(d.offsets, i, 'hourly offsets');
      let midnight = midnights.get(offset);
      if (midnight === undefined) {
        midnight = Date.parse(`${d.date}T00:00:00${offset}`);
        midnights.set(offset, midnight);
      }
      const height = itemAt(d.heights, i, 'hourly heights');
      const value = height === null || !Number.isFinite(height) ? '' : exportHeight(height, units).toFixed(digits);
      lines.push(`${id},${utc(midnight + (Number(c.slice(0, 2)) * 60 + Number(c.slice(3, 5))) * MINUTE)},${csvField(`${d.date}T${c}:00${offset}`)},${value}`);
    });
  }
  return csvText(lines);
}
