// Access windows and hourly heights of a station-year as downloads: windows as CSV and JSON (whole
// intervals, UTC and local), as iCalendar events for the station's calendar, and the hourly heights as CSV.
import { SECONDARY_WINDOW_NOTE } from '../../engine/index.js';
import type { StationYear, WindowYear } from '../../engine/index.js';
import { inUnits, wordsFor, type Words } from '../locale/index.js';
import { csvField } from './csv.js';
import { escapeText, icalUtc } from './icalendar.js';
import { exportNotes } from './notes.js';

const MINUTE = 60_000;

/** "open while the tide is at or above 2.40 m" */
function rule(w: WindowYear, words: Words): string {
  return words.t(w.side === 'above' ? 'window.ruleAbove' : 'window.ruleBelow', { level: words.height(w.level).replace('\u00a0', ' ') });
}

function notes(model: StationYear, words: Words, what: 'export.windowsFor' | 'export.hourlyFor', secondary: boolean): string[] {
  const lines = exportNotes(model, words);
  lines[0] = words.t(what, { station: model.station.name.replace(/[\r\n\t]+/g, ' ').trim(), id: model.station.id, year: model.year });
  if (secondary) lines.splice(2, 0, SECONDARY_WINDOW_NOTE);
  return lines;
}

export function windowsCsv(model: StationYear, words: Words = wordsFor()): string {
  const units = words.units;
  const secondary = model.windows.some((w) => w.method === 'secondary-curve');
  const lines = notes(model, words, 'export.windowsFor', secondary).map((n) => `# ${n}`);
  for (const w of model.windows) lines.push(`# ${w.id}: ${w.name.replace(/[\r\n\t]+/g, ' ')}, ${rule(w, words)}.`);
  lines.push(['station_id', 'window_id', 'side', units === 'ft' ? 'level_ft' : 'level_m', 'start_utc', 'start_local',
    'end_utc', 'end_local', 'minutes'].join(','));
  for (const w of model.windows) {
    const level = inUnits(w.level, units).toFixed(units === 'ft' ? 2 : 3);
    for (const i of w.intervals) {
      const minutes = Math.round((Date.parse(i.end) - Date.parse(i.start)) / MINUTE);
      lines.push([model.station.id, w.id, w.side, level, i.start, i.startLocal, i.end, i.endLocal, String(minutes)]
        .map(csvField).join(','));
    }
  }
  return `${lines.join('\r\n')}\r\n`;
}

export function windowsJson(model: StationYear, words: Words = wordsFor()): string {
  const st = model.station;
  const doc = {
    kind: 'tidewright-windows',
    version: 1,
    station: { id: st.id, name: st.name, type: st.kind, timezone: model.timezone, datum: st.datum },
    year: model.year,
    units: 'm',
    invented: model.invented,
    caution: words.caution,
    secondaryNote: model.windows.some((w) => w.method === 'secondary-curve') ? SECONDARY_WINDOW_NOTE : null,
    provenance: st.provenance,
    generator: model.generator,
    windows: model.windows.map((w) => ({
      id: w.id, name: w.name, side: w.side, level: w.level, method: w.method, outOfRange: w.outOfRange,
      intervals: w.intervals,
    })),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

/** VEVENT lines of every window opening ("Marina sill open"), for the station-year's calendar. */
export function windowCalendarEvents(model: StationYear, words: Words, stamp: string, invented: string): string[] {
  const st = model.station;
  const lines: string[] = [];
  for (const w of model.windows) {
    const secondary = w.method === 'secondary-curve' ? `\n\n${SECONDARY_WINDOW_NOTE}` : '';
    w.intervals.forEach((i, n) => {
      const description = `${words.t('window.calendar', { window: w.name, station: st.name, rule: rule(w, words), datum: st.datum, from: i.startLocal, to: i.endLocal })}`
        + `${secondary}\n\n${words.t('caution.heading')}: ${words.caution}${invented}`;
      lines.push(
        'BEGIN:VEVENT',
        `UID:${st.id}-${model.year}-${w.id}-${n + 1}@tidewright`,
        `DTSTAMP:${stamp}`,
        `DTSTART:${icalUtc(i.start)}`,
        `DTEND:${icalUtc(i.end)}`,
        `SUMMARY:${escapeText(words.t('window.open', { window: w.name }))}`,
        `DESCRIPTION:${escapeText(description)}`,
        `LOCATION:${escapeText(st.name)}`,
        'TRANSP:TRANSPARENT',
        'END:VEVENT',
      );
    });
  }
  return lines;
}

export function hourlyCsv(model: StationYear, words: Words = wordsFor()): string {
  const units = words.units;
  const secondary = model.hourly.method === 'secondary-curve';
  const lines = notes(model, words, 'export.hourlyFor', secondary).map((n) => `# ${n}`);
  lines.push(['station_id', 'date', 'local_time', 'utc_offset', units === 'ft' ? 'height_ft' : 'height_m'].join(','));
  for (const d of model.hourly.days) {
    d.clocks.forEach((c, i) => {
      lines.push([model.station.id, d.date, c, d.offsets[i]!, inUnits(d.heights[i]!, units).toFixed(units === 'ft' ? 2 : 3)]
        .map(csvField).join(','));
    });
  }
  return `${lines.join('\r\n')}\r\n`;
}
