// Downloads of access windows and hourly heights: CSV, JSON and calendar events read back against the
// model they were written from (the model's numbers are checked in tests/engine/windows.test.ts).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { buildStationYear, SECONDARY_WINDOW_NOTE } from '../../engine/index.js';
import type { ReferenceStation, Station } from '../../engine/index.js';
import { eventsICalendar } from '../../templates/exports/icalendar.js';
import { hourlyCsv, windowsCsv, windowsJson } from '../../templates/exports/windows.js';
import { writeExports } from '../../templates/exports/write.js';
import { standStation } from '../fixtures/engine-stations.js';
import { wordsFor } from '../../templates/locale/index.js';

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
    expect(header).toEqual(['station_id', 'window_id', 'side', 'level_m', 'start_utc', 'start_local', 'end_utc', 'end_local', 'minutes']);
    const expected = model.windows.flatMap((w) => w.intervals.map((i) => [station.id, w.id, w.side, w.level.toFixed(3), i.start, i.startLocal, i.end, i.endLocal,
      String(Math.round((Date.parse(i.end) - Date.parse(i.start)) / 60_000))]));
    expect(body).toEqual(expected);
    expect(body.length).toBeGreaterThan(500);
  });

  it('JSON: the intervals of the model', () => {
    const doc = JSON.parse(windowsJson(model)) as { windows: { id: string; intervals: unknown[] }[]; caution: string; secondaryNote: string | null };
    expect(doc.caution).toBe(wordsFor().caution);
    expect(doc.secondaryNote).toBeNull();
    expect(doc.windows.map((w) => [w.id, w.intervals])).toEqual(model.windows.map((w) => [w.id, w.intervals]));
  });

  it('iCalendar: a "… open" event from start to end for every interval, after the high and low waters', () => {
    const calendar = new ICAL.Component(ICAL.parse(eventsICalendar(model)));
    const events = calendar.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v));
    const opens = events.filter((e) => e.summary.endsWith(' open'));
    expect(opens).toHaveLength(model.windows.reduce((n, w) => n + w.intervals.length, 0));
    expect(events).toHaveLength(model.events.length + opens.length);
    const first = opens[0]!;
    const interval = model.windows[0]!.intervals[0]!;
    expect(first.summary).toBe('Marina sill, east gate open');
    expect(first.startDate.toJSDate().toISOString().replace('.000', '')).toBe(interval.start);
    expect(first.endDate.toJSDate().toISOString().replace('.000', '')).toBe(interval.end);
    expect(first.description).toContain(wordsFor().caution);
    expect(first.uid).toBe(`${station.id}-2027-sill-1@tidewright`);
  });
});

describe('hourly heights CSV', () => {
  it('every local hour of the year, the repeated hour twice with its offsets', () => {
    const [header, ...body] = rows(hourlyCsv(model));
    expect(header).toEqual(['station_id', 'date', 'local_time', 'utc_offset', 'height_m']);
    expect(body).toHaveLength(8760);
    expect(body.filter((r) => r[1] === '2027-03-28')).toHaveLength(23);
    expect(body.filter((r) => r[1] === '2027-10-31' && r[2] === '01:00').map((r) => r[3])).toEqual(['+01:00', '+00:00']);
    expect(body[0]).toEqual([station.id, '2027-01-01', '00:00', '+00:00', model.hourly.days[0]!.heights[0]!.toFixed(3)]);
  });

  it('a secondary port says its heights come from its curve; writeExports writes all five files', async () => {
    const secondary = { ...model, hourly: { ...model.hourly, method: 'secondary-curve' as const } };
    expect(hourlyCsv(secondary)).toContain(`# ${SECONDARY_WINDOW_NOTE}`);
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
