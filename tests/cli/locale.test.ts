// The tables and summaries commands print for people speak the reader's language (--locale, else
// `locale:` in the station set's tidewright.yaml); JSON and CSV are the same bytes in every language.
// Intl is the outside reference for weekday and month names and the decimal separator.
import { copyFileSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';

const ROOT = join(import.meta.dirname, '..', '..');
const GOOD = join(ROOT, 'tests', 'fixtures', 'stations-good');
const DEMO = join(ROOT, 'stations-demo');
const BRINEWOLD = join(GOOD, 'brinewold-head.yaml');
const SALTGRIST = join(GOOD, 'saltgrist-cove.yaml');
const NARROWS = join(DEMO, 'wrackrun-narrows.yaml');
const SPAN = ['--from', '2027-01-01', '--to', '2027-01-03'];

afterEach(() => vi.restoreAllMocks());

const weekday = (tag: string, iso: string): string =>
  new Intl.DateTimeFormat(tag, { weekday: 'short', timeZone: 'UTC' }).format(Date.parse(iso));
const month = (tag: string, m: number): string =>
  new Intl.DateTimeFormat(tag, { month: 'long', timeZone: 'UTC' }).format(Date.UTC(2027, m - 1, 15));

/** English words of these commands' English output that no translation may keep. */
const ENGLISH = ['High and low waters', 'local time', 'Caution', 'Constants', 'Heights', 'time zone', 'Times:', 'below datum',
  'Height', 'January', 'Month', 'high waters', 'Clock change', 'Open for', 'Opens', 'rising', 'falling', 'Slack water', 'Rate'];
const english = (text: string): string[] => ENGLISH.filter((w) => text.includes(w));

describe('predict in the reader\u2019s language', () => {
  it.each(['fr', 'es', 'pt', 'de', 'nl', 'nb'])('%s: the table has no English words, the locale\u2019s weekdays and decimals', async (tag) => {
    const { code, stdout, stderr } = await runCli(['predict', SALTGRIST, ...SPAN, '--locale', tag]);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    expect(english(stdout)).toEqual([]);
    expect(stdout).toContain(`2027-01-01  ${weekday(tag, '2027-01-01')}`);
    const separator = new Intl.NumberFormat(tag, { minimumFractionDigits: 2 }).format(1.25).replace(/\d/g, '');
    expect(stdout).toMatch(new RegExp(`\\d\\d:\\d\\d  \\+00:00  \\S+ +\\d+\\${separator}\\d\\d m`));
  });

  it('JSON and CSV are the same bytes in every language', async () => {
    for (const format of ['json', 'csv']) {
      const en = await runCli(['predict', BRINEWOLD, ...SPAN, '--format', format]);
      const de = await runCli(['predict', BRINEWOLD, ...SPAN, '--format', format, '--locale', 'de']);
      expect(de.stdout).toBe(en.stdout);
    }
  });

  it('an unsupported language is one line listing those there are', async () => {
    const { code, stdout, stderr } = await runCli(['predict', BRINEWOLD, ...SPAN, '--locale', 'it']);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toBe('tidewright: --locale: "it" is not a language tidewright publishes in; write one of en, fr, es, pt, de, nl, nb\n');
  });

  it('a stream station: slack, flood and ebb in the language', async () => {
    const { code, stdout } = await runCli(['predict', NARROWS, ...SPAN, '--locale', 'fr']);
    expect(code).toBe(0);
    expect(english(stdout)).toEqual([]);
    expect(stdout).toMatch(/\d\d:\d\d {2}\+00:00 {2}(étale|flot|jusant) /);
    expect(stdout).toMatch(/\d,\d kn/);
  });
});

describe('check in the reader\u2019s language', () => {
  it('words the summary line; the problems stay English (they quote the files\u2019 own keys)', async () => {
    const { code, stdout } = await runCli(['check', '--stations', GOOD, '--locale', 'de']);
    expect(code).toBe(0);
    expect(stdout).toBe(`${GOOD}: 1 Bezugsort, 1 Anschlussort, OK\n`);
    const fr = await runCli(['check', '--stations', GOOD, '--locale', 'fr']);
    expect(fr.stdout).toBe(`${GOOD} : 1 port de référence, 1 port secondaire, OK\n`);
  });
});

describe('locale: in tidewright.yaml', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tidewright-locale-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  copyFileSync(BRINEWOLD, join(dir, 'brinewold-head.yaml'));
  writeFileSync(join(dir, 'tidewright.yaml'), 'locale: nb\ncaution: "Our own caution, in our own words."\n');

  it('chooses the language (and the publisher\u2019s caution) of predict, windows, height and almanac; --locale wins', async () => {
    const file = join(dir, 'brinewold-head.yaml');
    const predict = await runCli(['predict', file, ...SPAN]);
    expect(predict.stdout).toContain('Høy- og lavvann, 2027-01-01 00:00 til 2027-01-03 00:00 lokal tid');
    expect(predict.stdout).toContain('Advarsel: Our own caution, in our own words.');
    const windows = await runCli(['windows', file, '--above', '3', ...SPAN]);
    expect(windows.stdout).toContain('Åpner');
    expect(english(windows.stdout)).toEqual([]);
    const height = await runCli(['height', file, '--at', '2027-01-01T12:00']);
    expect(height.stdout).toMatch(/\d+,\d\d m over Chart Datum, (stigende|synkende)/);
    const almanac = await runCli(['almanac', file, '--year', '2027']);
    expect(almanac.stdout).toMatch(new RegExp(`^${month('nb', 1)} +\\d+ +\\d+`, 'm'));
    expect(english(almanac.stdout)).toEqual([]);
    const overridden = await runCli(['predict', file, ...SPAN, '--locale', 'en']);
    expect(overridden.stdout).toContain('High and low waters');
  }, 60_000);
});
