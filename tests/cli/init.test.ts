// `tidewright init DIR`: the starter folder is complete, passes check, builds a station-year whose
// stations sit at sea with a time zone that fits their longitude, and init never writes among existing files.
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DateTime } from 'luxon';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { buildStationYear, loadStationSet } from '../../engine/index.js';
import { loadProjectFile } from '../../cli/build/project.js';
import { runCli } from '../fixtures/run-cli.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-init-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
afterEach(() => vi.restoreAllMocks());

describe('tidewright init', () => {
  it('makes a folder with settings, two invented stations and a README, which check accepts', async () => {
    const target = join(dir, 'almanac');
    const made = await runCli(['init', target]);
    expect(made.code).toBe(0);
    expect(made.stderr).toMatch(/^tidewright: made .*almanac with 5 files; next: tidewright check --stations /);
    expect(readdirSync(target).sort()).toEqual(['README.md', 'pages', 'shearwater-shoal.yaml', 'storm-petrel-bank.yaml', 'tidewright.yaml']);
    expect(readdirSync(join(target, 'pages'))).toEqual(['welcome.md']);
    const checked = await runCli(['check', '--stations', target]);
    expect(checked.code, checked.stdout + checked.stderr).toBe(0);
    // every setting present (year commented: next year by default) and each explained by a comment above it
    const settings = readFileSync(join(target, 'tidewright.yaml'), 'utf8');
    for (const key of ['title', 'publisher', 'year', 'page', 'units', 'locale', 'imposition', 'caution', 'edition', 'contact', 'accent', 'logo', 'cover_image', 'pages']) {
      expect(settings, key).toMatch(new RegExp(`# [^\\n]+\\n(# )?${key}: `));
    }
    expect(loadProjectFile(target).settings).toMatchObject({ page: 'a5', units: 'm', imposition: 'none' });
    const readme = readFileSync(join(target, 'README.md'), 'utf8');
    expect(readme).toContain('npx tidewright build --stations . --out ../almanac-out');
    expect(readme).toContain('invented');
    expect(readme).toContain('defer to the harbour');
  });

  it('gives stations marked invented, at sea, with a zone that fits the longitude, that build a year', () => {
    const set = loadStationSet(join(dir, 'almanac'));
    expect(set.stations.map((s) => s.kind).sort()).toEqual(['reference', 'secondary']);
    for (const s of set.stations) {
      expect(s.name).toMatch(/\(invented\)$/);
      expect(s.provenance).toMatch(/^Invented/);
      // mid-ocean: the nearest land (the Azores, about 28°W) lies more than 800 km east
      expect(s.position.longitude).toBeLessThan(-36);
      expect(s.position.latitude).toBeGreaterThan(30);
      const offsetHours = DateTime.fromObject({ year: 2027, month: 1, day: 15 }, { zone: s.timezone }).offset / 60;
      expect(Math.abs(offsetHours - s.position.longitude / 15)).toBeLessThanOrEqual(1.5);
    }
    const model = buildStationYear(set.byId.get('shearwater-shoal')!, set, 2027);
    expect(model.events.length).toBeGreaterThan(1300);
    expect(model.datums.LAT).toBeGreaterThan(-0.5);
    // chart datum near LAT, so neither port warns that heights never reach the datum
    for (const s of set.stations) expect(buildStationYear(s, set, 2027).warnings, s.id).toEqual([]);
  });

  it.each([
    ['a folder with a file in it', (p: string) => { mkdirSync(p); writeFileSync(join(p, 'notes.txt'), 'mine'); }, /is not empty \(it holds one entry, e\.g\. notes\.txt\); give the name of a new or empty folder/],
    ['a file', (p: string) => { writeFileSync(p, 'mine'); }, /is a file, not a folder; give the name of a new or empty folder/],
  ])('refuses %s in one line and leaves it as it was', async (_, make, message) => {
    const target = join(dir, `taken-${Math.random().toString(36).slice(2)}`);
    make(target);
    const before = JSON.stringify(readdirSync(dir).sort());
    const { code, stderr } = await runCli(['init', target]);
    expect(code).toBe(1);
    expect(stderr).toMatch(message);
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(JSON.stringify(readdirSync(dir).sort())).toBe(before);
  });

  it('accepts an empty folder, and explains itself', async () => {
    const target = join(dir, 'empty');
    mkdirSync(target);
    expect((await runCli(['init', target])).code).toBe(0);
    const help = await runCli(['help', 'init']);
    expect(help.stdout).toMatch(/^Usage: tidewright init DIR/);
    expect((await runCli(['init'])).code).toBe(1);
  });
});
