// `tidewright predict`: the formats, rounding and time-zone behaviour of the command. The numbers are
// the engine's own (findExtrema, tideEvents, tideHeights), so only the command's handling is tested.

import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { DateTime } from 'luxon';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';
import {
  findExtrema, compilePredictor, loadStationFile, loadStationSet, tideEvents, tideHeights,
} from '../../engine/index.js';
import type { ReferenceStation } from '../../engine/index.js';

const ROOT = join(import.meta.dirname, '..', '..');
const GOOD = join(ROOT, 'tests', 'fixtures', 'stations-good');
const DEMO = join(ROOT, 'stations-demo');
const BRINEWOLD = join(GOOD, 'brinewold-head.yaml'); // Europe/Lisbon: +00:00 in winter, +01:00 in summer
const SALTGRIST = join(GOOD, 'saltgrist-cove.yaml'); // its secondary port
const RIMESKERRY = join(DEMO, 'rimeskerry-fjord.yaml'); // Europe/Oslo: +01:00 in winter

afterEach(() => vi.restoreAllMocks());

const ms = (iso: string): number => Date.parse(iso);
const isoSecond = (t: number): string => new Date(Math.round(t / 1000) * 1000).toISOString().replace('.000Z', 'Z');
const localSecond = (t: number, zone: string): string =>
  DateTime.fromMillis(Math.round(t / 1000) * 1000, { zone }).toISO({ suppressMilliseconds: true })!;
const mm = (h: number): number => Math.round(h * 1000) / 1000 + 0;
/** An event as the exports' vocabulary spells it (README, "Fields of the exports"). */
const eventRecord = (id: string, zone: string) => (e: { time: number; type: string; height: number }) => ({
  station_id: id, time: isoSecond(e.time), time_local: localSecond(e.time, zone),
  date_local: DateTime.fromMillis(Math.round(e.time / 60_000) * 60_000, { zone }).toISODate(), type: e.type, height_m: mm(e.height), below_chart_datum: mm(e.height) < 0,
});

