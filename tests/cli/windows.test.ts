// `tidewright windows` and `tidewright height`, the `windows:` key of station files and its `check`
// line. The crossing times are checked against the closed form of a solar tide worked out in
// tests/engine/windows.test.ts (S2 + S4: 2.6 m is crossed at 23:20 and 03:20 UTC, every 12 hours).

import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { firstOf, parseStation, StationFileError } from '../../engine/index.js';
import { runCli } from '../fixtures/run-cli.js';

afterEach(() => vi.restoreAllMocks());

const DIR = mkdtempSync(join(tmpdir(), 'tidewright-windows-'));
afterAll(() => rmSync(DIR, { recursive: true, force: true }));

const SOLAR = `id: solar-invented
name: Solar Point (invented)
kind: reference
position: { latitude: 47.0, longitude: -17.0 }
timezone: Europe/Lisbon
datum: Chart Datum
mean_level: 2.0
constituents:
  S2: { amplitude: 1.5, phase: 40 }
  S4: { amplitude: 0.3, phase: 80 }
provenance: Invented for the window tests
`;

const HARBOUR = `id: harbour-invented
name: Harbour (invented)
kind: reference
position: { latitude: 47.0, longitude: -17.0 }
timezone: Europe/Lisbon
datum: Chart Datum
mean_level: 2.6
constituents:
  M2: { amplitude: 1.8, phase: 120 }
  S2: { amplitude: 0.6, phase: 160 }
  K1: { amplitude: 0.1, phase: 80 }
provenance: Invented for the window tests
windows:
  - { id: sill, name: "Marina sill", above: 2.4 }
  - { id: bridge, name: "Road bridge", below: 3.1 }
`;

const COVE = `id: cove-invented
name: Cove (invented)
kind: secondary
reference: harbour-invented
position: { latitude: 47.1, longitude: -17.1 }
timezone: Europe/Lisbon
datum: Chart Datum
differences:
  high_water: { springs: { time: 20, height: -0.3 }, neaps: { time: 10, height: -0.2 } }
  low_water: { springs: { time: 35, height: -0.1 }, neaps: { time: 25, height: 0.0 } }
provenance: Invented for the window tests
`;

for (const [name, text] of [['solar.yaml', SOLAR], ['harbour.yaml', HARBOUR], ['cove.yaml', COVE]]) {
  writeFileSync(join(DIR, name!), text!);
}

interface Interval { station_id: string; start: string; start_local: string; end: string; end_local: string; duration_min: number }

