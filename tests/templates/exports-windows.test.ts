// Downloads of access windows and hourly heights: CSV, JSON and calendar events read back against the
// model they were written from (the model's numbers are checked in tests/engine/windows.test.ts).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { buildStationYear, firstOf, itemAt } from '../../engine/index.js';
import type { ReferenceStation, Station } from '../../engine/index.js';
import { eventsICalendar } from '../../templates/exports/icalendar.js';
import { hourlyCsv, windowsCsv, windowsJson } from '../../templates/exports/windows.js';
import { writeExports } from '../../templates/exports/write.js';
import { standStation } from '../fixtures/engine-stations.js';
import { wordsFor } from '../../templates/locale/index.js';
import { neighbours } from '../fixtures/lists.js';

const station: ReferenceStation = {
  ...standStation(), timezone: 'Europe/Lisbon',
  windows: [{ id: 'sill', name: 'Marina sill, east gate', above: 2.0 }, { id: 'bridge', name: 'Road bridge', below: 0.9 }],
};
const model = buildStationYear(station, { byId: new Map<string, Station>([[station.id, station]]) }, 2027);

const rows = (csv: string): string[][] => csv.trimEnd().split('\r\n').filter((l) => !l.startsWith('# ')).map((l) => l.split(','));

describe('window downloads', () => {
  it('CSV: one row per whole interval, UTC and local, with the notes and caution first', () => {
    const csv = windowsCsv(model);
    expect(csv).toContain(`# Caution: ${wordsFor().caution}`);
    expect(csv).toContain('# sill: Marina sill, east gate, open while the tide is at or above 2.00 m.');
    const [header, ...body] = rows(csv);
    expect(header).toEqual(['station_id', 'window_id', 'side', 'level_m', 'start', 'start_local', 'end', 'end_local', 'duration_min']);
    const expected = model.windows.flatMap((w) => w.intervals.map((i) => [station.id, w.id, w.side, w.level.toFixed(3), i.start, i.startLocal, i.end, i.endLocal,
      String(Math.round((Date.parse(i.end) - Date.parse(i.start)) / 60_000))]));
    expect(body).toEqual(expected);
    expect(body.length).toBeGreaterThan(500);
  });

  it('JSON: the intervals of the model', () => {
    const doc = JSON.parse(windowsJson(model)) as { windows: { window_id: string; level_m: number; intervals: unknown[] }[]; caution: string; secondary_note: string | null };
    expect(doc.caution).toBe(wordsFor().caution);
    expect(doc.secondary_note).toBeNull();
    expect(doc.windows.map((w) => [w.window_id, w.level_m, w.intervals])).toEqual(model.windows.map((w) => [w.id, w.level, w.intervals.map((i) => ({
      station_id: station.id, window_id: w.id, start: i.start, start_local: i.startLocal, end: i.end, end_local: i.endLocal,
      duration_min: Math.round((Date.parse(i.end) - Date.parse(i.start)) / 60_000) }))]));
  });

  it('iCalendar: a "… open" event from start to end for every interval, after the high and low waters', () => {
    const calendar = new ICAL.Component(ICAL.parse(eventsICalendar(model)));
    const events = calendar.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v));
    const opens = events.filter((e) => e.summary.endsWith(' open'));
    expect(opens).toHaveLength(model.windows.reduce((n, w) => n + w.intervals.length, 0));
    expect(events).toHaveLength(model.events.length + opens.length);
    const first = firstOf(opens, 'opens');
    const interval = firstOf(firstOf(model.windows, 'windows').intervals, 'intervals');
    expect(first.summary).toBe('Marina sill, east gate open');
    expect(first.startDate.toJSDate().toISOString().replace('.000', '')).toBe(interval.start);
    expect(first.endDate.toJSDate().toISOString().replace('.000', '')).toBe(interval.end);
    expect(first.description).not.toContain(wordsFor().caution); // said once, for the whole calendar
    expect(first.uid).toBe(`${station.id}-sill-${interval.start.replace(/[-:]/g, '')}@tidewright`);
  });

  it('iCalendar: the times in an opening\'s words are the minutes the pages print (nearest, not cut)', () => {
    const calendar = new ICAL.Component(ICAL.parse(eventsICalendar(model)));
    const opens = calendar.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v)).filter((e) => e.uid.includes('-sill-'));
    // an opening starting in the second half of a minute: the page prints the next minute, so must the calendar
    const late = firstOf(model.windows, 'windows').intervals.find((i) => new Date(i.start).getUTCSeconds() >= 30)!;
    expect(late).toBeDefined();
    const printed = firstOf(model.windows, 'windows').days.flatMap((d) => d.pieces)
      .find((p) => Date.parse(p.start) === Math.round(Date.parse(late.start) / 60_000) * 60_000)!;
    const event = opens.find((e) => e.startDate.toJSDate().getTime() === Date.parse(late.start))!;
    expect(event.description).toContain(`From ${printed.startClock} `);
  });
});

describe('hourly heights CSV', () => {
  it('every local hour of the year, the repeated hour twice with its offsets', () => {
    const [header, ...body] = rows(hourlyCsv(model));
    expect(header).toEqual(['station_id', 'time', 'time_local', 'height_m']);
    expect(body).toHaveLength(8760);
    expect(body.filter((r) => itemAt(r, 2, 'r').startsWith('2027-03-28'))).toHaveLength(23);
    // the repeated hour of 31 October: two local 01:00s, an hour apart in UTC
    expect(body.filter((r) => itemAt(r, 2, 'r').startsWith('2027-10-31T01:00')).map((r) => [r[1], r[2]]))
      .toEqual([['2027-10-31T00:00:00Z', '2027-10-31T01:00:00+01:00'], ['2027-10-31T01:00:00Z', '2027-10-31T01:00:00+00:00']]);
    expect(body[0]).toEqual([station.id, '2027-01-01T00:00:00Z', '2027-01-01T00:00:00+00:00', firstOf(firstOf(model.hourly.days, 'days').heights, 'heights').toFixed(3)]);
    for (const [a, b] of neighbours(body)) expect(Date.parse(itemAt(b, 1, 'time')) - Date.parse(itemAt(a, 1, 'time'))).toBe(3_600_000);
  });

  it('a secondary port says its heights come from its curve; writeExports writes all five files', async () => {
    const secondary = { ...model, hourly: { ...model.hourly, method: 'secondary-curve' as const } };
    expect(hourlyCsv(secondary)).toContain(`# ${wordsFor().t('window.secondaryNote')}`);
    const dir = mkdtempSync(join(tmpdir(), 'tidewright-window-exports-'));
    try {
      const names = await writeExports(model, dir);
      expect(names.hourly).toBe(`${station.id}-2027-hourly.csv`);
      expect(names.windows).toEqual({ csv: `${station.id}-2027-windows.csv`, json: `${station.id}-2027-windows.json` });
      expect(readFileSync(join(dir, names.windows!.csv), 'utf8')).toBe(windowsCsv(model));
      expect(readFileSync(join(dir, names.hourly), 'utf8')).toBe(hourlyCsv(model));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
