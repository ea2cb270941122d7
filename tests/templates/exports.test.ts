// The downloads of a station-year: CSV and JSON against the model, iCalendar parsed back with ical.js
// and checked against RFC 5545's line rules (CRLF, 75-octet folding, TEXT escaping).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildStreamYear, firstOf, itemAt, loadStationSet, type StationYear } from '../../engine/index.js';
import { streamEventsICalendar } from '../../templates/exports/streams.js';
import { zipSame } from '../fixtures/lists.js';
import { csvField, eventsCsv } from '../../templates/exports/csv.js';
import { escapeText, foldLine } from '../../templates/exports/calendar.js';
import { eventsICalendar } from '../../templates/exports/icalendar.js';
import { eventsJson } from '../../templates/exports/json.js';
import { wordsFor } from '../../templates/locale/index.js';
import { exportFileNames, writeExports } from '../../templates/exports/write.js';
import { demoModels } from './site-build.js';

// Intl is the reference for printed numbers (it rounds the shortest decimal form of a tie away from zero).
const fixed = (v: number, digits: number): string =>
  new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }).format(v);

let model: StationYear;

beforeAll(() => {
  [model] = demoModels(['brinewold-head']);
});

/** The data rows of our CSV: note lines (#) dropped, split on commas (no field of ours is quoted). */
function csvRows(text: string): { header: string[]; rows: string[][]; notes: string[] } {
  const lines = text.split('\r\n').filter((l) => l !== '');
  const notes = lines.filter((l) => l.startsWith('# '));
  const [header = [], ...rows] = lines.filter((l) => !l.startsWith('#')).map((l) => l.split(','));
  return { header, rows, notes };
}

describe('CSV', () => {
  it('has one row per event, matching the model, with CRLF line ends and the caution in its notes', () => {
    const text = eventsCsv(model, wordsFor({ units: 'm' }));
    expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/); // RFC 4180: every line ends in CRLF
    const { header, rows, notes } = csvRows(text);
    expect(header).toEqual(['station_id', 'time', 'time_local', 'date_local', 'type', 'height_m', 'below_chart_datum']);
    expect(rows).toHaveLength(model.events.length);
    zipSame(rows, model.events, 'CSV rows').forEach(([row, e]) => {
      expect(row).toEqual(['brinewold-head', e.time, e.local, e.date, e.type, e.height.toFixed(3), String(e.belowDatum)]);
    });
    const below = { ...model, events: [{ ...itemAt(model.events, 1, 'events'), height: -0.12, belowDatum: true }] };
    expect(csvRows(eventsCsv(below, wordsFor({ units: 'm' }))).rows[0]?.slice(5)).toEqual(['-0.120', 'true']);
    expect(notes.join(' ')).toContain(wordsFor().caution);
    expect(notes.join(' ')).toContain('INVENTED');
    expect(notes.join(' ')).toContain(model.station.provenance);
  });

  it('in feet converts with the international foot and names the column so', () => {
    const { header, rows } = csvRows(eventsCsv(model, wordsFor({ units: 'ft' })));
    expect(header[5]).toBe('height_ft');
    expect(Number(rows[0]?.[5])).toBeCloseTo(firstOf(model.events, 'events').height / 0.3048, 2); // 1 ft = 0.3048 m exactly
  });

  it('quotes fields holding commas, quotes or line breaks (RFC 4180 §2.6–2.7)', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
  });
});

describe('JSON', () => {
  it('carries every event as in the model, the station, the datum and the caution', () => {
    const doc = JSON.parse(eventsJson(model)) as {
      station: { id: string; name: string; datum: string; timezone: string }; year: number; units: string;
      invented: boolean; caution: string; events: Record<string, unknown>[];
    };
    expect(doc.station).toMatchObject({ id: 'brinewold-head', name: model.station.name, datum: model.station.datum, timezone: 'Europe/Lisbon' });
    expect(doc.year).toBe(2027);
    expect(doc.units).toBe('m');
    expect(doc.invented).toBe(true);
    expect(doc.caution).toBe(wordsFor().caution);
    expect(doc.events).toEqual(model.events.map((e) => ({
      station_id: 'brinewold-head', time: e.time, time_local: e.local, date_local: e.date, type: e.type, height_m: e.height, below_chart_datum: e.belowDatum })));
  });
});