describe('tidewright windows', () => {
  it('JSON: the closed-form crossings, clipped to the span, with local times', async () => {
    const { code, stdout, stderr } = await runCli(['windows', join(DIR, 'solar.yaml'), '--above', '2.6',
      '--from', '2027-01-01', '--to', '2027-01-02', '--format', 'json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const rows = JSON.parse(stdout) as Interval[];
    expect(rows).toEqual([
      { station_id: 'solar-invented', start: '2027-01-01T00:00:00Z', start_local: '2027-01-01T00:00:00+00:00', end: '2027-01-01T03:20:00Z', end_local: '2027-01-01T03:20:00+00:00', duration_min: 200 },
      { station_id: 'solar-invented', start: '2027-01-01T11:20:00Z', start_local: '2027-01-01T11:20:00+00:00', end: '2027-01-01T15:20:00Z', end_local: '2027-01-01T15:20:00+00:00', duration_min: 240 },
      { station_id: 'solar-invented', start: '2027-01-01T23:20:00Z', start_local: '2027-01-01T23:20:00+00:00', end: '2027-01-02T00:00:00Z', end_local: '2027-01-02T00:00:00+00:00', duration_min: 40 },
    ]);
    // exactly the promised keys, one interval per line
    expect(stdout.split('\n')[1]).toMatch(/^\{"station_id":"[^"]+","start":"[^"]+Z","start_local":"[^"]+","end":"[^"]+Z","end_local":"[^"]+","duration_min":\d+\},$/);
  });

  it('--below is the complement of --above within the span; summer dates carry +01:00', async () => {
    const args = ['--from', '2027-07-01', '--to', '2027-07-03', '--format', 'json'];
    const above = JSON.parse((await runCli(['windows', join(DIR, 'solar.yaml'), '--above', '2.6', ...args])).stdout) as Interval[];
    const below = JSON.parse((await runCli(['windows', join(DIR, 'solar.yaml'), '--below', '2.6', ...args])).stdout) as Interval[];
    const edges = [...above, ...below].flatMap((w) => [w.start, w.end]).sort();
    // each crossing is the end of one interval and the start of the other
    const inner = edges.slice(1, -1);
    for (let i = 0; i < inner.length; i += 2) expect(inner[i]).toBe(inner[i + 1]);
    expect(firstOf(above, 'above').start_local.endsWith('+01:00')).toBe(true);
  });

  it('CSV and table', async () => {
    const csv = await runCli(['windows', join(DIR, 'cove.yaml'), '--below', '2.0', '--from', '2027-03-27', '--to', '2027-03-30', '--format', 'csv']);
    expect(csv.code).toBe(0);
    const lines = csv.stdout.trim().split('\r\n');
    expect(lines[0]).toBe('station_id,start,start_local,end,end_local,duration_min');
    expect(lines.length).toBeGreaterThan(3);
    expect(lines[1]).toMatch(/^cove-invented,\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ,[^,]+,[^,]+Z,[^,]+,\d+$/);
    const table = await runCli(['windows', join(DIR, 'cove.yaml'), '--below', '2.0', '--from', '2027-03-27', '--to', '2027-03-30']);
    expect(table.stdout).toContain('Window: open while the tide is at or below 2.00 m above Chart Datum');
    expect(table.stdout).toContain('Secondary port: ');
    expect(table.stdout).toContain('Caution: ');
    const never = await runCli(['windows', join(DIR, 'solar.yaml'), '--above', '9', '--from', '2027-03-27', '--to', '2027-03-30']);
    expect(never.stdout).toContain('(never at or above 9.00 m in this span)');
  });

  it('refuses a missing or doubled level and a bad number in one line', async () => {
    for (const [args, start] of [
      [[], 'tidewright: --above: is missing'],
      [['--above', '1', '--below', '2'], 'tidewright: --below: cannot go with --above'],
      [['--above', 'high'], 'tidewright: --above: "high" is not a height in metres'],
    ] as const) {
      const { code, stderr, stdout } = await runCli(['windows', join(DIR, 'solar.yaml'), ...args]);
      expect(code).toBe(1);
      expect(stdout).toBe('');
      expect(stderr.startsWith(start)).toBe(true);
      expect(stderr.trim().split('\n')).toHaveLength(1);
    }
  });
});

describe('tidewright height', () => {
  it('a local instant without zone is the station\'s; Z is taken as given; rising then falling', async () => {
    // 2027-07-01: Lisbon is on +01:00. 00:20 local = 23:20 UTC the day before: the solar tide rises through
    // 2.6 m there (worked example), so it reads 2.6 m and rising; at 03:20 UTC it falls through 2.6 m.
    const local = await runCli(['height', join(DIR, 'solar.yaml'), '--at', '2027-07-01T00:20', '--format', 'json']);
    expect(local.stderr).toBe('');
    expect(JSON.parse(local.stdout)).toEqual({ station_id: 'solar-invented', time: '2027-06-30T23:20:00Z', time_local: '2027-07-01T00:20:00+01:00', height_m: 2.6, trend: 'rising' });
    const utc = await runCli(['height', join(DIR, 'solar.yaml'), '--at', '2027-07-01T03:20Z', '--format', 'json']);
    expect(JSON.parse(utc.stdout)).toEqual({ station_id: 'solar-invented', time: '2027-07-01T03:20:00Z', time_local: '2027-07-01T04:20:00+01:00', height_m: 2.6, trend: 'falling' });
    expect(utc.stdout).toMatch(/^\{"station_id":"[^"]+","time":"[^"]+Z","time_local":"[^"]+","height_m":[\d.]+,"trend":"(rising|falling)"\}\n$/);
  });

  it('table, and a secondary port from its curve', async () => {
    const table = await runCli(['height', join(DIR, 'cove.yaml'), '--at', '2027-03-28T15:20']);
    expect(table.code).toBe(0);
    expect(table.stdout).toMatch(/2027-03-28 Sun 15:20:00 \+01:00 {2}-?\d+\.\d\d m above Chart Datum, (rising|falling)/);
    expect(table.stdout).toContain('Secondary port: ');
    const missing = await runCli(['height', join(DIR, 'solar.yaml')]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/^tidewright: --at: is missing; /);
  });
});

describe('the windows: key of a station file', () => {
  const base = HARBOUR.replace(/windows:[\s\S]*$/, '');
  const problem = (windows: string): string => {
    try {
      parseStation(`${base}windows:\n${windows}`, 'harbour.yaml');
    } catch (error) {
      expect(error).toBeInstanceOf(StationFileError);
      return (error as Error).message;
    }
    throw new Error('accepted');
  };

  it('loads id, name and one level', () => {
    const station = parseStation(HARBOUR, 'harbour.yaml');
    expect(station.windows).toEqual([
      { id: 'sill', name: 'Marina sill', above: 2.4 },
      { id: 'bridge', name: 'Road bridge', below: 3.1 },
    ]);
    expect('windows' in parseStation(base, 'harbour.yaml')).toBe(false);
  });

  it('one line for each mistake, naming the field and the fix', () => {
    expect(problem('  - { id: sill, name: Sill }')).toBe(
      'harbour.yaml: windows.0.above: gives neither above: nor below:; write exactly one: above: 2.40 (open while the tide is at or above 2.40 m) or below: 3.10 (open while at or below)');
    expect(problem('  - { id: sill, name: Sill, above: 1, below: 2 }')).toMatch(/^harbour\.yaml: windows\.0\.below: gives both above: and below:; /);
    expect(problem('  - { id: sill, name: Sill, above: 1 }\n  - { id: sill, name: Other, above: 2 }')).toBe(
      'harbour.yaml: windows.1.id: "sill" is already the id of another window of this station; give each window its own id');
    expect(problem('  - { id: Marina Sill, name: Sill, above: 1 }')).toBe(
      'harbour.yaml: windows.0.id: "Marina Sill" may only hold lower-case letters a-z, digits and hyphens; write id: marina-sill');
    expect(problem('  - { id: sill, name: Sill, abov: 1 }')).toMatch(/^harbour\.yaml: windows\.0\.abov: is not a key tidewright knows here; did you mean above\?/);
    expect(problem('  - { id: sill, name: Sill, above: high }')).toMatch(/^harbour\.yaml: windows\.0\.above: should be a number but is the text "high"; /);
  });

  it('check: a level outside LAT..HAT is a one-line warning; the set stays usable (exit 0)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tidewright-windows-check-'));
    try {
      writeFileSync(join(dir, 'harbour.yaml'), `${base}windows:\n  - { id: sill, name: Sill, above: 9.5 }\n  - { id: ok, name: Fine, above: 3 }\n`);
      const { code, stdout } = await runCli(['check', '--stations', dir]);
      expect(code).toBe(0);
      const lines = stdout.trim().split('\n');
      expect(lines).toHaveLength(2);
      expect(lines[0]).toMatch(/^warning: .*harbour\.yaml: windows\.0\.above: 9\.5 m is outside the predicted range LAT -?\d+\.\d\d m to HAT \d+\.\d\d m \(2020–2038\), so "Sill" never opens; write a level between/);
      expect(lines[1]).toMatch(/OK \(1 warning\)$/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
