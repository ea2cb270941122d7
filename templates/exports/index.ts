// The export writers: CSV, JSON and iCalendar of a station-year's high and low waters.
export { csvField, eventsCsv } from './csv.js';
export { eventsJson } from './json.js';
export { escapeText, eventsICalendar, eventUid, foldLine, icalUtc } from './icalendar.js';
export { exportFileNames, writeExports } from './write.js';
export type { ExportFileNames } from './write.js';
export { hourlyCsv, windowCalendarEvents, windowsCsv, windowsJson } from './windows.js';
