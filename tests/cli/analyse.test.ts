// `tidewright analyse` and `tidewright differences` through the command line: files in, station files
// and reports out, and one-line errors (exit code 1) for every kind of bad input. The numbers are the
// analysis' own (tested in tests/engine/analysis-*.test.ts); here only the command's handling is checked.

import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';
import { compilePredictor, entryOf, loadStationFile, tideHeights } from '../../engine/index.js';
import type { ReferenceStation, SecondaryStation, Station } from '../../engine/index.js';
import { DAY, degrade, evenTimes, recordCsv, recordOf } from '../fixtures/analysis-records.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-analyse-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
afterEach(() => vi.restoreAllMocks());

const FIXTURES = join(import.meta.dirname, '..', 'fixtures', 'records');
const START = Date.UTC(2027, 2, 1);
const STEP = 10 * 60_000;

// Invented ports, realistic in magnitude; the lines a month cannot separate (K2, P1, NU2, 2N2, L2, T2)
// stand to their neighbours as in the equilibrium tide, as at most real ports.
const reference: ReferenceStation = {
  id: 'gull-point', name: 'Gull Point (invented)', kind: 'reference', position: { latitude: 47, longitude: -16 },
  timezone: 'Europe/London', datum: 'Chart Datum', mean_level: 3,
  constituents: {
    M2: { amplitude: 1.6, phase: 130 }, S2: { amplitude: 0.55, phase: 175 }, N2: { amplitude: 0.3, phase: 110 },
    K1: { amplitude: 0.08, phase: 100 }, O1: { amplitude: 0.07, phase: 330 }, M4: { amplitude: 0.05, phase: 40 },
    K2: { amplitude: 0.15, phase: 175 }, T2: { amplitude: 0.032, phase: 175 }, L2: { amplitude: 0.045, phase: 130 },
    NU2: { amplitude: 0.057, phase: 110 }, '2N2': { amplitude: 0.04, phase: 110 }, P1: { amplitude: 0.026, phase: 100 },
  },
  provenance: 'Invented for the command-line test',
};
const REFERENCE_YAML = `id: gull-point
name: Gull Point (invented)
kind: reference
position: { latitude: 47, longitude: -16 }
timezone: Europe/London
datum: Chart Datum
mean_level: 3
constituents:
  M2: { amplitude: 1.6, phase: 130 }
  S2: { amplitude: 0.55, phase: 175 }
  N2: { amplitude: 0.3, phase: 110 }
  K1: { amplitude: 0.08, phase: 100 }
  O1: { amplitude: 0.07, phase: 330 }
  M4: { amplitude: 0.05, phase: 40 }
  K2: { amplitude: 0.15, phase: 175 }
  T2: { amplitude: 0.032, phase: 175 }
  L2: { amplitude: 0.045, phase: 130 }
  NU2: { amplitude: 0.057, phase: 110 }
  2N2: { amplitude: 0.04, phase: 110 }
  P1: { amplitude: 0.026, phase: 100 }
provenance: Invented for the command-line test
`;
const secondary: SecondaryStation = {
  id: 'pipit-creek', name: 'Pipit Creek (invented)', kind: 'secondary', reference: 'gull-point',
  position: { latitude: 47.1, longitude: -16.1 }, timezone: 'Europe/London', datum: 'Chart Datum',
  differences: {
    high_water: { springs: { time: 25, height: -0.3 }, neaps: { time: 15, height: -0.2 } },
    low_water: { springs: { time: 40, height: -0.1 }, neaps: { time: 30, height: -0.05 } },
  },
  provenance: 'Invented',
};

const count = (30 * DAY) / STEP + 1;
const gaugeCsv = join(dir, 'gull-gauge.csv');
writeFileSync(gaugeCsv, recordCsv(degrade(
  recordOf(evenTimes(START, STEP, count), compilePredictor(reference).heights(START, STEP, count)),
  { sigma: 0.02, seed: 1, dropShare: 0.05 })));
const referenceFile = join(dir, 'gull-point.yaml');
writeFileSync(referenceFile, REFERENCE_YAML);
const set = { byId: new Map<string, Station>([[reference.id, reference], [secondary.id, secondary]]) };
const creekCsv = join(dir, 'pipit-creek.csv');
writeFileSync(creekCsv, recordCsv(degrade(
  recordOf(evenTimes(START, STEP, count), tideHeights(secondary, set, START, STEP, count)), { sigma: 0.01, seed: 2 })));