describe('iCalendar', () => {
  it('parses back with ical.js: one VEVENT per event, first event’s instant and summary from the model', () => {
    const text = eventsICalendar(model);
    const calendar = new ICAL.Component(ICAL.parse(text));
    expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
    expect(String(calendar.getFirstPropertyValue('prodid'))).toMatch(/tidewright/);
    expect(calendar.getFirstPropertyValue('calscale')).toBe('GREGORIAN');
    expect(calendar.getFirstPropertyValue('x-wr-calname')).toBe(`Tides 2027: ${model.station.name}`);
    const events = calendar.getAllSubcomponents('vevent');
    expect(events).toHaveLength(model.events.length);
    const first = new ICAL.Event(events[0]);
    const e = firstOf(model.events, 'events');
    expect(first.startDate.toJSDate().toISOString().replace('.000', '')).toBe(e.time);
    expect(first.startDate.zone?.tzid).toBe('UTC');
    expect(first.summary).toBe(`${e.type === 'high' ? 'High' : 'Low'} water ${fixed(e.height, 2)} m`);
    expect(first.uid).toBe(`brinewold-head-${e.type}-${e.time.replace(/[-:]/g, '')}@tidewright`);
    expect(first.description).toBe(`${e.type === 'high' ? 'High' : 'Low'} water: ${e.clock} local time (UTC${e.offset}), ${fixed(e.height, 2)} m above Chart Datum.`);
  });

  it('says the caution, the invented note and the provenance once, for the whole calendar; each event is one short line', () => {
    const text = eventsICalendar(model);
    const unfolded = text.replace(/\r\n /g, '');
    const count = (needle: string) => unfolded.split(escapeText(needle)).length - 1;
    expect(count(wordsFor().caution)).toBe(1);
    expect(count('INVENTED')).toBe(1);
    expect(count(model.station.provenance)).toBe(1);
    const calendar = new ICAL.Component(ICAL.parse(text));
    expect(String(calendar.getFirstPropertyValue('x-wr-caldesc'))).toContain(escapeText(wordsFor().caution));
    for (const v of calendar.getAllSubcomponents('vevent')) {
      const event = new ICAL.Event(v);
      expect(event.description).not.toMatch(/\n/);
      expect(event.description.length).toBeLessThanOrEqual(80);
      expect(event.summary.length).toBeLessThanOrEqual(40);
    }
  });

  it('writes the stream calendar the same way: one head with both cautions once, short events, the edition stamp', () => {
    const set = loadStationSet(join(import.meta.dirname, '..', '..', 'stations-demo'));
    const station = set.streams?.find((s) => s.id === 'spindrift-gut');
    if (station === undefined) throw new Error('the demo has no spindrift-gut stream station');
    const streams = buildStreamYear(station, set, 2027);
    const stamp = Date.parse('2026-11-15T00:00:00Z');
    const text = streamEventsICalendar(streams, wordsFor(), stamp);
    const unfolded = text.replace(/\r\n /g, '');
    expect(unfolded.split(escapeText(wordsFor().caution)).length - 1).toBe(1);
    expect(unfolded.split(escapeText(wordsFor().t('caution.streams'))).length - 1).toBe(1);
    const calendar = new ICAL.Component(ICAL.parse(text));
    const events = calendar.getAllSubcomponents('vevent');
    expect(events).toHaveLength(streams.events.length);
    expect(new Set(text.match(/^DTSTAMP:.*$/gm))).toEqual(new Set(['DTSTAMP:20261115T000000Z']));
    // the tide calendar of the same edition carries the same head lines and stamp
    const tide = eventsICalendar(model, wordsFor(), stamp).split('\r\n');
    const stream = text.split('\r\n');
    expect(stream.slice(0, 5)).toEqual(tide.slice(0, 5).map((l) => l.replace(model.generator.version, streams.generator.version)));
    for (const v of events) {
      const event = new ICAL.Event(v);
      expect(event.uid).toMatch(/^spindrift-gut-(slack|flood|ebb)-\d{8}T\d{6}Z@tidewright$/);
      expect(event.description.length).toBeLessThanOrEqual(80);
    }
  });

  it('gives each event a UID of its own that survives a rebuild and events coming or going around it', () => {
    const uids = (m: StationYear) => new ICAL.Component(ICAL.parse(eventsICalendar(m))).getAllSubcomponents('vevent')
      .map((v) => String(v.getFirstPropertyValue('uid')));
    const all = uids(model);
    expect(new Set(all).size).toBe(all.length);
    expect(uids(demoModels(['brinewold-head'])[0])).toEqual(all); // built again from the station file
    // Without the first fortnight's events (a shorter edition), every remaining event keeps its UID.
    const later = { ...model, events: model.events.slice(56) };
    expect(uids(later)).toEqual(all.slice(56));
  });

  it('uses CRLF only, folds at 75 octets, and is the same on every build (fixed DTSTAMP, stable UIDs)', () => {
    const text = eventsICalendar(model);
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    const lines = text.split('\r\n').slice(0, -1);
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    expect(lines.filter((l) => l.startsWith(' ')).length).toBeGreaterThan(2); // the calendar's description folds
    expect(new Set(lines.filter((l) => l.startsWith('DTSTAMP:')))).toEqual(new Set(['DTSTAMP:20270101T000000Z']));
    expect(eventsICalendar(model)).toBe(text);
  });

  it('escapes TEXT values so names with commas, semicolons and backslashes survive (RFC 5545 §3.3.11)', () => {
    expect(escapeText('a,b;c\\d\ne')).toBe('a\\,b\\;c\\\\d\\ne');
    const odd = { ...model, station: { ...model.station, name: 'Quay; North, Pier \\ "Old" — Ærø' } };
    const calendar = new ICAL.Component(ICAL.parse(eventsICalendar(odd)));
    // ical.js keeps X- properties raw (their value type is unknown to it), so compare the escaped text;
    // LOCATION is a TEXT property and must come back exactly as written in the station file.
    expect(calendar.getFirstPropertyValue('x-wr-calname')).toBe('Tides 2027: Quay\\; North\\, Pier \\\\ "Old" — Ærø');
    expect(new ICAL.Event(calendar.getAllSubcomponents('vevent')[0]).location).toBe(odd.station.name);
  });

  it('never splits a multi-byte character when folding', () => {
    const line = `DESCRIPTION:${'é—'.repeat(60)}`; // 2- and 3-octet characters
    const folded = foldLine(line);
    const parts = folded.split('\r\n');
    expect(parts.length).toBeGreaterThan(3);
    for (const p of parts) expect(Buffer.byteLength(p, 'utf8')).toBeLessThanOrEqual(75);
    expect(parts.map((p, i) => (i === 0 ? p : p.slice(1))).join('')).toBe(line);
    expect(foldLine('SHORT:ok')).toBe('SHORT:ok');
  });

  it('in feet says feet in each summary', () => {
    const calendar = new ICAL.Component(ICAL.parse(eventsICalendar(model, wordsFor({ units: 'ft' }))));
    const e = firstOf(model.events, 'events');
    expect(new ICAL.Event(calendar.getAllSubcomponents('vevent')[0]).summary)
      .toBe(`${e.type === 'high' ? 'High' : 'Low'} water ${fixed(e.height / 0.3048, 1)} ft`);
  });
});

describe('writeExports', () => {
  it('writes the three files under the names the site links to, and refuses an unsafe id', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tidewright-exports-'));
    try {
      const names = await writeExports(model, dir);
      expect(names).toEqual({ csv: 'brinewold-head-2027-events.csv', json: 'brinewold-head-2027-events.json', ics: 'brinewold-head-2027.ics',
        hourly: 'brinewold-head-2027-hourly.csv', windows: null });
      expect(readFileSync(join(dir, names.csv), 'utf8')).toBe(eventsCsv(model));
      expect(readFileSync(join(dir, names.json), 'utf8')).toBe(eventsJson(model));
      expect(readFileSync(join(dir, names.ics), 'utf8')).toBe(eventsICalendar(model));
      const escaping = { ...model, station: { ...model.station, id: '../escape' } };
      expect(() => exportFileNames(escaping)).toThrow(/a-z, 0-9/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
