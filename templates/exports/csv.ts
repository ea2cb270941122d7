// The events of a station-year as CSV (RFC 4180: CRLF, quoted fields where needed), in the exports'
// one vocabulary (fields.ts). A few leading lines starting with "# " carry the caution, units and
// provenance, so a spreadsheet shows them too.
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { csvTable, csvText, eventFields, eventRecord, HEIGHT_DIGITS } from './fields.js';
import { exportNotes } from './notes.js';

export { csvField } from './fields.js';

/** CSV headers and values are machine-stable (English names, '.' decimals) in every language; the notes follow it. */
export function eventsCsv(model: StationYear, words: Words = wordsFor()): string {
  const notes = exportNotes(model, words).map((note) => `# ${note}`);
  const records = model.events.map((e) => eventRecord(model.station.id, e.time, e.local, e.date, e.type, e.height, words.units));
  return csvText([...notes, ...csvTable(eventFields(words.units), records, HEIGHT_DIGITS)]);
}
