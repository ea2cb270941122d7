// One vocabulary for every export: the fields of `predict`, `windows` and `height` (--format json|csv)
// and of the build's CSV and JSON downloads are snake_case, start with station_id, are all listed in the
// README's table of fields, and the same record has the same fields wherever it is written.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { buildStationYear, firstOf, itemAt } from '../../engine/index.js';
import type { ReferenceStation, Station } from '../../engine/index.js';
import { eventsCsv } from '../../templates/exports/csv.js';
import { eventsJson } from '../../templates/exports/json.js';
import { hourlyCsv, windowsCsv, windowsJson } from '../../templates/exports/windows.js';
import { wordsFor } from '../../templates/locale/index.js';
import { standStation } from '../fixtures/engine-stations.js';
import { runCli } from '../fixtures/run-cli.js';

afterEach(() => vi.restoreAllMocks());

const ROOT = join(import.meta.dirname, '..', '..');
const DEMO = join(ROOT, 'stations-demo');
const README = readFileSync(join(ROOT, 'README.md'), 'utf8');

/** Field names of the README's table under "Fields of the exports". */
function documentedFields(): Set<string> {
  const section = README.slice(README.indexOf('### Fields of the exports'));
  const table = section.slice(0, section.indexOf('\n\n', section.indexOf('| field |')));
  const names = new Set<string>();
  for (const line of table.split('\n').slice(2)) {
    const first = line.split('|')[1] ?? '';
    for (const m of first.matchAll(/`([a-z0-9_]+)`/g)) names.add(itemAt(m, 1, 'm'));
  }
  return names;
}

const csvHeader = (csv: string): string[] => csv.split('\r\n').find((l) => !l.startsWith('# '))!.split(',');
const jsonKeys = (text: string): string[] => Object.keys(firstOf(JSON.parse(text) as Record<string, unknown>[], 'records'));

const station: ReferenceStation = {
  ...standStation(), timezone: 'Europe/Lisbon', windows: [{ id: 'sill', name: 'Marina sill', above: 2.0 }],
};
const model = buildStationYear(station, { byId: new Map<string, Station>([[station.id, station]]) }, 2027);
const BRINEWOLD = join(DEMO, 'brinewold-head.yaml');
const span = ['--from', '2027-01-01', '--to', '2027-01-03'];

describe('the fields of the exports', () => {
  it('are the same for one kind of record in every export', async () => {
    const events = eventsJson(model);
    const buildEvents = Object.keys(firstOf((JSON.parse(events) as { events: Record<string, unknown>[] }).events, 'events'));
    const predictJson = jsonKeys((await runCli(['predict', BRINEWOLD, ...span, '--format', 'json'])).stdout);
    const predictCsv = csvHeader((await runCli(['predict', BRINEWOLD, ...span, '--format', 'csv'])).stdout);
    expect(buildEvents).toEqual(['station_id', 'time', 'time_local', 'date_local', 'type', 'height_m', 'below_chart_datum']);
    expect(csvHeader(eventsCsv(model))).toEqual(buildEvents);
    expect(predictJson).toEqual(buildEvents);
    expect(predictCsv).toEqual(buildEvents);
    const heightsJson = jsonKeys((await runCli(['predict', BRINEWOLD, ...span, '--every', '60', '--format', 'json'])).stdout);
    expect(heightsJson).toEqual(['station_id', 'time', 'time_local', 'height_m']);
    expect(csvHeader((await runCli(['predict', BRINEWOLD, ...span, '--every', '60', '--format', 'csv'])).stdout)).toEqual(heightsJson);
    expect(csvHeader(hourlyCsv(model))).toEqual(heightsJson);
  });

  it('are snake_case, lead with station_id, and are all in the README table', async () => {
    const documented = documentedFields();
    expect(documented.size).toBeGreaterThan(15);
    const windowIntervals = firstOf(firstOf((JSON.parse(windowsJson(model)) as { windows: { intervals: Record<string, unknown>[] }[] }).windows, 'windows').intervals, 'intervals');
    const records: [string, string[]][] = [
      ['build events CSV', csvHeader(eventsCsv(model))],
      ['build events CSV in feet', csvHeader(eventsCsv(model, wordsFor({ units: 'ft' })))],
      ['build windows CSV', csvHeader(windowsCsv(model))],
      ['build windows JSON', Object.keys(windowIntervals)],
      ['build hourly CSV', csvHeader(hourlyCsv(model))],
      ['predict JSON', jsonKeys((await runCli(['predict', BRINEWOLD, ...span, '--format', 'json'])).stdout)],
      ['predict stream JSON', jsonKeys((await runCli(['predict', join(DEMO, 'wrackrun-narrows.yaml'), ...span, '--format', 'json'])).stdout)],
      ['predict stream --every CSV', csvHeader((await runCli(['predict', join(DEMO, 'wrackrun-narrows.yaml'), ...span, '--every', '60', '--format', 'csv'])).stdout)],
      ['windows JSON', jsonKeys((await runCli(['windows', BRINEWOLD, '--above', '4', ...span, '--format', 'json'])).stdout)],
      ['windows CSV', csvHeader((await runCli(['windows', BRINEWOLD, '--above', '4', ...span, '--format', 'csv'])).stdout)],
      ['height JSON', Object.keys(JSON.parse((await runCli(['height', BRINEWOLD, '--at', '2027-01-01T12:00', '--format', 'json'])).stdout) as object)],
    ];
    for (const [where, fields] of records) {
      expect(fields[0], where).toBe('station_id');
      for (const f of fields) {
        expect(f, where).toMatch(/^[a-z][a-z0-9]*(_[a-z0-9]+)*$/);
        expect(documented.has(f), `${where}: ${f} is in the README's table of fields`).toBe(true);
      }
    }
  });
});
