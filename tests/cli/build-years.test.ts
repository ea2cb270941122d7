// `tidewright build` over several years (year: 2027-2028 in tidewright.yaml), spawning the compiled
// CLI: one site whose station and month pages switch between the years, an index listing them, books
// and downloads per year, and the datums of the station's epoch whatever the year. Ranges that run
// backwards or span too many years are refused in one line.
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_BUILD_YEARS, yearSpan } from '../../cli/years.js';
import { itemAt } from '../../engine/index.js';

const ROOT = join(import.meta.dirname, '..', '..');
const BIN = join(ROOT, 'bin', 'tidewright.js');
const DEMO = join(ROOT, 'stations-demo');
const work = mkdtempSync(join(tmpdir(), 'tw-build-years-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const YEARS = [2027, 2028];
const IDS = ['brinewold-head', 'saltgrist-cove'];
const stations = join(work, 'stations');
const out = join(work, 'out');
let run: { code: number | null; stdout: string; stderr: string };

function tidewright(args: string[]): typeof run {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: work, encoding: 'utf8', timeout: 240_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  execFileSync('npx', ['tsc', '-p', 'tsconfig.build.json'], { cwd: ROOT, stdio: 'ignore' });
  mkdirSync(stations);
  for (const id of IDS) copyFileSync(join(DEMO, `${id}.yaml`), join(stations, `${id}.yaml`));
  writeFileSync(join(stations, 'tidewright.yaml'), 'year: 2027-2028\npocket: false\n');
  run = tidewright(['build', '--stations', stations, '--out', out, '--quiet']);
}, 300_000);

const read = (path: string): string => readFileSync(join(out, path), 'utf8');
/** The href of every link in a page, resolved to a path inside out/site. */
function links(page: string, within = ''): string[] {
  const html = read(page);
  const scope = within ? (new RegExp(`<nav class="${within}"[\\s\\S]*?</nav>`).exec(html)?.[0] ?? '') : html;
  return [...scope.matchAll(/href="([^"#]+)"/g)].map((m) => resolve(dirname(join(out, page)), itemAt(m, 1, 'm')));
}

describe('a build of several years', () => {
  it('succeeds', () => {
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
  });

  it('writes each station\'s book and downloads, and the combined book, for each year', () => {
    for (const year of YEARS) {
      for (const id of IDS) {
        expect(existsSync(join(out, 'pdf', `${id}-${year}.pdf`)), `${id} ${year}`).toBe(true);
        for (const name of [`${id}-${year}-events.csv`, `${id}-${year}-events.json`, `${id}-${year}.ics`]) {
          expect(existsSync(join(out, 'site', 'data', name)), name).toBe(true);
        }
        expect(existsSync(join(out, 'site', id, String(year), '03', 'index.html'))).toBe(true);
      }
      expect(existsSync(join(out, 'pdf', `almanac-${year}.pdf`))).toBe(true);
    }
    expect(existsSync(join(out, 'data'))).toBe(false);
  });

  it('gives every station page and month page a year switch whose links reach the same station (and month) in each year', () => {
    for (const id of IDS) {
      for (const year of YEARS) {
        for (const [page, suffix] of [[`site/${id}/${year}/index.html`, ''], [`site/${id}/${year}/07/index.html`, '07/']] as const) {
          const targets = links(page, 'year-switch');
          expect(targets, page).toEqual(YEARS.map((y) => join(out, 'site', id, String(y), suffix, 'index.html')));
          for (const t of targets) expect(existsSync(t), t).toBe(true);
          expect(read(page)).toContain(`aria-current="page">${year}</a>`);
        }
      }
    }
  });

  it('lists every year of every station on the index, each a working link', () => {
    const index = read('site/index.html');
    for (const id of IDS) {
      for (const year of YEARS) {
        expect(index).toContain(`href="${id}/${year}/index.html">${year}</a>`);
        expect(existsSync(join(out, 'site', id, String(year), 'index.html'))).toBe(true);
      }
    }
  });

  it('keeps the datums of the station\'s epoch whatever the year (the same table on every year\'s page)', () => {
    const datums = (page: string): string => /<section aria-labelledby="datums-heading">[\s\S]*?<\/section>/.exec(read(page))?.[0] ?? '';
    for (const id of IDS) {
      const [a, b] = YEARS.map((y) => datums(`site/${id}/${y}/index.html`));
      expect(a).toContain('MHWS');
      expect(a).toContain('2020–2038'); // the default epoch, 19 years from 2020
      expect(b).toBe(a);
    }
  });
});

describe('the years a build is given', () => {
  it('reads one year or a range, and refuses a backward or too long range in words', () => {
    expect(yearSpan('2027')).toEqual({ years: [2027] });
    expect(yearSpan('2027-2029')).toEqual({ years: [2027, 2028, 2029] });
    expect(yearSpan('2029-2027')).toMatchObject({ problem: '"2029-2027" runs backwards', fix: 'write the earlier year first: 2027-2029' });
    expect(yearSpan(`2027-${2027 + MAX_BUILD_YEARS}`)).toMatchObject({ problem: expect.stringContaining(`more than the ${MAX_BUILD_YEARS}`) });
    expect(yearSpan('2027-2101')).toMatchObject({ problem: '2101 is not a year from 1970 to 2100 (the years tidewright computes)' });
  });

  it.each([
    ['2029-2027', 'tidewright: --year: "2029-2027" runs backwards; write the earlier year first: 2027-2029'],
    ['2027-2040', 'tidewright: --year: "2027-2040" spans 14 years, more than the 10 one build publishes; write at most 10 years, e.g. 2027-2036, and build the rest into another folder'],
  ])('build --year %s is refused in one line, before anything is written', (years, line) => {
    const r = tidewright(['build', '--stations', stations, '--out', join(work, 'refused'), '--year', years]);
    expect(r.code).toBe(1);
    expect(r.stderr.trim()).toBe(line);
    expect(existsSync(join(work, 'refused'))).toBe(false);
  });

  it('tidewright.yaml refuses a backward range, naming the file and the field', () => {
    const dir = join(work, 'backward');
    mkdirSync(dir);
    copyFileSync(join(DEMO, 'brinewold-head.yaml'), join(dir, 'brinewold-head.yaml'));
    writeFileSync(join(dir, 'tidewright.yaml'), 'year: 2029-2027\n');
    const r = tidewright(['check', '--stations', dir]);
    expect(r.code).toBe(1);
    expect(r.stdout + r.stderr).toMatch(/tidewright\.yaml: year: "2029-2027" runs backwards; write a whole year/);
  });
});
