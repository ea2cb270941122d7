// Size limits and one-line answers for hostile input: files that are devices, pipes or too large,
// text fields that are too long, keys with line breaks; the same verdict from check and build.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { MAX_STATION_FILE_BYTES, TEXT_LIMITS } from '../../engine/index.js';
import { PROJECT_KEYS } from '../../cli/build/project.js';
import { runCli } from '../fixtures/run-cli.js';

const root = mkdtempSync(join(tmpdir(), 'tw-limits-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const reference = (extra: Record<string, string> = {}): string => {
  const fields: Record<string, string> = {
    id: 'stint-rock', name: 'Stint Rock (invented)', kind: 'reference', position: '{ latitude: 47, longitude: -16 }',
    timezone: 'UTC', datum: 'Chart Datum', mean_level: '2.2',
    constituents: '\n  M2: { amplitude: 1.6, phase: 130 }\n  S2: { amplitude: 0.55, phase: 175 }',
    provenance: 'Invented for the limits test', ...extra,
  };
  return Object.entries(fields).map(([k, v]) => `${k}: ${v}`).join('\n') + '\n';
};

let n = 0;
function set(files: Record<string, string>): string {
  const dir = join(root, `set-${n++}`);
  mkdirSync(dir);
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

// The compiled command in a process of its own (npm test compiles first): a file that is a device or
// a pipe must be refused by the real program, and nothing it does can take the test runner down.
const BIN = fileURLToPath(new URL('../../bin/tidewright.js', import.meta.url));
function spawnCli(args: string[]): { code: number; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', timeout: 60_000 });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

/** check and build on the same set: both exit 1 and print the same problem lines. */
async function bothRefuse(dir: string): Promise<string[]> {
  const check = spawnCli(['check', '--stations', dir]);
  expect(check.code).toBe(1);
  const problems = check.stdout.trimEnd().split('\n').slice(0, -1);
  const build = spawnCli(['build', '--stations', dir, '--out', join(root, `out-${n++}`), '--quiet']);
  expect(build.code).toBe(1);
  const built = build.stderr.trimEnd().split('\n').map((l) => l.replace(/^tidewright: /, ''));
  for (const line of problems) expect(built).toContain(line);
  for (const line of [...problems, ...built]) expect(line.length).toBeLessThan(1500);
  return problems;
}

describe('files that are not what they seem', () => {
  it('a station file linked to /dev/zero is one line, at once, in check and build', async () => {
    const dir = set({ 'stint-rock.yaml': reference() });
    symlinkSync('/dev/zero', join(dir, 'zero.yaml'));
    const lines = await bothRefuse(dir);
    expect(lines).toEqual([`${join(dir, 'zero.yaml')}: (file): is not a plain file (a device, a pipe or a socket); give the path of a station .yaml file`]);
  });

  it('a named pipe is refused without waiting for a writer', async () => {
    const dir = set({ 'stint-rock.yaml': reference() });
    execFileSync('mkfifo', [join(dir, 'pipe.yaml')]);
    expect(await bothRefuse(dir)).toEqual([expect.stringMatching(/pipe\.yaml: \(file\): is not a plain file \(a named pipe\)/)]);
  });

  it(`a station file over ${MAX_STATION_FILE_BYTES / 1024} KiB is refused before it is read`, async () => {
    const dir = set({ 'stint-rock.yaml': reference() + `# ${'x'.repeat(MAX_STATION_FILE_BYTES)}\n` });
    expect(await bothRefuse(dir)).toEqual([expect.stringMatching(/stint-rock\.yaml: \(file\): is larger than 256 KiB, the most tidewright reads; /)]);
  });

  it('a gauge record linked to /dev/zero is one line from analyse', async () => {
    const zero = join(root, 'zero.csv');
    symlinkSync('/dev/zero', zero);
    const { code, stderr } = await runCli(['analyse', zero, '--latitude', '47', '--longitude', '-16', '--timezone', 'UTC']);
    expect(code).toBe(1);
    expect(stderr).toBe(`tidewright: ${zero}: file: is not a plain file (a device, a pipe or a socket); give the path of a CSV file of time,height rows\n`);
  });

  it('an unreadable station file says how to make it readable, not to give another path', async () => {
    const dir = set({ 'stint-rock.yaml': reference() });
    mkdirSync(join(dir, 'folder.yaml'));
    const lines = await bothRefuse(dir);
    expect(lines).toEqual([`${join(dir, 'folder.yaml')}: (file): is a folder, not a file; give the path of a station .yaml file`]);
  });
});

describe('text fields have a length limit', () => {
  it.each([
    ['name', TEXT_LIMITS.name],
    ['datum', TEXT_LIMITS.datum],
    ['provenance', TEXT_LIMITS.provenance],
  ])('%s longer than %i characters is one line in check and build', async (field, limit) => {
    const dir = set({ 'stint-rock.yaml': reference({ [field]: 'A'.repeat(limit + 1) }) });
    expect(await bothRefuse(dir)).toEqual([
      `${join(dir, 'stint-rock.yaml')}: ${field}: is ${limit + 1} characters long, more than the ${limit} allowed; shorten it to at most ${limit} characters`,
    ]);
  });

  it('a 50 KB name, a huge time zone and a key with line breaks each stay one short line', async () => {
    const dir = set({ 'stint-rock.yaml': reference({ name: 'N'.repeat(50_000), timezone: 'Z'.repeat(100_000), '"bad\\nkey\\u2028x"': '1' }) });
    const lines = await bothRefuse(dir);
    expect(lines).toHaveLength(3);
    expect(lines.join('\n')).toContain('bad\\nkey\\u2028x: is not a key tidewright knows here');
    expect(lines.join('\n')).toMatch(/timezone: "Z{20}…" is 100000 characters long, longer than any time zone name/);
  });
});

describe('tidewright.yaml in check', () => {
  it('lists all of its problems', async () => {
    const dir = set({ 'stint-rock.yaml': reference(), 'tidewright.yaml': 'year: abc\npage: b5\ncolour: blue\nunits: m\n' });
    const { code, stdout } = await runCli(['check', '--stations', dir]);
    expect(code).toBe(1);
    const file = join(dir, 'tidewright.yaml');
    expect(stdout.trimEnd().split('\n')).toEqual([
      `${file}: year: "abc" is not a year or a range of years; write a whole year from 1970 to 2100, e.g. year: 2027, a range of at most 10 years, e.g. year: 2027-2029, or leave the key out for next year`,
      `${file}: page: "b5" is not allowed here; write one of a5, a6, a4, letter, half-letter, e.g. page: a5`,
      `${file}: colour: is not a setting tidewright knows; the settings are ${PROJECT_KEYS.join(', ')}`,
      `${dir}: 3 problems in 1 file (of 1)`,
    ]);
  });

  it('an unreadable one is one line naming it, not an internal error', async () => {
    const dir = set({ 'stint-rock.yaml': reference() });
    symlinkSync('/dev/zero', join(dir, 'tidewright.yaml'));
    const check = await runCli(['check', '--stations', dir]);
    expect(check.code).toBe(1);
    expect(check.stdout).toContain(`${join(dir, 'tidewright.yaml')}: (file): is not a plain file`);
    const build = await runCli(['build', '--stations', dir, '--out', join(root, `out-${n++}`)]);
    expect(build.code).toBe(1);
    expect(build.stderr).toBe(`tidewright: ${join(dir, 'tidewright.yaml')}: (file): is not a plain file (a device, a pipe or a socket); give the path of a tidewright.yaml of key: value settings\n`);
  });
});

describe('a bad reference id', () => {
  it('suggests only well-formed ids, each once', async () => {
    const dir = set({
      'a.yaml': reference({ id: 'stint-rock' }),
      'b.yaml': reference({ id: 'stint-rock' }),
      'c.yaml': reference({ id: '"../../evil"' }),
      'd.yaml': reference({ id: '""' }),
      'e.yaml': `id: creek\nname: Creek (invented)\nkind: secondary\nreference: nowhere-at-all\nposition: { latitude: 47, longitude: -16 }\ntimezone: UTC\ndatum: Chart Datum\ndifferences:\n  high_water: { springs: { time: 5, height: 0 }, neaps: { time: 5, height: 0 } }\n  low_water: { springs: { time: 5, height: 0 }, neaps: { time: 5, height: 0 } }\nprovenance: Invented\n`,
    });
    const { stdout } = await runCli(['check', '--stations', dir]);
    const line = stdout.split('\n').find((l) => l.includes('e.yaml: reference'))!;
    expect(line).toMatch(/; write the id of one of the reference ports here: stint-rock$/);
  });
});
