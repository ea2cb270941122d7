// `tidewright check`: every problem of a station set on its own line (file, field, fix), exit 1;
// a clean set gives a one-line summary and exit 0. Also the dispatcher's own answers.

import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';

const FIXTURES = join(import.meta.dirname, '..', 'fixtures');

afterEach(() => vi.restoreAllMocks());

describe('tidewright check', () => {
  it('lists every problem of a broken set, one line each, and exits 1', async () => {
    const dir = join(FIXTURES, 'stations-check-many');
    const { code, stdout, stderr } = await runCli(['check', '--stations', dir]);
    expect(code).toBe(1);
    expect(stderr).toBe('');
    const lines = stdout.trimEnd().split('\n').map((l) => l.replace(`${dir}/`, ''));
    // Schema problems, set problems and suspicious constants, grouped by file in name order.
    expect(lines.map((l) => l.split(': ').slice(0, 2).join(': '))).toEqual([
      'brinewold-head.yaml: timezone',
      'brinewold-head.yaml: constituents.M2.phase',
      'deep-steps.yaml: differences.low_water.springs.height',
      'no-m2.yaml: constituents.M2',
      'saltgrist-cove.yaml: reference',
      'slow-steps.yaml: differences.high_water.springs.time',
      'sunken-datum.yaml: mean_level',
      'tall-tales.yaml: constituents.M2.amplitude',
      `${dir}: 8 problems in 7 files (of 7)`,
    ]);
    // Each problem line says what to write instead after the semicolon.
    for (const line of lines.slice(0, -1)) expect(line).toMatch(/: .+; .+/);
    expect(stdout).toContain('did you mean Europe/Lisbon?');
    expect(stdout).toContain('write 40, the same angle reduced into [0, 360)');
    expect(stdout).toContain('amplitudes are in metres');
  });

  it('lists one problem or more for every file of the bad-file fixtures', async () => {
    const dir = join(FIXTURES, 'stations-bad');
    const { code, stdout } = await runCli(['check', '--stations', dir]);
    expect(code).toBe(1);
    const { readdirSync } = await import('node:fs');
    for (const file of readdirSync(dir)) expect(stdout).toContain(`${join(dir, file)}: `);
  });

  it('summarises a clean set in one line and exits 0', async () => {
    const dir = join(FIXTURES, 'stations-good');
    const { code, stdout } = await runCli(['check', '--stations', dir]);
    expect(code).toBe(0);
    expect(stdout).toBe(`${dir}: 1 reference port, 1 secondary port, OK\n`);
  });

  it('passes the demo scenario', async () => {
    const { code, stdout } = await runCli(['check', '--stations', join(import.meta.dirname, '..', '..', 'stations-demo')]);
    expect(stdout).toMatch(/: 4 reference ports, 5 secondary ports, 2 stream stations, OK\n$/);
    expect(code).toBe(0);
  });

  it('a missing folder is one line on stderr and exit 1', async () => {
    const { code, stdout, stderr } = await runCli(['check', '--stations', join(FIXTURES, 'no-such-folder')]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toMatch(/^tidewright: .*no-such-folder: \(folder\): does not exist or cannot be read; give the folder .*\n$/);
  });
});

describe('the dispatcher', () => {
  it('prints usage for --help and help, naming every command', async () => {
    const { code, stdout } = await runCli(['--help']);
    expect(code).toBe(0);
    for (const command of ['predict', 'almanac', 'build', 'check', 'analyse', 'differences']) {
      expect(stdout).toContain(`tidewright ${command}`);
    }
    expect((await runCli(['help'])).stdout).toBe(stdout);
  });

  it('prints the package version', async () => {
    const { code, stdout } = await runCli(['--version']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^tidewright \d+\.\d+\.\d+\n$/);
  });

  it('gives the help of one command', async () => {
    const { code, stdout } = await runCli(['help', 'check']);
    expect(code).toBe(0);
    expect(stdout).toContain('Usage: tidewright check [--stations DIR]');
  });

  it('lists the constituent names', async () => {
    const { stdout } = await runCli(['help', 'constituents']);
    expect(stdout).toMatch(/\bM2\b/);
    expect(stdout).toMatch(/\bMS4\b/);
  });

  it('answers an unknown command with one line and a suggestion, exit 1', async () => {
    const { code, stdout, stderr } = await runCli(['chek']);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toBe('tidewright: chek: is not a tidewright command; did you mean tidewright check? (tidewright help lists the commands)\n');
  });

  it('answers an unknown option with one line and a suggestion, exit 1', async () => {
    const { code, stderr } = await runCli(['check', '--station', 'x']);
    expect(code).toBe(1);
    expect(stderr).toBe('tidewright: --station: is not an option of tidewright check; did you mean --stations? (see tidewright check --help)\n');
  });

  it('answers an option with its value missing, and a stray argument', async () => {
    expect((await runCli(['check', '--stations'])).stderr).toBe('tidewright: --stations: needs a value; see tidewright check --help\n');
    expect((await runCli(['check', 'extra'])).stderr).toBe('tidewright: extra: is one argument too many for tidewright check; see tidewright check --help\n');
  });

  it('with no command prints the usage to stderr and exits 1', async () => {
    const { code, stdout, stderr } = await runCli([]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toContain('Usage:');
  });
});
