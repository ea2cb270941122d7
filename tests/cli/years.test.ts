// One range of years for every command (cli/years.ts), refused in one line naming the option; and
// negative numbers after an option read as its (bad) value, not as an unknown option.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { FIRST_YEAR, LAST_YEAR } from '../../cli/years.js';
import { loadProjectFile } from '../../cli/build/project.js';
import { runCli } from '../fixtures/run-cli.js';
import { firstOf } from '../../engine/index.js';

const dir = mkdtempSync(join(tmpdir(), 'tw-years-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const station = join(dir, 'stint-rock.yaml');
writeFileSync(station, `id: stint-rock
name: Stint Rock (invented)
kind: reference
position: { latitude: -20, longitude: 80 }
timezone: Asia/Kathmandu
datum: Chart Datum
mean_level: 2.2
constituents:
  M2: { amplitude: 1.6, phase: 130 }
  S2: { amplitude: 0.55, phase: 175 }
provenance: Invented for the years test
`);

async function refused(argv: string[]): Promise<string> {
  const { code, stdout, stderr } = await runCli(argv);
  expect(code).toBe(1);
  expect(stdout).toBe('');
  const lines = stderr.trim().split('\n');
  expect(lines).toHaveLength(1);
  return firstOf(lines, 'lines');
}

describe('the years every command accepts', () => {
  it('is one range, 1970 to 2100', () => {
    expect([FIRST_YEAR, LAST_YEAR]).toEqual([1970, 2100]);
  });

  it.each(['1969', '2101', '1600', '-1', '0001', 'abc'])('build and almanac both refuse --year %s with the same line', async (year) => {
    const build = await refused(['build', '--year', year]);
    const almanac = await refused(['almanac', station, '--year', year]);
    expect(build).toBe(`tidewright: --year: "${year}" is not a year from 1970 to 2100 (the years tidewright computes); write a year from 1970 to 2100, e.g. --year 2027`);
    expect(almanac).toBe(build);
  });

  it.each([
    [['--from', '1919-06-01'], /^tidewright: --from: 1919-06-01 is outside the years from 1970 to 2100 .*; give a date from 1970 to 2100/],
    [['--from', '0001-01-01', '--to', '0001-01-03'], /^tidewright: --from: 0001-01-01 is outside the years from 1970 to 2100/],
    [['--from', '2100-12-30'], /^tidewright: --to: 7 days after --from is outside the years from 1970 to 2100/],
    [['--from', '2027-01-01', '--to', '9999-01-01'], /^tidewright: --to: 9999-01-01 is outside the years/],
  ])('predict refuses %j in one line', async (options, message) => {
    expect(await refused(['predict', station, ...options])).toMatch(message);
  });

  it('predict takes the last day of the range, up to the first midnight after it', async () => {
    const { code } = await runCli(['predict', station, '--from', '2100-12-31', '--to', '2101-01-01']);
    expect(code).toBe(0);
  });

  it('tidewright.yaml refuses a year outside the range, naming the range', () => {
    writeFileSync(join(dir, 'tidewright.yaml'), 'year: 1600\n');
    expect(() => loadProjectFile(dir)).toThrow(/tidewright\.yaml: year: 1600 is not allowed here; write a whole year from 1970 to 2100/);
  });
});

describe('negative numbers after an option', () => {
  it.each([
    [['build', '--workers', '-1'], 'tidewright: --workers: "-1" is not a whole number from 1 to 64; write e.g. --workers 2'],
    [['predict', station, '--from', '2027-01-01', '--every', '-5'], 'tidewright: --every: "-5" is not a step of whole seconds, from 1 second to 1440 minutes; write a number of minutes, e.g. --every 10'],
  ])('%j says what is wrong with the value, not that it is missing', async (argv, line) => {
    expect(await refused(argv)).toBe(line);
  });
});
