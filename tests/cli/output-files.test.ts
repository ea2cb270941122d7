// The files `analyse` and `differences` write never cost the user data: no input of the same run is
// overwritten, an existing file only with --force, a folder is one line, and no temporary file is left.

import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { compilePredictor, firstOf } from '../../engine/index.js';
import type { ReferenceStation } from '../../engine/index.js';
import { evenTimes, recordCsv, recordOf } from '../fixtures/analysis-records.js';
import { runCli } from '../fixtures/run-cli.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-output-files-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const REFERENCE_YAML = `id: stint-rock
name: Stint Rock (invented)
kind: reference
position: { latitude: 47, longitude: -16 }
timezone: UTC
datum: Chart Datum
mean_level: 3
constituents:
  M2: { amplitude: 1.6, phase: 205 }
  S2: { amplitude: 0.55, phase: 250 }
provenance: Invented for the output-file test
`;
const reference: ReferenceStation = {
  id: 'stint-rock', name: 'Stint Rock (invented)', kind: 'reference', position: { latitude: 47, longitude: -16 },
  timezone: 'UTC', datum: 'Chart Datum', mean_level: 3,
  constituents: { M2: { amplitude: 1.6, phase: 205 }, S2: { amplitude: 0.55, phase: 250 } },
  provenance: 'Invented',
};
const START = Date.UTC(2027, 2, 1);
const STEP = 30 * 60_000;
const COUNT = 16 * 48;
const RECORD = recordCsv(recordOf(evenTimes(START, STEP, COUNT), compilePredictor(reference).heights(START, STEP, COUNT)));

/** A fresh folder holding the record and the reference port's station file. */
function workspace(name: string): { folder: string; record: string; station: string } {
  const folder = join(dir, name);
  mkdirSync(folder);
  const record = join(folder, 'gauge.csv');
  const station = join(folder, 'stint-rock.yaml');
  writeFileSync(record, RECORD);
  writeFileSync(station, REFERENCE_YAML);
  return { folder, record, station };
}

const POSITION = ['--latitude', '47', '--longitude', '-16', '--timezone', 'UTC'];

function oneLine(stderr: string): string {
  const lines = stderr.trim().split('\n');
  expect(lines).toHaveLength(1);
  return firstOf(lines, 'lines');
}

describe('files written by analyse and differences', () => {
  it('never writes a report over the record it reads, even with --force', async () => {
    const { folder, record } = workspace('report-over-record');
    for (const extra of [[], ['--force']]) {
      const { code, stderr } = await runCli(['analyse', record, ...POSITION, '--report', record, ...extra]);
      expect(code).toBe(1);
      expect(oneLine(stderr)).toMatch(/^tidewright: --report: .*gauge\.csv is an input of this run and would be overwritten; give --report a new file name$/);
      expect(readFileSync(record, 'utf8')).toBe(RECORD);
    }
    expect(readdirSync(folder).sort()).toEqual(['gauge.csv', 'stint-rock.yaml']);
  });

  it('never writes over the reference station file, also by another name (a symbolic link)', async () => {
    const { folder, record, station } = workspace('over-reference');
    const alias = join(folder, 'alias.yaml');
    symlinkSync(station, alias);
    for (const target of [station, alias]) {
      const { code, stderr } = await runCli(['differences', record, '--reference', station, '--output', target, '--force']);
      expect(code).toBe(1);
      expect(oneLine(stderr)).toMatch(/^tidewright: --output: .* of this run and would be overwritten; /);
    }
    expect(readFileSync(station, 'utf8')).toBe(REFERENCE_YAML);
  });

  it('refuses an existing file without --force and replaces it with --force, leaving no temporary file', async () => {
    const { folder, record } = workspace('force');
    const output = join(folder, 'quay.yaml');
    writeFileSync(output, 'kept\n');
    const refused = await runCli(['analyse', record, ...POSITION, '--output', output]);
    expect(refused.code).toBe(1);
    expect(oneLine(refused.stderr)).toMatch(/^tidewright: --output: .*quay\.yaml exists already; give a new file name, or add --force to replace it$/);
    expect(readFileSync(output, 'utf8')).toBe('kept\n');

    const forced = await runCli(['analyse', record, ...POSITION, '--output', output, '--force']);
    expect(forced.code).toBe(0);
    expect(readFileSync(output, 'utf8')).toMatch(/^# Harmonic constants of gauge/);
    expect(readdirSync(folder).sort()).toEqual(['gauge.csv', 'quay.yaml', 'stint-rock.yaml']);
  });

  it('refuses the same file for --output and --report', async () => {
    const { folder, record } = workspace('same-twice');
    const both = join(folder, 'both.txt');
    const { code, stderr } = await runCli(['analyse', record, ...POSITION, '--output', both, '--report', both]);
    expect(code).toBe(1);
    expect(oneLine(stderr)).toMatch(/^tidewright: --report: .*both\.txt is also the file of --output; /);
    expect(readdirSync(folder).sort()).toEqual(['gauge.csv', 'stint-rock.yaml']);
  });

  it.each([
    ['an existing folder', (folder: string) => folder],
    ['a path ending in a slash', (folder: string) => `${join(folder, 'new')}/`],
  ])('refuses %s as --output in one line (exit 1) and leaves nothing behind', async (_, target) => {
    const { folder, record, station } = workspace(`folder-${_.length}`);
    for (const argv of [
      ['analyse', record, ...POSITION, '--output', target(folder)],
      ['differences', record, '--reference', station, '--output', target(folder), '--force'],
    ]) {
      const { code, stderr } = await runCli(argv);
      expect(code).toBe(1);
      expect(oneLine(stderr)).toMatch(/^tidewright: --output: .* (is a|names a) folder; give a file name, e\.g\. --output .*station\.yaml$/);
    }
    expect(readdirSync(folder).sort()).toEqual(['gauge.csv', 'stint-rock.yaml']);
  });

  it('names the option when the file cannot be written, and leaves no temporary file', async () => {
    const { folder, record } = workspace('unwritable');
    const { code, stderr } = await runCli(['analyse', record, ...POSITION, '--output', join(record, 'quay.yaml')]);
    expect(code).toBe(1);
    expect(oneLine(stderr)).toMatch(/^tidewright: --output: .*quay\.yaml: .*gauge\.csv is a file, not a folder; give --output a file in a folder$/);
    expect(readdirSync(folder).sort()).toEqual(['gauge.csv', 'stint-rock.yaml']);
  });
});
