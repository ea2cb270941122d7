// tidewright build: the command line, the project file (tidewright.yaml) and which one wins.
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { StationFileError, UsageError } from '../../engine/index.js';
import { parseBuildArgs } from '../../cli/build/args.js';
import { defaultYear, makePlan } from '../../cli/build/plan.js';
import { loadProjectFile } from '../../cli/build/project.js';

const root = mkdtempSync(join(tmpdir(), 'tw-build-options-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

let n = 0;
function stationsWithProject(text: string | null): string {
  const dir = join(root, `set-${n++}`);
  mkdirSync(dir);
  if (text !== null) writeFileSync(join(dir, 'tidewright.yaml'), text);
  return dir;
}

function thrown(fn: () => unknown): Error {
  try {
    fn();
  } catch (error) {
    return error as Error;
  }
  throw new Error('expected a throw');
}

describe('parseBuildArgs', () => {
  it('reads every option', () => {
    expect(parseBuildArgs(['--stations', 's', '--year', '2030', '--out', 'o', '--units', 'ft', '--page', 'a6',
      '--imposition', 'saddle-stitch', '--workers', '3', '--press', '--quiet'])).toEqual({
      stations: 's', years: [2030], out: 'o', units: 'ft', page: 'a6', imposition: 'saddle-stitch', workers: 3,
      press: true, quiet: true, help: false,
    });
    expect(parseBuildArgs([])).toEqual({
      stations: undefined, year: undefined, out: undefined, units: undefined, page: undefined,
      imposition: undefined, workers: undefined, press: false, quiet: false, help: false,
    });
  });

  it.each([
    [['--year', '27'], '--year'],
    [['--year', '2027.5'], '--year'],
    [['--units', 'feet'], '--units'],
    [['--page', 'b5'], '--page'],
    [['--imposition', 'booklet'], '--imposition'],
    [['--workers', '0'], '--workers'],
    [['--out', ''], '--out'],
    [['--colour'], '--colour'],
    [['stations-demo'], 'stations-demo'],
  ])('rejects %j naming %s', (argv, option) => {
    const error = thrown(() => parseBuildArgs(argv));
    expect(error).toBeInstanceOf(UsageError);
    expect((error as UsageError).option).toBe(option);
    expect((error as UsageError).fix.length).toBeGreaterThan(0);
  });
});

describe('project file', () => {
  it('is optional', () => {
    expect(loadProjectFile(stationsWithProject(null))).toEqual({ file: null, settings: {}, pages: [] });
    expect(loadProjectFile(stationsWithProject('')).settings).toEqual({});
  });

  it('holds what a publisher sets once', () => {
    const dir = stationsWithProject([
      'title: Brinewold Bay Tide Almanac', 'publisher: Brinewold Bay Harbour Office', 'year: 2028', 'page: a6',
      'units: ft', 'locale: en-GB', 'imposition: saddle-stitch', 'hourly: true', '',
    ].join('\n'));
    expect(loadProjectFile(dir)).toEqual({
      file: join(dir, 'tidewright.yaml'),
      settings: { title: 'Brinewold Bay Tide Almanac', publisher: 'Brinewold Bay Harbour Office', year: [2028], page: 'a6',
        units: 'ft', locale: 'en-GB', imposition: 'saddle-stitch', hourly: true },
      pages: [],
    });
  });

  it.each([
    ['page: b5\n', 'page', /a5/],
    ['units: feet\n', 'units', /units: ft/],
    ['year: 27.5\n', 'year', /whole year/],
    ['year: 2029-2027\n', 'year', /whole year/],
    ['year: 2027-2040\n', 'year', /range of at most 10 years/],
    ['year: 2027-\n', 'year', /whole year/],
    ['locale: "en_GB!"\n', 'locale', /en, fr, es, pt, de, nl, nb/],
    ['locale: it\n', 'locale', /en, fr, es, pt, de, nl, nb/],
    ['caution: ""\n', 'caution', /cannot be empty/],
    ['caution:\n', 'caution', /cannot be empty/],
    ['title: "  "\n', 'title', /title/],
    ['pagesize: a5\n', 'pagesize', /did you mean page\?/],
    ['imposition: [a, b]\n', 'imposition', /saddle-stitch/],
    ['hourly: yes please\n', 'hourly', /hourly: true/],
    ['title: [unclosed\n', 'line 2, column 1', /key: value/],
    ['- a\n- b\n', '(file)', /title/],
  ])('rejects %j naming the file, the field %s and the fix', (text, field, fix) => {
    const dir = stationsWithProject(text);
    const error = thrown(() => loadProjectFile(dir));
    expect(error).toBeInstanceOf(StationFileError);
    const e = error as StationFileError;
    expect(e.file).toBe(join(dir, 'tidewright.yaml'));
    expect(e.field).toBe(field);
    expect(e.fix).toMatch(fix);
    expect(e.message).not.toContain('\n');
  });
});

describe('language and caution', () => {
  it('--locale takes a supported language (a regional tag too) and wins over the project file', () => {
    const dir = stationsWithProject('locale: fr\ncaution: Predictions only; check the harbour office.\n');
    const plan = makePlan(parseBuildArgs(['--stations', dir, '--locale', 'de-AT']), root);
    expect(plan.render).toMatchObject({ locale: 'de-AT', caution: 'Predictions only; check the harbour office.' });
    expect(makePlan(parseBuildArgs(['--stations', dir]), root).render.locale).toBe('fr');
  });

  it('refuses an unsupported --locale in one line listing the supported ones', () => {
    const error = thrown(() => parseBuildArgs(['--locale', 'it']));
    expect(error).toBeInstanceOf(UsageError);
    expect((error as Error).message).toMatch(/--locale.*"it" is not a language tidewright publishes in.*en, fr, es, pt, de, nl, nb/);
    expect((error as Error).message).not.toContain('\n');
  });
});

describe('makePlan', () => {
  it('takes defaults, then the project file, then the command line', () => {
    const dir = stationsWithProject('year: 2031\npage: letter\ntitle: Club Almanac\n');
    const now = new Date(2026, 9, 1);
    const fromProject = makePlan(parseBuildArgs(['--stations', dir]), root, now);
    expect(fromProject).toMatchObject({ stationsDir: dir, outDir: join(root, 'out'), year: 2031,
      render: { units: 'm', page: 'letter', imposition: 'none', pocket: true, title: 'Club Almanac' }, workers: null,
      projectFile: join(dir, 'tidewright.yaml') });
    const overridden = makePlan(parseBuildArgs(['--stations', dir, '--year', '2029', '--page', 'a5', '--out', 'x']), root, now);
    expect(overridden).toMatchObject({ year: 2029, outDir: join(root, 'x'), render: { page: 'a5', title: 'Club Almanac' } });
    const bare = makePlan(parseBuildArgs(['--stations', stationsWithProject(null)]), root, now, {});
    expect(bare.year).toBe(2027);
    expect(bare.years).toEqual([2027]);
    const range = makePlan(parseBuildArgs(['--stations', stationsWithProject('year: 2027-2029\n')]), root, now);
    expect(range).toMatchObject({ year: 2027, years: [2027, 2028, 2029], render: { stamp: Date.UTC(2027, 0, 1) } });
    expect(makePlan(parseBuildArgs(['--stations', dir, '--year', '2030-2031']), root, now)).toMatchObject({ year: 2030, years: [2030, 2031] });
    // without edition: or SOURCE_DATE_EPOCH every output is stamped 1 January of the year
    expect(bare.render).toEqual({ units: 'm', page: 'a5', imposition: 'none', stamp: Date.UTC(2027, 0, 1), pocket: true });
  });

  it('leaves the pocket table out when the project file says pocket: false, and refuses a word for it', () => {
    const off = makePlan(parseBuildArgs(['--stations', stationsWithProject('pocket: false\n')]), root, new Date(2026, 9, 1));
    expect(off.render.pocket).toBe(false);
    expect(off.render.press).toBeUndefined();
    const pressed = makePlan(parseBuildArgs(['--stations', stationsWithProject('press: true\n')]), root, new Date(2026, 9, 1));
    expect(pressed.render.press).toBe(true);
    expect(() => makePlan(parseBuildArgs(['--stations', stationsWithProject('pocket: sometimes\n')]), root))
      .toThrow(/pocket.*write pocket: true/);
  });

  it('defaults to the next calendar year by the clock', () => {
    expect(defaultYear(new Date(2026, 11, 31))).toBe(2027);
    expect(defaultYear(new Date(2027, 0, 1))).toBe(2028);
  });

  it('refuses a stations folder that is missing or a file', () => {
    expect(thrown(() => makePlan(parseBuildArgs(['--stations', 'nowhere']), root))).toBeInstanceOf(UsageError);
    writeFileSync(join(root, 'plain-file'), 'x');
    expect((thrown(() => makePlan(parseBuildArgs(['--stations', 'plain-file']), root)) as UsageError).problem).toMatch(/not a folder/);
  });
});
