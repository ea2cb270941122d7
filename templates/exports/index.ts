// The export writers: CSV, JSON and iCalendar of a station-year's high and low waters.
export { csvField, eventsCsv } from './csv.js';
export { eventsJson } from './json.js';
export { eventsICalendar } from './icalendar.js';
export { calendarEventLines, calendarStamp, calendarText, escapeText, eventUid, foldLine, icalUtc } from './calendar.js';
export type { CalendarEvent, CalendarHead, CalendarPlace } from './calendar.js';
export { exportFileNames, writeExports } from './write.js';
export type { ExportFileNames } from './write.js';
export { hourlyCsv, windowCalendarEvents, windowsCsv, windowsJson } from './windows.js';