describe('tidewright analyse', () => {
  it('prints a station file the loader accepts, with the constants of the record', async () => {
    const { code, stdout, stderr } = await runCli(['analyse', gaugeCsv, '--latitude', '47', '--longitude', '-16', '--timezone', 'Europe/London']);
    expect(code).toBe(0);
    expect(stderr).toMatch(/^tidewright: \d+ readings over 30\.0 days: \d+ constituents, residual RMS 0\.0\d\d m/);
    expect(stdout).toMatch(/^# Harmonic constants of gull-gauge/);
    expect(stdout).toMatch(/\nobservations: \{ from: 2027-03-01, to: 2027-03-(30|31), source: "Gauge record gull-gauge\.csv" \}\n$/);
    expect(stdout).toContain('\nid: gull-gauge\n');
    expect(stdout).toContain('\nposition: { latitude: 47, longitude: -16 }\n');
    expect(stdout).toMatch(/\n {2}M2: +\{ amplitude: 1\.60\d\d, phase: 1[23]\d\.\d\d \}/);
    expect(stdout.replace(/\n# /g, ' ')).toContain('Inferred, not fitted (the record cannot separate them): each takes its ' +
      'separated neighbour\'s phase lag and the amplitude ratio of the equilibrium tide (Foreman 1977; Pugh 1987): K2 from S2 (ratio 0.2721)');
    expect(stdout).toMatch(/\n {2}K2: +\{ amplitude: 0\.1\d{3}, phase: 1\d\d\.\d\d \}  # inferred from S2\n/);
    expect(stderr).toMatch(/; inferred from a neighbour by the equilibrium ratio: [^;]*\bK2\b/);
    expect(stdout.replace(/\n# /g, ' ')).toMatch(/ Not separable with a record of 30\.0 days, so left out: .*MU2 \(from N2: needs 31\.8 days\)/);
  });

  it('writes --output and an HTML --report, with id, name and datum as given', async () => {
    const output = join(dir, 'out', 'gull.yaml');
    const report = join(dir, 'out', 'gull.html');
    const { code, stdout } = await runCli(['analyse', gaugeCsv, '--latitude=47.0', '--longitude', '-16.0', '--timezone', 'Europe/London',
      '--id', 'gull-gauge-2027', '--name', 'Gull Point gauge', '--datum', 'Chart Datum', '--rayleigh', '1.5', '--output', output, '--report', report]);
    expect(code).toBe(0);
    expect(stdout).toBe('');
    const station = loadStationFile(output);
    expect(station).toMatchObject({ id: 'gull-gauge-2027', name: 'Gull Point gauge', datum: 'Chart Datum', kind: 'reference' });
    if (station.kind !== 'reference') throw new Error('expected a reference port');
    // R = 1.5: 30 days < 1.5 × 27.55 days, so N2 is left out (and its energy leaks into M2 nearby)
    expect(station.constituents['N2']).toBeUndefined();
    expect(readFileSync(output, 'utf8')).toContain('N2 (from M2: needs 41.3 days)');
    expect(entryOf(station.constituents, 'S2', 'constituents').amplitude).toBeCloseTo(0.58, 1);
    expect(station.provenance).toMatch(/^Derived by tidewright from the gauge record gull-gauge\.csv .* \(R = 1\.5\)$/);
    const html = readFileSync(report, 'utf8');
    expect(html).toContain('<h1>Harmonic analysis: Gull Point gauge</h1>');
    expect(html).not.toMatch(/<script/i);
  });

  it.each([
    [['--longitude', '-16', '--timezone', 'Europe/London'], /^tidewright: --latitude: is missing .*; add --latitude 47\.6\n$/],
    [['--latitude', '95', '--longitude', '-16', '--timezone', 'Europe/London'], /^tidewright: --latitude: "95" is not a number from -90 to 90; /],
    [['--latitude', '47', '--longitude', '-16', '--timezone', 'Europe/Londn'], /^tidewright: --timezone: "Europe\/Londn" is not a known IANA time zone; /],
    [['--latitude', '47', '--longitude', '-16', '--timezone', 'UTC', '--id', 'Gull Point'], /^tidewright: --id: "Gull Point" may only hold .*; write --id gull-point\n$/],
    [['--latitude', '47', '--longitude', '-16', '--timezone', 'UTC', '--rayleigh', 'lots'], /^tidewright: --rayleigh: "lots" is not a number/],
    [['--latitude', '47', '--longitude', '-16', '--timezone', 'UTC', '--rayleigh', '0.2'], /^tidewright: --rayleigh: "0\.2" is not a number from 0\.5 to 10; /],
    [['--latitude', '47', '--longitude', '-16', '--timezone', 'UTC', '--colour', 'red'], /^tidewright: --colour: is not an option of tidewright analyse/],
  ])('refuses bad options in one line, exit code 1: %j', async (options, message) => {
    const output = join(dir, 'never.yaml');
    const { code, stdout, stderr } = await runCli(['analyse', gaugeCsv, ...options, '--output', output]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toMatch(message);
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(output)).toBe(false);
  });

  it.each([
    ['bad-time.csv', /^tidewright: .*bad-time\.csv: line 4, time: "2027-01-32T02:00:00Z" is not an ISO 8601 time; /],
    ['bad-height.csv', /^tidewright: .*bad-height\.csv: line 3: the row has 3 fields/],
    ['no-offset.csv', /^tidewright: .*no-offset\.csv: line 2, time: "2027-01-01T00:00:00" has no UTC offset; add Z/],
    ['empty.csv', /^tidewright: .*empty\.csv: rows: the record holds no time,height rows; /],
    ['conflicting-duplicates.csv', /^tidewright: .*conflicting-duplicates\.csv: lines 3 and 5, height: two different heights/],
    ['missing-marker.csv', /^tidewright: .*missing-marker\.csv: line 3, height: -999 m is not a plausible tide height/],
    ['messy.csv', /^tidewright: .*messy\.csv: time: the record spans 0\.15 days .*; supply at least 14\.77 days/],
    ['no-such-file.csv', /^tidewright: .*no-such-file\.csv: file: no such file; give the path of a CSV file/],
  ])('refuses the bad record %s in one line naming file, field and fix', async (name, message) => {
    const report = join(dir, 'never.html');
    const { code, stdout, stderr } = await runCli(['analyse', join(FIXTURES, name), '--latitude', '47', '--longitude', '-16',
      '--timezone', 'UTC', '--report', report]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toMatch(message);
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(report)).toBe(false);
  });

  it('explains itself with --help and through tidewright help analyse', async () => {
    const direct = await runCli(['analyse', '--help']);
    expect(direct.code).toBe(0);
    expect(direct.stdout).toMatch(/^Usage: tidewright analyse RECORD\.csv --latitude DEG/);
    expect((await runCli(['help', 'analyse'])).stdout).toBe(direct.stdout);
  });
});

describe('tidewright differences', () => {
  it('prints the secondary station file with the differences of the record', async () => {
    const { code, stdout, stderr } = await runCli(['differences', creekCsv, '--reference', referenceFile,
      '--latitude', '47.1', '--longitude', '-16.1', '--name', 'Pipit Creek (invented)']);
    expect(code).toBe(0);
    expect(stderr).toMatch(/^tidewright: \d+ high and \d+ low waters matched to gull-point; RMS of the fit: high water \d\.\d min/);
    const file = join(dir, 'pipit-creek.yaml');
    writeFileSync(file, stdout);
    const station = loadStationFile(file);
    if (station.kind !== 'secondary') throw new Error('expected a secondary port');
    expect(station).toMatchObject({ id: 'pipit-creek', reference: 'gull-point', position: { latitude: 47.1, longitude: -16.1 }, timezone: 'Europe/London' });
    const d = station.differences;
    expect(Math.abs(d.high_water.springs.time - 25)).toBeLessThanOrEqual(2);
    expect(Math.abs(d.low_water.neaps.time - 30)).toBeLessThanOrEqual(2);
    expect(d.high_water.springs.height).toBeCloseTo(-0.3, 1);
    expect(stdout).toMatch(/^# Fit quality \(RMS of residuals\): high water/m);
  });

  it('takes position and time zone from the reference port when not given, and says so', async () => {
    const { code, stdout } = await runCli(['differences', creekCsv, '--reference', referenceFile]);
    expect(code).toBe(0);
    expect(stdout).toContain('position: { latitude: 47, longitude: -16 }');
    expect(stdout).toMatch(/# The position is the reference port's \(47, -16\); replace it with this port's own\./);
    expect(stdout).toMatch(/# The record's heights are taken to be above this port's Chart Datum;/);
  });

  it('refuses a missing --reference, a secondary port as reference, and a bad record', async () => {
    const missing = await runCli(['differences', creekCsv]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/^tidewright: --reference: is missing; /);
    const secondaryFile = join(dir, 'creek-as-reference.yaml');
    writeFileSync(secondaryFile, `id: pipit-creek
name: Pipit Creek (invented)
kind: secondary
reference: gull-point
position: { latitude: 47.1, longitude: -16.1 }
timezone: Europe/London
datum: Chart Datum
differences:
  high_water: { springs: { time: 25, height: -0.3 }, neaps: { time: 15, height: -0.2 } }
  low_water: { springs: { time: 40, height: -0.1 }, neaps: { time: 30, height: -0.05 } }
provenance: Invented
`);
    const chained = await runCli(['differences', creekCsv, '--reference', secondaryFile]);
    expect(chained.code).toBe(1);
    expect(chained.stderr).toMatch(/^tidewright: --reference: .*creek-as-reference\.yaml is a secondary port \(kind: secondary\); give the station file of its reference port \(gull-point\)/);
    const bad = await runCli(['differences', join(FIXTURES, 'bad-time.csv'), '--reference', referenceFile]);
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/bad-time\.csv: line 4, time: /);
  });
});
