// The station's records (number, levelling, observations, datum authority): checked by the loader,
// printed on the book's facts page and the site's station page, heights against the land datum as an
// added column of the datums table, the number beside the name in the index.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, StationFileError, loadStationSet, parseStation } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { DEMO_DIR } from './site-build.js';

const RECORDS = {
  number: '0412',
  levelling: { datum: 'Invented Land Datum', chart_datum_below: 2.71 },
  observations: { from: '2019-03-01', to: '2020-02-29', source: 'Harbour gauge (invented)' },
  datum_authority: 'Invented Hydrographic Service',
};
const BASE = `id: quay
name: Quay (invented)
kind: reference
position: { latitude: 10, longitude: -30 }
timezone: Atlantic/Cape_Verde
datum: Chart Datum
mean_level: 2
constituents:
  M2: { amplitude: 1, phase: 100 }
provenance: Invented
`;

const problem = (extra: string): string => {
  try {
    parseStation(BASE + extra, 'quay.yaml');
  } catch (e) {
    if (e instanceof StationFileError) return e.message;
    throw e;
  }
  return '';
};

describe('station records in the station file', () => {
  it('are read as written', () => {
    const station = parseStation(`${BASE}number: "0412"
levelling: { datum: "Invented Land Datum", chart_datum_below: 2.71 }
observations: { from: 2019-03-01, to: 2020-02-29, source: "Harbour gauge (invented)" }
datum_authority: "Invented Hydrographic Service"
`, 'quay.yaml');
    expect(station).toMatchObject(RECORDS);
  });

  it.each([
    ['number: 412\n', /^quay\.yaml: number: should be text but is 412; write it in quotes/],
    ['levelling: { datum: LD }\n', /^quay\.yaml: levelling\.chart_datum_below: .*chart_datum_below: 2\.71/],
    ['levelling: { datum: LD, chart_datum_below: 2, above: 1 }\n', /^quay\.yaml: levelling\.above: /],
    ['observations: { from: 2019-02-30, to: 2020-02-29, source: gauge }\n', /^quay\.yaml: observations\.from: "2019-02-30" is not a date written YYYY-MM-DD; write a date such as 2019-03-01/],
    ['observations: { from: 2020-03-01, to: 2019-02-28, source: gauge }\n', /^quay\.yaml: observations: ends before it starts; write the first day as from: and the last day as to:/],
    ['datum_authority: ""\n', /^quay\.yaml: datum_authority: is empty/],
  ])('refuses %j in one line naming the field', (extra, message) => {
    expect(problem(extra)).toMatch(message);
  });
});

describe('station records printed', () => {
  let dir: string;
  let model: StationYear;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'tidewright-records-'));
    const set = loadStationSet(DEMO_DIR);
    const port = set.stations.find((s) => s.kind === 'reference')!;
    model = buildStationYear({ ...port, ...RECORDS }, set, 2027);
    await renderSite([model], join(dir, 'site'), { units: 'm', quiet: true });
  }, 60_000);
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('on the site\'s station page, with a column of heights above the land datum, and in the index', () => {
    const page = readFileSync(join(dir, 'site', model.station.id, '2027', 'index.html'), 'utf8');
    expect(page).toContain('<span class="station-number">No. 0412</span>');
    expect(page).toContain('<div><dt>Levelling</dt><dd>Chart Datum lies 2.71\u00a0m below Invented Land Datum</dd></div>');
    expect(page).toContain('<div><dt>Datum authority</dt><dd>Invented Hydrographic Service</dd></div>');
    // dates as every date is printed (the one formatter): 1 March 2019
    expect(page).toContain('<div><dt>Observations</dt><dd>1 March 2019 to 29 February 2020, Harbour gauge (invented)</dd></div>');
    expect(page).toContain('<th scope="col">Above Invented Land Datum (m)</th>');
    const land = [...page.matchAll(/<td class="land-height">([^<]+)<\/td>/g)].map((m) => m[1]);
    expect(land).toHaveLength(8); // HAT … LAT and chart datum itself
    expect(land).toContain('\u22122.71'); // chart datum, 2.71 m below the land datum
    expect(land).toContain((model.datums.HAT - 2.71).toFixed(2).replace('-', '\u2212'));
    const index = readFileSync(join(dir, 'site', 'index.html'), 'utf8');
    expect(index).toContain('<span class="station-number">No. 0412</span>');
  });

  it('on the book\'s facts page, with the land column', async () => {
    const book = await renderStationBook(model, { units: 'm', page: 'a5' });
    const file = join(dir, 'book.pdf');
    (await import('node:fs')).writeFileSync(file, book);
    let text: string;
    try {
      text = execFileSync('pdftotext', ['-layout', '-f', '1', '-l', '4', file, '-'], { encoding: 'utf8' });
    } catch {
      console.warn('pdftotext (poppler-utils) is not installed: book check skipped');
      return;
    }
    expect(text).toMatch(/Station number +0412/);
    expect(text).toMatch(/Levelling +Chart Datum lies 2\.71 m below Invented Land Datum/);
    expect(text).toMatch(/Datum authority +Invented Hydrographic Service/);
    expect(text).toMatch(/Observations +1 March 2019 to 29 February 2020, Harbour gauge \(invented\)/);
    expect(text).toContain('above Invented Land Datum');
    expect(text).toMatch(/CD +Chart Datum +0\.00 +\u22122\.71/);
  });
});
