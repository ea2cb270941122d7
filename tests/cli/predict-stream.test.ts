// `tidewright predict` and `tidewright check` on tidal stream stations: the command's shapes and
// rounding. The numbers are the engine's own (streamEventsFor, streamVelocities), tested in
// tests/engine/streams.test.ts; here only what the command does with them.

import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';
import { itemAt, loadStationSet, streamEventsFor, streamVelocities } from '../../engine/index.js';

const ROOT = join(import.meta.dirname, '..', '..');
const DEMO = join(ROOT, 'stations-demo');
const NARROWS = join(DEMO, 'wrackrun-narrows.yaml'); // Europe/Lisbon: +00:00 in winter
const GUT = join(DEMO, 'spindrift-gut.yaml'); // its stream-secondary station
const BAD = join(ROOT, 'tests', 'fixtures', 'streams');

const isoSecond = (t: number): string => new Date(Math.round(t / 1000) * 1000).toISOString().replace('.000Z', 'Z');

describe('predict on a stream station', () => {
  it('--format json lists slack, flood and ebb with speed in knots and direction in degrees true', async () => {
    const { code, stdout, stderr } = await runCli(['predict', NARROWS, '--from', '2027-01-01', '--to', '2027-01-03', '--format', 'json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const set = loadStationSet(DEMO);
    const station = set.streams!.find((s) => s.id === 'wrackrun-narrows')!;
    const expected = streamEventsFor(station, set, Date.parse('2027-01-01T00:00:00Z'), Date.parse('2027-01-03T00:00:00Z'));
    const printed = JSON.parse(stdout) as { station_id: string; time: string; time_local: string; type: string; speed_kn: number; direction_deg_true: number | null }[];
    expect(printed.length).toBe(expected.length);
    expect(printed.length).toBeGreaterThan(12);
    printed.forEach((p, i) => {
      const e = itemAt(expected, i, 'expected');
      expect(Object.keys(p)).toEqual(['station_id', 'time', 'time_local', 'type', 'speed_kn', 'direction_deg_true']);
      expect(p.station_id).toBe('wrackrun-narrows');
      expect(p.time).toBe(isoSecond(e.time));
      expect(Date.parse(p.time_local)).toBe(Date.parse(p.time));
      expect(p.type).toBe(e.type);
      expect(p.speed_kn).toBe(Math.round(e.speed * 100) / 100);
      if (e.direction === null) expect(p.direction_deg_true).toBeNull();
      else expect(p.direction_deg_true).toBeCloseTo(e.direction, 1);
    });
    expect(new Set(printed.map((p) => p.type))).toEqual(new Set(['slack', 'flood', 'ebb']));
    for (const p of printed.filter((x) => x.type === 'flood')) expect(Math.abs(p.direction_deg_true! - 70)).toBeLessThan(10);
  });

  it('--every gives time, speed, direction, east and north', async () => {
    const { code, stdout } = await runCli(['predict', NARROWS, '--from', '2027-01-01T00:00Z', '--to', '2027-01-01T02:00Z', '--every', '10', '--format', 'json']);
    expect(code).toBe(0);
    const rows = JSON.parse(stdout) as Record<string, number | string | null>[];
    expect(rows).toHaveLength(12);
    const set = loadStationSet(DEMO);
    const { east, north } = streamVelocities(set.streams!.find((s) => s.id === 'wrackrun-narrows')!, set, Date.parse('2027-01-01T00:00:00Z'), 600_000, 12);
    rows.forEach((r, i) => {
      expect(Object.keys(r)).toEqual(['station_id', 'time', 'time_local', 'speed_kn', 'direction_deg_true', 'east_kn', 'north_kn']);
      expect(r.east_kn).toBe(Math.round(itemAt(east, i, 'east') * 100) / 100 + 0);
      expect(r.north_kn).toBe(Math.round(itemAt(north, i, 'north') * 100) / 100 + 0);
      expect(r.speed_kn).toBe(Math.round(Math.hypot(itemAt(east, i, 'east'), itemAt(north, i, 'north')) * 100) / 100);
    });
  });

  it('a stream-secondary station finds its reference stream station in its own folder', async () => {
    const { code, stdout } = await runCli(['predict', GUT, '--from', '2027-01-01', '--to', '2027-01-02', '--format', 'csv']);
    expect(code).toBe(0);
    const lines = stdout.trim().split('\r\n');
    expect(lines[0]).toBe('station_id,time,time_local,type,speed_kn,direction_deg_true');
    expect(lines.length).toBeGreaterThan(6);
    for (const line of lines.slice(1)) {
      const [, , , type, , direction] = line.split(',');
      if (type === 'flood') expect(direction).toBe('95.0');
      if (type === 'ebb') expect(direction).toBe('280.0');
      if (type === 'slack') expect(direction).toBe('');
    }
  });

  it('the table carries both cautions', async () => {
    const { code, stdout } = await runCli(['predict', NARROWS, '--from', '2027-01-01', '--to', '2027-01-02']);
    expect(code).toBe(0);
    expect(stdout).toContain('Caution: Astronomical predictions only.');
    expect(stdout).toContain('Tidal streams vary across a channel');
    expect(stdout).toMatch(/\d\d:\d\d {2}\+00:00 {2}(slack|flood|ebb) /);
  });
});

describe('stream station files', () => {
  it('a bad file is one line naming file, field and fix, exit 1', async () => {
    const { code, stdout, stderr } = await runCli(['predict', join(BAD, 'bad-unit.yaml'), '--from', '2027-01-01']);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(stderr).toContain('bad-unit.yaml: unit:');
    expect(stderr).toContain('write unit: kn (knots) or unit: m/s');
  });

  it('check lists schema problems and implausible streams, each on its own line', async () => {
    const { code, stdout } = await runCli(['check', '--stations', BAD]);
    expect(code).toBe(1);
    const lines = stdout.trim().split('\n');
    const has = (file: string, field: string, words: string) =>
      expect(lines.some((l) => l.startsWith(join(BAD, file) + `: ${field}: `) && l.includes(words)), `${file} ${field}`).toBe(true);
    has('bad-unit.yaml', 'unit', 'write unit: kn');
    has('implausible.yaml', 'constituents.M2.major', 'faster than any tidal stream');
    has('implausible.yaml', 'constituents.S2.minor', 'longer than the major axis');
    has('no-m2.yaml', 'constituents.M2', 'is missing from a stream station');
    has('misspelt.yaml', 'constituents.M2.minr', 'did you mean minor?');
    has('misspelt.yaml', 'flood_direction', 'is missing');
    has('secondary-of-tide.yaml', 'reference', 'is a tide station, not a stream station');
    has('zero-rate.yaml', 'differences.flood.rate', 'write the ratio');
  });
});

describe('almanac on a stream station', () => {
  it('--format json prints the StreamYear model; the table sums up each month with both cautions', async () => {
    const json = await runCli(['almanac', GUT, '--year', '2027', '--format', 'json']);
    expect(json.code).toBe(0);
    const model = JSON.parse(json.stdout) as { kind: string; reference: { id: string }; days: unknown[]; events: { type: string }[] };
    expect(model.kind).toBe('stream');
    expect(model.reference.id).toBe('wrackrun-narrows');
    expect(model.days).toHaveLength(365);
    expect(new Set(model.events.map((e) => e.type))).toEqual(new Set(['slack', 'flood', 'ebb']));
    const table = await runCli(['almanac', NARROWS, '--year', '2027']);
    expect(table.code).toBe(0);
    expect(table.stdout).toContain('Wrackrun Narrows (invented)');
    expect(table.stdout).toMatch(/^January +\d+ +\d\.\d kn 0\d\d°/m);
    expect(table.stdout).toContain('Streams: Tidal streams vary across a channel');
  }, 60_000);
});
