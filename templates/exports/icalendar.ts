// High and low waters of a station-year as one iCalendar file (RFC 5545) that calendar programs import:
// CRLF line ends, lines folded at 75 octets, TEXT values escaped, times in UTC, stable UIDs and a
// DTSTAMP taken from the model (not the clock) so two builds of the same input are identical.
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { windowCalendarEvents } from './windows.js';

/** Escape a TEXT value (RFC 5545 §3.3.11): backslash, semicolon, comma and line breaks. */
export function escapeText(text: string): string {
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
  return iso.replace(/[-:]/g, '').replace(/\.\d+/, '');
}

/**
 * UID of an event: the station, what happens and its UTC instant, so an event keeps its UID when the
 * edition is rebuilt or events around it come and go, and no two events share one.
 */
export function eventUid(stationId: string, what: string, isoTime: string): string {
  return `${stationId}-${what}-${icalUtc(isoTime)}@tidewright`;
}

export function eventsICalendar(model: StationYear, words: Words = wordsFor(), stampMs?: number): string {
  const st = model.station;
  // the build's stamp (edition date), never the clock: reproducible builds; by default 1 January of the year
  const stamp = stampMs === undefined ? `${model.year}0101T000000Z` : icalUtc(new Date(stampMs).toISOString());
  const w = words;
  const invented = model.invented ? ` ${w.t('export.invented')}` : '';
  // The caution, provenance and what the heights mean are said once, for the whole calendar; each
  // event is one short line.
  const lines: string[] = [
    'BEGIN:VCALENDAR',
    'VERSION:2.0',
    `PRODID:-//tidewright//tidewright ${model.generator.version}//${w.language.toUpperCase()}`,
    'CALSCALE:GREGORIAN',
    'METHOD:PUBLISH',
    `X-WR-CALNAME:${escapeText(w.t('ical.name', { year: model.year, station: st.name }))}`,
    `X-WR-CALDESC:${escapeText(`${w.t('ical.description', { station: st.name, datum: st.datum })} ${w.t('caution.heading')}: ${words.caution}${invented} `
      + `${w.t('fact.provenance')}: ${st.provenance}`)}`,
  ];
  for (const e of model.events) {
    const what = w.eventName(e.type);
    const height = words.height(e.height).replace('\u00a0', ' '); // plain text: an ordinary space
    const below = e.belowDatum ? ` (${w.t('ical.below', { datum: st.datum })})` : '';
    lines.push(
      'BEGIN:VEVENT',
      `UID:${eventUid(st.id, e.type, e.time)}`,
      `DTSTAMP:${stamp}`,
      `DTSTART:${icalUtc(e.time)}`,
      `SUMMARY:${escapeText(`${what} ${height}${below}`)}`,
      `DESCRIPTION:${escapeText(`${w.t('ical.event', { what, clock: e.clock, offset: w.offset(e.offset), height, datum: st.datum })}${below}.`)}`,
      `LOCATION:${escapeText(st.name)}`,
      `GEO:${st.position.latitude.toFixed(6)};${st.position.longitude.toFixed(6)}`,
      'TRANSP:TRANSPARENT',
      'END:VEVENT',
    );
  }
  lines.push(...windowCalendarEvents(model, words, stamp));
  lines.push('END:VCALENDAR');
  return `${lines.map(foldLine).join('\r\n')}\r\n`;
}
