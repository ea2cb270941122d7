// The one iCalendar writer (RFC 5545) behind every calendar download (tides, windows, streams): CRLF
// line ends, lines folded at 75 octets, TEXT values escaped, times in UTC, stable UIDs and a DTSTAMP
// taken from the edition (never the clock), so two builds of the same input are identical. The
// caution, provenance and what the numbers mean are said once, for the whole calendar; each event is
// one short line.
import type { Position } from '../../engine/index.js';
import type { Words } from '../locale/index.js';

/** Escape a TEXT value (RFC 5545 §3.3.11): backslash, semicolon, comma and line breaks. */
export function escapeText(text: string): string {
  if (!/[\\;,\r\n]/.test(text)) return text; // the usual case: nothing to escape
  return text
    .replace(/\\/g, '\\\\')
    .replace(/;/g, '\\;')
    .replace(/,/g, '\\,')
    .replace(/\r\n|\r|\n/g, '\\n');
}

/** Fold one content line at 75 octets (RFC 5545 §3.1), never inside a UTF-8 character. */
export function foldLine(line: string): string {
  if (/^[\x20-\x7e]*$/.test(line)) {
    // Printable ASCII (the usual case): one octet per character, so cut by length.
    if (line.length <= 75) return line;
    const parts = [line.slice(0, 75)];
    for (let i = 75; i < line.length; i += 74) parts.push(` ${line.slice(i, i + 74)}`);
    return parts.join('\r\n');
  }
  const out: string[] = [];
  let start = 0;
  let octets = 0;
  let limit = 75;
  for (let i = 0; i < line.length; ) {
    const code = line.charCodeAt(i);
    const pair = code >= 0xd800 && code <= 0xdbff && i + 1 < line.length;
    const units = pair ? 2 : 1;
    const size = pair ? 4 : code < 0x80 ? 1 : code < 0x800 ? 2 : 3; // UTF-8 octets of this character
    if (octets + size > limit) {
      out.push(out.length === 0 ? line.slice(start, i) : ` ${line.slice(start, i)}`);
      start = i;
      octets = 0;
      limit = 74; // continuation lines begin with one space
    }
    octets += size;
    i += units;
  }
  out.push(out.length === 0 ? line.slice(start) : ` ${line.slice(start)}`);
  return out.join('\r\n');
}

/** "2027-01-01T03:12:41Z" → "20270101T031241Z" (RFC 5545 §3.3.5, form 2: UTC). */
export function icalUtc(iso: string): string {
  if (iso.length === 20 && iso[19] === 'Z' && iso[10] === 'T') { // the model's own form, whole seconds: cut, not searched
    return `${iso.slice(0, 4)}${iso.slice(5, 7)}${iso.slice(8, 13)}${iso.slice(14, 16)}${iso.slice(17)}`;
  }
  return iso.replace(/[-:]/g, '').replace(/\.\d+/, '');
}

/**
 * UID of an event: the station, what happens and its UTC instant, so an event keeps its UID when the
 * edition is rebuilt or events around it come and go, and no two events share one.
 */
export function eventUid(stationId: string, what: string, isoTime: string): string {
  return `${stationId}-${what}-${icalUtc(isoTime)}@tidewright`;
}

/** The edition's DTSTAMP: the build's stamp when given, else 1 January of the year. */
export function calendarStamp(year: number, stampMs?: number): string {
  return stampMs === undefined ? `${year}0101T000000Z` : icalUtc(new Date(stampMs).toISOString());
}

/** Where the events happen: the station. */
export interface CalendarPlace { id: string; name: string; position: Position }

/** One event: `what` (a code) and its UTC start make the UID; summary and description are plain text. */
export interface CalendarEvent {
  what: string;
  start: string; // ISO UTC
  end?: string; // ISO UTC, for events that last (a window's opening)
  summary: string;
  description: string;
}

/** The lines of one VEVENT. */
export function calendarEventLines(place: CalendarPlace, stamp: string, e: CalendarEvent): string[] {
  const lines: string[] = [];
  eventLinesOf(placeLines(place), stamp, e, lines);
  return lines;
}

/** What every event of a calendar says of its place: LOCATION and GEO, worded once per calendar. */
function placeLines(place: CalendarPlace): { id: string; location: string; geo: string } {
  return {
    id: place.id,
    location: `LOCATION:${escapeText(place.name)}`,
    geo: `GEO:${place.position.latitude.toFixed(6)};${place.position.longitude.toFixed(6)}`,
  };
}

function eventLinesOf(place: ReturnType<typeof placeLines>, stamp: string, e: CalendarEvent, lines: string[]): void {
  lines.push('BEGIN:VEVENT', `UID:${eventUid(place.id, e.what, e.start)}`, `DTSTAMP:${stamp}`, `DTSTART:${icalUtc(e.start)}`);
  if (e.end !== undefined) lines.push(`DTEND:${icalUtc(e.end)}`);
  lines.push(`SUMMARY:${escapeText(e.summary)}`, `DESCRIPTION:${escapeText(e.description)}`, place.location, place.geo,
    'TRANSP:TRANSPARENT', 'END:VEVENT');
}

/** What the calendar says once, at its head. */
export interface CalendarHead { name: string; description: string; generatorVersion: string }

/** A whole calendar file: its head, then one VEVENT per event, folded, CRLF throughout. */
export function calendarText(head: CalendarHead, words: Words, place: CalendarPlace, stamp: string, events: readonly CalendarEvent[]): string {
  const lines = [
    'BEGIN:VCALENDAR',
    'VERSION:2.0',
    `PRODID:-//tidewright//tidewright ${head.generatorVersion}//${words.language.toUpperCase()}`,
    'CALSCALE:GREGORIAN',
    'METHOD:PUBLISH',
    `X-WR-CALNAME:${escapeText(head.name)}`,
    `X-WR-CALDESC:${escapeText(head.description)}`,
  ];
  const where = placeLines(place);
  for (const e of events) eventLinesOf(where, stamp, e, lines);
  lines.push('END:VCALENDAR');
  return `${lines.map(foldLine).join('\r\n')}\r\n`;
}