describe('predict --format json', () => {
  it('prints the high and low waters of findExtrema in the exports\' vocabulary: station id, UTC and local to the second, metres to the mm, keys in order', async () => {
    const { code, stdout, stderr } = await runCli(['predict', BRINEWOLD, '--from', '2027-01-01', '--to', '2027-01-08', '--format', 'json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const station = loadStationFile(BRINEWOLD) as ReferenceStation;
    // Lisbon is on +00:00 in January: the dates are UTC midnights.
    const expected = findExtrema(compilePredictor(station), ms('2027-01-01T00:00:00Z'), ms('2027-01-08T00:00:00Z'));
    expect(expected.length).toBeGreaterThan(20);
    const printed = JSON.parse(stdout) as unknown[];
    expect(printed).toEqual(expected.map(eventRecord('brinewold-head', 'Europe/Lisbon')));
    // Exactly the promised shape, e.g. {"station_id":"brinewold-head","time":"2027-01-01T03:12:41Z",
    // "time_local":"2027-01-01T03:12:41+00:00","date_local":"2027-01-01","type":"high","height_m":4.213,"below_chart_datum":false}.
    for (const line of stdout.trim().split('\n').slice(1, -1)) {
      expect(line).toMatch(/^\{"station_id":"brinewold-head","time":"\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ","time_local":"\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\+00:00","date_local":"\d{4}-\d\d-\d\d","type":"(high|low)","height_m":-?\d+(\.\d{1,3})?,"below_chart_datum":(true|false)\},?$/);
    }
  });

  it('reads a date in a +01:00 zone as 23:00Z the day before', async () => {
    const { stdout } = await runCli(['predict', RIMESKERRY, '--from', '2027-01-01', '--to', '2027-01-01T02:00Z', '--every', '60', '--format', 'json']);
    const rows = JSON.parse(stdout) as { station_id: string; time: string; time_local: string; height_m: number }[];
    expect(rows.map((r) => r.time)).toEqual(['2026-12-31T23:00:00Z', '2027-01-01T00:00:00Z', '2027-01-01T01:00:00Z']);
    expect(rows.map((r) => r.time_local)).toEqual(['2027-01-01T00:00:00+01:00', '2027-01-01T01:00:00+01:00', '2027-01-01T02:00:00+01:00']);
    expect(rows.every((r) => r.station_id === 'rimeskerry-fjord')).toBe(true);
    const set = loadStationSet(DEMO);
    const rimeskerry = set.byId.get('rimeskerry-fjord')!;
    const heights = tideHeights(rimeskerry, set, ms('2026-12-31T23:00:00Z'), 3_600_000, 3);
    expect(rows.map((r) => r.height_m)).toEqual([...heights].map(mm));
  });

  it('accepts ISO instants with an offset, and a local time without one', async () => {
    const a = await runCli(['predict', RIMESKERRY, '--from', '2027-06-01T12:00+02:00', '--to', '2027-06-01T12:30+02:00', '--every', '10', '--format', 'json']);
    const b = await runCli(['predict', RIMESKERRY, '--from', '2027-06-01T12:00', '--to', '2027-06-01T10:30Z', '--every', '10', '--format', 'json']);
    const times = (JSON.parse(a.stdout) as { time: string }[]).map((r) => r.time);
    expect(times).toEqual(['2027-06-01T10:00:00Z', '2027-06-01T10:10:00Z', '2027-06-01T10:20:00Z']);
    expect(b.stdout).toBe(a.stdout);
  });

  it('heights with --every: the end is not included, steps may be fractions of a minute', async () => {
    const { stdout } = await runCli(['predict', BRINEWOLD, '--from', '2027-01-01T00:00Z', '--to', '2027-01-01T00:02Z', '--every', '0.5', '--format', 'json']);
    expect((JSON.parse(stdout) as { time: string }[]).map((r) => r.time.slice(11))).toEqual(['00:00:00Z', '00:00:30Z', '00:01:00Z', '00:01:30Z']);
  });

  it('works for a secondary port, taking its reference port from the file\'s folder', async () => {
    const { code, stdout } = await runCli(['predict', SALTGRIST, '--from', '2027-01-01', '--to', '2027-01-04', '--format', 'json']);
    expect(code).toBe(0);
    const set = loadStationSet(GOOD);
    const events = tideEvents(set.byId.get('saltgrist-cove')!, set, ms('2027-01-01T00:00Z'), ms('2027-01-04T00:00Z'));
    expect(events.length).toBeGreaterThan(8);
    expect(JSON.parse(stdout)).toEqual(events.map(eventRecord('saltgrist-cove', 'Europe/Lisbon')));
  });

  it('finds a secondary port\'s reference port in --stations DIR', async () => {
    const { code, stdout, stderr } = await runCli(['predict', join(DEMO, 'whitespume-sound.yaml'), '--stations', DEMO, '--from', '2027-01-01', '--to', '2027-01-02', '--format', 'json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    expect((JSON.parse(stdout) as unknown[]).length).toBeGreaterThanOrEqual(3);
  });
});

describe('predict --format table and csv', () => {
  it('table: a header naming station, datum and zone, the caution, local times with their offsets, heights to cm', async () => {
    const { code, stdout } = await runCli(['predict', BRINEWOLD, '--from', '2027-03-27', '--to', '2027-03-30']);
    expect(code).toBe(0);
    const [title, where, what, units, provenance, caution] = stdout.split('\n');
    expect(title).toBe('Brinewold Head (invented): reference port (id brinewold-head)');
    // degrees and minutes to the tenth, as on the site and in the books: 47.6° = 47°36.0′, 15.8° = 15°48.0′
    expect(where).toBe('47°36.0′\u00a0N, 15°48.0′\u00a0W; time zone Europe/Lisbon');
    expect(what).toContain('High and low waters, 2027-03-27 00:00 to 2027-03-30 00:00');
    expect(units).toContain('metres above Chart Datum');
    expect(provenance).toBe('Constants: Invented test fixture');
    expect(caution).toMatch(/^Caution: Astronomical predictions only\./);
    // Daylight saving starts on 2027-03-28 at 01:00 UTC (EU rule): +00:00 before, +01:00 after.
    const station = loadStationFile(BRINEWOLD) as ReferenceStation;
    const events = findExtrema(compilePredictor(station), ms('2027-03-27T00:00Z'), ms('2027-03-29T23:00Z'));
    const rows = stdout.split('\n').filter((l) => /\d\d:\d\d {2}[+-]\d\d:\d\d/.test(l));
    expect(rows).toHaveLength(events.length);
    events.forEach((e, i) => {
      const local = DateTime.fromMillis(Math.round(e.time / 60_000) * 60_000, { zone: 'Europe/Lisbon' });
      expect(rows[i]).toContain(`${local.toFormat('HH:mm')}  ${local.toFormat('ZZ')}  ${e.type.padEnd(4)}  ${e.height.toFixed(2).padStart(6)} m`);
      expect(local.toFormat('ZZ')).toBe(e.time < ms('2027-03-28T01:00Z') ? '+00:00' : '+01:00');
    });
    // The date and weekday head the first row of each local day only.
    expect(rows.filter((r) => r.startsWith('2027-03-28  Sun'))).toHaveLength(1);
  });

  it('csv: the exports\' header line (CRLF), then station id, UTC, local time with offset, type, height and below-datum per event', async () => {
    const { stdout } = await runCli(['predict', BRINEWOLD, '--from', '2027-07-01', '--to', '2027-07-02', '--format', 'csv']);
    expect(stdout.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    const [header, ...rows] = stdout.trimEnd().split('\r\n');
    expect(header).toBe('station_id,time,time_local,date_local,type,height_m,below_chart_datum');
    const station = loadStationFile(BRINEWOLD) as ReferenceStation;
    // Lisbon is on +01:00 in July: the day starts at 23:00Z.
    const events = findExtrema(compilePredictor(station), ms('2027-06-30T23:00Z'), ms('2027-07-01T23:00Z'));
    expect(rows).toEqual(
      events.map((e) => {
        const local = DateTime.fromMillis(Math.round(e.time / 1000) * 1000, { zone: 'Europe/Lisbon' }).toISO({ suppressMilliseconds: true });
        const date = DateTime.fromMillis(Math.round(e.time / 60_000) * 60_000, { zone: 'Europe/Lisbon' }).toISODate();
        return `brinewold-head,${isoSecond(e.time)},${local},${date},${e.type},${mm(e.height).toFixed(3)},${mm(e.height) < 0}`;
      }),
    );
  });

  it('csv and table of heights', async () => {
    const csv = await runCli(['predict', BRINEWOLD, '--from', '2027-01-01', '--to', '2027-01-01T01:00Z', '--every', '30', '--format', 'csv']);
    expect(csv.stdout.split('\r\n')[0]).toBe('station_id,time,time_local,height_m');
    expect(csv.stdout.split('\r\n')[1]).toMatch(/^brinewold-head,2027-01-01T00:00:00Z,2027-01-01T00:00:00\+00:00,\d+\.\d{3}$/);
    const table = await runCli(['predict', BRINEWOLD, '--from', '2027-01-01', '--to', '2027-01-01T01:00Z', '--every', '30']);
    expect(table.stdout).toContain('Heights every 30 minutes');
    expect(table.stdout).toMatch(/2027-01-01 {2}Fri {2}00:00 {2}\+00:00 +\d+\.\d\d m\n {17}00:30/);
  });
});

describe('predict refuses bad input with one line and exit 1', () => {
  const cases: [string, string[], string][] = [
    ['an impossible date', ['--from', '2027-02-30', '--to', '2027-03-02'], 'tidewright: --from: 2027-02-30 is not a real date (February 2027 has 28 days); write a date as YYYY-MM-DD, e.g. 2027-02-28\n'],
    ['words for a date', ['--from', 'tomorrow'], 'tidewright: --from: "tomorrow" is neither a date nor an ISO 8601 instant; write a date as YYYY-MM-DD (midnight at the station) or an instant such as 2027-01-01T06:00Z\n'],
    ['an end before the start', ['--from', '2027-02-01', '--to', '2027-01-01'], 'tidewright: --to: 2027-01-01 is not later than --from 2027-02-01; give an end after the start, e.g. --from 2027-01-01 --to 2027-02-01\n'],
    ['an end equal to the start', ['--from', '2027-01-01', '--to', '2027-01-01T00:00Z'], 'tidewright: --to: 2027-01-01T00:00Z is not later than --from 2027-01-01; give an end after the start, e.g. --from 2027-01-01 --to 2027-02-01\n'],
    ['a zero step', ['--from', '2027-01-01', '--every', '0'], 'tidewright: --every: "0" is not a step of whole seconds, from 1 second to 1440 minutes; write a number of minutes, e.g. --every 10\n'],
    ['a negative step', ['--from', '2027-01-01', '--every=-5'], 'tidewright: --every: "-5" is not a step of whole seconds, from 1 second to 1440 minutes; write a number of minutes, e.g. --every 10\n'],
    ['a step that is not a number', ['--every', 'ten'], 'tidewright: --every: "ten" is not a step of whole seconds, from 1 second to 1440 minutes; write a number of minutes, e.g. --every 10\n'],
    ['an unknown format', ['--format', 'jsn'], 'tidewright: --format: "jsn" is not one of table, json, csv; did you mean json? write --format json\n'],
    ['an unknown option', ['--form', '2027-01-01'], 'tidewright: --form: is not an option of tidewright predict; did you mean --from? (see tidewright predict --help)\n'],
  ];
  it.each(cases)('%s', async (_, args, message) => {
    const { code, stdout, stderr } = await runCli(['predict', BRINEWOLD, ...args]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toBe(message);
  });

  it('no station file', async () => {
    const { code, stderr } = await runCli(['predict', '--from', '2027-01-01']);
    expect(code).toBe(1);
    expect(stderr).toBe('tidewright: STATION.yaml: is missing; see tidewright predict --help\n');
  });

  it('a bad station file names file, field and fix', async () => {
    const file = join(ROOT, 'tests', 'fixtures', 'stations-bad', 'phase-360.yaml');
    const { code, stderr } = await runCli(['predict', file, '--from', '2027-01-01']);
    expect(code).toBe(1);
    expect(stderr).toBe(`tidewright: ${file}: constituents.M2.phase: 360 is outside 0 to 360 degrees; write 0, the same angle reduced into [0, 360)\n`);
  });

  it('a secondary port whose reference port is not in the set', async () => {
    const file = join(ROOT, 'tests', 'fixtures', 'stations-reference-missing', 'saltgrist-cove.yaml');
    const { code, stderr } = await runCli(['predict', file, '--from', '2027-01-01']);
    expect(code).toBe(1);
    expect(stderr).toMatch(/^tidewright: .*saltgrist-cove\.yaml: reference: no station in .* has the id "brinwold-head"; did you mean brinewold-head\? write reference: brinewold-head\n$/);
  });

  it('--help prints the usage', async () => {
    const { code, stdout } = await runCli(['predict', '--help']);
    expect(code).toBe(0);
    expect(stdout).toContain('Usage: tidewright predict STATION.yaml');
  });
});

/** True when some source under cli/, engine/ or templates/ is newer than its compiled file in dist/. */
function distIsStale(): boolean {
  const stale = (dir: string): boolean =>
    readdirSync(join(ROOT, dir), { withFileTypes: true }).some((entry) => {
      const rel = join(dir, entry.name);
      if (entry.isDirectory()) return stale(rel);
      if (!entry.name.endsWith('.ts') || entry.name.endsWith('.d.ts')) return false;
      const built = join(ROOT, 'dist', rel.replace(/\.ts$/, '.js'));
      return !existsSync(built) || statSync(built).mtimeMs < statSync(join(ROOT, rel)).mtimeMs;
    });
  return ['cli', 'engine', 'templates'].some((dir) => existsSync(join(ROOT, dir)) && stale(dir));
}

describe('the compiled command (node bin/tidewright.js)', () => {
  beforeAll(() => {
    // `npm test` compiles before it tests; compile here only when run on its own after an edit.
    if (!distIsStale()) return;
    try {
      execFileSync('npx', ['tsc', '-p', 'tsconfig.build.json'], { cwd: ROOT, stdio: 'pipe' });
    } catch {
      // Type errors elsewhere (work in progress) do not stop tsc from emitting; checked below.
    }
  }, 300_000);

  it('exits 0 with JSON on stdout, and 1 with one line and no stack trace on bad input', () => {
    expect(existsSync(join(ROOT, 'dist', 'cli', 'main.js'))).toBe(true);
    const good = spawnSync('node', ['bin/tidewright.js', 'predict', BRINEWOLD, '--from', '2027-01-01', '--to', '2027-01-02', '--format', 'json'], { cwd: ROOT, encoding: 'utf8' });
    expect(good.stderr).toBe('');
    expect(good.status).toBe(0);
    expect((JSON.parse(good.stdout) as unknown[]).length).toBeGreaterThanOrEqual(3);

    const bad = spawnSync('node', ['bin/tidewright.js', 'predict', BRINEWOLD, '--from', '2027-02-30'], { cwd: ROOT, encoding: 'utf8' });
    expect(bad.status).toBe(1);
    expect(bad.stdout).toBe('');
    expect(bad.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(bad.stderr).not.toMatch(/\n\s+at /);
  });
});
