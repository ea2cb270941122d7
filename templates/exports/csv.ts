// The events of a station-year as CSV (RFC 4180: CRLF, quoted fields where needed). A few leading
// lines starting with "# " carry the caution, units and provenance, so a spreadsheet shows them too.
import type { StationYear } from '../../engine/index.js';
import { inUnits, wordsFor, type Words } from '../locale/index.js';
import { exportNotes } from './notes.js';

/** One CSV field, quoted when it holds a comma, quote or line break (RFC 4180 §2). */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** CSV headers and values are machine-stable (English names, '.' decimals) in every language; the notes follow it. */
export function eventsCsv(model: StationYear, words: Words = wordsFor()): string {
  const units = words.units;
  const lines = exportNotes(model, words).map((note) => `# ${note}`);
  lines.push(['station_id', 'date', 'local_time', 'utc_offset', 'time_utc', 'type',
    units === 'ft' ? 'height_ft' : 'height_m', 'below_chart_datum'].join(','));
  for (const e of model.events) {
    const height = inUnits(e.height, units).toFixed(units === 'ft' ? 2 : 3); // metres to the millimetre, as in the model
    lines.push([model.station.id, e.date, e.clock, e.offset, e.time, e.type, height,
      e.belowDatum ? 'yes' : 'no'].map(csvField).join(','));
  }
  return `${lines.join('\r\n')}\r\n`;
}
