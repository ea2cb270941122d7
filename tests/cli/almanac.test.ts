// `tidewright almanac`: the command prints the engine's model (json) or a summary (table) and
// turns bad input into one line and exit code 1. The model itself is tested in tests/engine/almanac.
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';
import { buildStationYear, firstOf, loadStationSet } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';
import { wordsFor } from '../../templates/locale/index.js';

const ROOT = join(import.meta.dirname, '..', '..');
const DEMO = join(ROOT, 'stations-demo');

afterEach(() => vi.restoreAllMocks());

const scratch = mkdtempSync(join(tmpdir(), 'tidewright-almanac-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('almanac --format json', () => {
  it('prints exactly the engine model of a secondary port, found through its own folder', async () => {
    const { code, stdout, stderr } = await runCli(['almanac', join(DEMO, 'saltgrist-cove.yaml'), '--year', '2027', '--format', 'json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const printed = JSON.parse(stdout) as StationYear;
    const set = loadStationSet(DEMO);
    const model = buildStationYear(set.byId.get('saltgrist-cove')!, set, 2027);
    // the model's facts, plus the caution every output carries (the model itself holds no sentence)
    expect(printed).toEqual(JSON.parse(JSON.stringify({ ...model, caution: wordsFor().caution })));
    expect(printed.reference).toEqual({ id: 'brinewold-head', name: 'Brinewold Head (invented)' });
    expect(printed.events[0]).toEqual(model.events[0]);
    expect(Object.keys(firstOf(printed.events, 'events'))).toEqual(['time', 'local', 'clock', 'date', 'offset', 'type', 'height', 'belowDatum']);
    expect(printed.days[0]).toMatchObject({ date: '2027-01-01', weekday: 5, start: '2027-01-01T00:00:00Z' });
    expect(printed.tideType).toEqual({ formNumber: model.tideType.formNumber, kind: model.tideType.kind });
  });

  it('gives every day every sun and moon rise and set, in time order, the single fields as the first of each', async () => {
    // The demo station nearest a pole, where a day can hold two moonrises or two moonsets.
    const set = loadStationSet(DEMO);
    const polar = firstOf([...set.stations].sort((a, b) => Math.abs(b.position.latitude) - Math.abs(a.position.latitude)), 'stations');
    const { code, stdout } = await runCli(['almanac', join(DEMO, `${polar.id}.yaml`), '--year', '2027', '--format', 'json']);
    expect(code).toBe(0);
    const printed = JSON.parse(stdout) as StationYear;
    let doubles = 0;
    for (const day of printed.days) {
      const times = day.sky.map((e) => Date.parse(e.time));
      expect(times).toEqual([...times].sort((a, b) => a - b));
      for (const e of day.sky) {
        expect(Object.keys(e)).toEqual(['body', 'type', 'time', 'clock']);
        expect(e.time).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ$/);
      }
      const first = (body: string, type: string) => day.sky.find((e) => e.body === body && e.type === type)?.time ?? null;
      expect([day.sunrise, day.sunset, day.moonrise, day.moonset])
        .toEqual([first('sun', 'rise'), first('sun', 'set'), first('moon', 'rise'), first('moon', 'set')]);
      const count = (body: string, type: string) => day.sky.filter((e) => e.body === body && e.type === type).length;
      if (count('moon', 'rise') > 1 || count('moon', 'set') > 1 || count('sun', 'rise') > 1 || count('sun', 'set') > 1) doubles++;
    }
    if (Math.abs(polar.position.latitude) > 66) expect(doubles).toBeGreaterThan(0);
  });

  it('finds the reference port through --stations when the file stands alone', async () => {
    cpSync(join(DEMO, 'kelpmoor-harbour.yaml'), join(scratch, 'kelpmoor-harbour.yaml'));
    const alone = await runCli(['almanac', join(scratch, 'kelpmoor-harbour.yaml'), '--year', '2027', '--format', 'json']);
    expect(alone.code).toBe(1);
    expect(alone.stderr).toMatch(/^tidewright: .*kelpmoor-harbour\.yaml: reference: .*brinewold-head/);
    expect(alone.stderr.trim().split('\n').length).toBe(1);
    const found = await runCli(['almanac', join(scratch, 'kelpmoor-harbour.yaml'), '--year', '2027', '--stations', DEMO, '--format', 'json']);
    expect(found.stderr).toBe('');
    expect(found.code).toBe(0);
    expect((JSON.parse(found.stdout) as StationYear).reference?.id).toBe('brinewold-head');
  });
});

describe('almanac table and errors', () => {
  it('prints a short summary with datums, months, warnings and the caution', async () => {
    const { code, stdout } = await runCli(['almanac', join(DEMO, 'brinewold-head.yaml'), '--year', '2027']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/Brinewold Head \(invented\).*2027.*Europe\/Lisbon.*INVENTED/);
    expect(stdout).toMatch(/LAT \u2212?\d+\.\d\d\u00a0m/);
    expect(stdout).toMatch(/^January +\d+ +\d+/m);
    expect(stdout).toMatch(/^December +\d+ +\d+/m);
    expect(stdout).toMatch(/Clocks go back/);
    expect(stdout).toMatch(/Caution: Astronomical predictions only/);
  });

  it('answers bad input with one line and exit code 1', async () => {
    const cases: [string[], RegExp][] = [
      [['almanac', join(DEMO, 'nowhere.yaml')], /nowhere\.yaml: \(file\): does not exist/],
      [['almanac', join(DEMO, 'brinewold-head.yaml'), '--year', '27'], /--year: "27" is not a year/],
      [['almanac', join(DEMO, 'brinewold-head.yaml'), '--format', 'csv'], /--format/],
      [['almanac', join(DEMO, 'brinewold-head.yaml'), '--yeer', '2027'], /did you mean --year/],
      [['almanac'], /STATION\.yaml: is missing/],
    ];
    for (const [argv, pattern] of cases) {
      const { code, stdout, stderr } = await runCli(argv);
      expect(code).toBe(1);
      expect(stdout).toBe('');
      expect(stderr).toMatch(pattern);
      expect(stderr.trim().split('\n').length).toBe(1);
    }
  });

  it('has help', async () => {
    const { code, stdout } = await runCli(['almanac', '--help']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/tidewright almanac STATION\.yaml/);
  });
});
