// What the commands say in the smaller cases: help for help, help texts that start the same way, a
// read-only --out named as --out, a flat gauge record, and a note on a secondary port's time zone.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { COMMANDS, usageText } from '../../cli/main.js';
import { runCli } from '../fixtures/run-cli.js';

const root = mkdtempSync(join(tmpdir(), 'tw-messages-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const REFERENCE = `id: stint-rock
name: Stint Rock (invented)
kind: reference
position: { latitude: 47, longitude: -16 }
timezone: Europe/Lisbon
datum: Chart Datum
mean_level: 2.2
constituents:
  M2: { amplitude: 1.6, phase: 130 }
  S2: { amplitude: 0.55, phase: 175 }
provenance: Invented for the messages test
`;
const secondary = (zone: string): string => `id: stint-creek
name: Stint Creek (invented)
kind: secondary
reference: stint-rock
position: { latitude: 47.1, longitude: -16.1 }
timezone: ${zone}
datum: Chart Datum
differences:
  high_water: { springs: { time: 25, height: -0.3 }, neaps: { time: 15, height: -0.2 } }
  low_water: { springs: { time: 40, height: -0.1 }, neaps: { time: 30, height: -0.05 } }
provenance: Invented for the messages test
`;

let n = 0;
function set(zone: string): string {
  const dir = join(root, `set-${n++}`);
  mkdirSync(dir);
  writeFileSync(join(dir, 'stint-rock.yaml'), REFERENCE);
  writeFileSync(join(dir, 'stint-creek.yaml'), secondary(zone));
  return dir;
}

describe('help', () => {
  it('tidewright help help prints the overview', async () => {
    const { code, stdout } = await runCli(['help', 'help']);
    expect(code).toBe(0);
    expect(stdout).toBe(usageText());
  });

  it.each(Object.keys(COMMANDS))('tidewright help %s starts with "Usage: tidewright"', async (command) => {
    const { code, stdout } = await runCli(['help', command]);
    expect(code).toBe(0);
    expect(stdout).toMatch(new RegExp(`^Usage: tidewright ${command}`));
  });

  it('predict says that a time without a zone is the station\'s local time', async () => {
    expect((await runCli(['help', 'predict'])).stdout).toMatch(/a time without Z or an offset \(2027-01-01T06:00\)\s+is the station's local time/);
  });
});

describe('build --out that cannot be written', () => {
  it('names --out in one line (exit 1)', async () => {
    const { code, stderr } = await runCli(['build', '--stations', set('Europe/Lisbon'), '--out', '/sys/tidewright-out', '--year', '2027', '--quiet']);
    expect(code).toBe(1);
    expect(stderr).toBe('tidewright: --out: /sys/tidewright-out cannot be written: nothing can be made in /sys (no permission); give a folder you may write to, e.g. --out out\n');
  });
});

describe('a flat gauge record', () => {
  it('is refused instead of "100.0 % of the variance explained"', async () => {
    const file = join(root, 'flat.csv');
    const rows = Array.from({ length: 20 * 24 }, (_, i) => `${new Date(Date.UTC(2027, 0, 1) + i * 3_600_000).toISOString()},1.234`);
    writeFileSync(file, `time,height\n${rows.join('\n')}\n`);
    const { code, stderr } = await runCli(['analyse', file, '--latitude', '47', '--longitude', '-16', '--timezone', 'UTC']);
    expect(code).toBe(1);
    expect(stderr).toBe(`tidewright: ${file}: height: every reading is 1.234 m: the record shows no tide to analyse; give a record of a gauge that was working (its heights rise and fall with the tide)\n`);
  });
});

describe('check on a secondary port in another time zone', () => {
  it('prints a note and still passes', async () => {
    const dir = set('Atlantic/Azores');
    const { code, stdout } = await runCli(['check', '--stations', dir]);
    expect(code).toBe(0);
    expect(stdout.trimEnd().split('\n')).toEqual([
      `${join(dir, 'stint-creek.yaml')}: timezone: note: Atlantic/Azores differs from Europe/Lisbon of its reference port stint-rock; its times are printed in Atlantic/Azores (right if the port lies in another zone, else write timezone: Europe/Lisbon)`,
      `${dir}: 1 reference port, 1 secondary port, OK`,
    ]);
  });

  it('says nothing when the zones agree', async () => {
    const { stdout } = await runCli(['check', '--stations', set('Europe/Lisbon')]);
    expect(stdout).not.toContain('note:');
  });
});
