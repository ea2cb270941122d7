// The covers of every kind of book, as a screen reader meets them (structure walked with pdfinfo
// -struct-text): one heading first that holds the title with its words apart, then the rest in the
// order the page reads, labels as row headers, pictures as figures with alternative text, the caution
// last; the bars, rules and black boxes are decoration and not read.
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, buildStreamYear, loadStationSet, type StationYear } from '../../engine/index.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';
import { renderIndexVolume } from '../../templates/pdf/index-volume.js';
import { renderPocketTable } from '../../templates/pdf/pocket.js';
import { renderStreamBook } from '../../templates/pdf/stream-book.js';
import { renderVolume } from '../../templates/pdf/volume.js';
import { nodesOf, structureTree, textUnder, type StructNode } from '../fixtures/pdf-structure.js';

const POPPLER = existsSync('/usr/bin/pdfinfo');
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the cover structure checks are SKIPPED');

const FIXTURES = join(import.meta.dirname, '..', 'fixtures', 'publisher');
const publisher = {
  publisher: 'Cover Test Society (invented)',
  logo: join(FIXTURES, 'brand', 'logo.png'),
  coverImage: join(FIXTURES, 'pages', 'images', 'quay.png'),
};
const set = loadStationSet('stations-demo');
let model: StationYear;
let dir = '';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'tidewright-covers-'));
  model = buildStationYear(set.byId.get('brinewold-head')!, set, 2027);
});
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

/** The sections under the Document of a PDF, one a page (or a pocket panel). */
function sectionsOf(pdf: Buffer, name: string): StructNode[] {
  const file = join(dir, `${name}.pdf`);
  writeFileSync(file, pdf);
  const [document] = structureTree(file).children;
  expect(document?.type).toBe('Document');
  return document?.children ?? [];
}

/** The structure of the first page (or panel) of a PDF. */
function firstSection(pdf: Buffer, name: string): StructNode {
  const [first] = sectionsOf(pdf, name);
  if (first === undefined) throw new Error(`${name}: an empty structure tree`);
  return first;
}

const types = (node: StructNode | undefined): string[] => (node?.children ?? []).map((c) => c.type);
const spoken = (node: StructNode | undefined): string => (node === undefined ? '' : textUnder(node).replace(/\s+/g, ' ').trim());

/** Label/value rows: each row a row header cell and a data cell. */
function expectRowHeaded(table: StructNode | undefined, labels: string[]): void {
  expect(table?.type).toBe('Table');
  const rows = table?.children ?? [];
  expect(rows.map((r) => types(r))).toEqual(labels.map(() => ['TH', 'TD']));
  expect(rows.map((r) => spoken(r.children[0]))).toEqual(labels);
  for (const r of rows) expect(r.children[0]?.attrs).toContain('Scope /Row');
}

/** The alternative texts of the figures in file order (PDF literal strings, their escapes undone). */
function figureAlts(pdf: Buffer): string[] {
  return [...pdf.toString('latin1').matchAll(/\/S \/Figure\b[\s\S]*?\/Alt \(((?:\\.|[^\\)])*)\)/g)]
    .map((m) => (m[1] ?? '').replace(/\\(.)/g, '$1'));
}

describe('covers as a screen reader reads them', () => {
  it.skipIf(!POPPLER)('station book: title heading, logo, kind, facts, fortnight, notice, picture, publisher, caution', { timeout: 600_000 }, async () => {
    const pdf = await renderStationBook(model, { units: 'm', page: 'a5', ...publisher });
    const cover = firstSection(pdf, 'station');
    expect(types(cover)).toEqual(['H1', 'Figure', 'P', 'Table', 'Figure', 'P', 'Figure', 'P', 'P']);
    expect(spoken(cover.children[0])).toBe('TIDE PREDICTIONS 2027 Brinewold Head (invented)');
    expectRowHeaded(cover.children[3], ['Position', 'Heights above', 'Local time']);
    expect(spoken(cover.children[5])).toMatch(/^INVENTED DATA A demonstration book/);
    expect(spoken(cover.children[7])).toBe(publisher.publisher);
    expect(spoken(cover.children[8])).toMatch(/^Astronomical predictions only\. Wind, atmospheric pressure and river flow change the real heights/);
    expect(figureAlts(pdf).slice(0, 3)).toEqual([`Logo of ${publisher.publisher}`,
      'The predicted tide at Brinewold Head (invented) over the first two weeks of 2027, drawn as a curve.', `Cover picture of ${publisher.publisher}`]);
  });

  it.skipIf(!POPPLER)('station book without a cover picture: the guide to the book as a table of contents', { timeout: 600_000 }, async () => {
    // the guide takes the room the invented-data notice would
    const cover = firstSection(await renderStationBook({ ...model, invented: false }, { units: 'm', page: 'a5' }), 'guide');
    expect(types(cover)).toEqual(['H1', 'P', 'Table', 'Figure', 'P', 'TOC', 'P']);
    expect(spoken(cover.children[4])).toBe('IN THIS BOOK');
    const entries = cover.children[5]?.children ?? [];
    expect(entries.every((e) => e.type === 'TOCI')).toBe(true);
    expect(entries.map(spoken)).toEqual(expect.arrayContaining(['Station facts 2', expect.stringMatching(/^January \d+$/), expect.stringMatching(/^December \d+$/)]));
  });

  it.skipIf(!POPPLER)('combined book, its volumes and the index volume: the set\u2019s title as the heading', { timeout: 900_000 }, async () => {
    const options = { units: 'm' as const, page: 'a5' as const, title: 'Four Coasts Tides (invented)', ...publisher };
    const [combined, ...pages] = sectionsOf(await renderCombinedBook([model], options), 'combined');
    expect(types(combined)).toEqual(['H1', 'Figure', 'P', 'P', 'Figure', 'P', 'P']);
    expect(spoken(combined?.children[0])).toBe('TIDE PREDICTIONS 2027 Four Coasts Tides (invented)');
    // the station's title page inside the book: its heading is the station alone, the lines above it a paragraph
    const section = pages.find((p) => p.children[1]?.type === 'H1' && spoken(p.children[1]) === 'Brinewold Head (invented)');
    expect(spoken(section?.children[0])).toBe('REFERENCE PORT · FOUR COASTS TIDES (INVENTED) 2027');

    const { pdf } = await renderVolume([{ model, compact: false, worked: null }], { ...options, imposition: 'none' }, { volume: 1, volumes: 2, label: 'North' });
    const volume = firstSection(pdf, 'volume');
    expect(types(volume)).toEqual(['H1', 'Figure', 'P', 'P', 'P', 'Figure', 'P', 'P']);
    expect(spoken(volume.children[2])).toMatch(/^Volume 1 of 2 · North$/);

    const index = firstSection(await renderIndexVolume([{ name: 'Brinewold Head', kind: 'reference', volume: 1, page: 4 }], options,
      { years: '2027', volumes: 2, invented: true }), 'index');
    expect(types(index)).toEqual(['H1', 'Figure', 'P', 'P', 'P', 'P', 'P', 'P']);
    expect(spoken(index.children[0])).toBe('TIDE PREDICTIONS 2027 Four Coasts Tides (invented)');
    expect(spoken(index.children[2])).toBe('Index of stations');
  });

  it.skipIf(!POPPLER)('index volume: the list read as a table of station, volume and page', async () => {
    const entries = [{ name: 'Saltgrist Cove', kind: 'secondary' as const, region: 'North Coast', volume: 2, page: 31 },
      { name: 'Brinewold Head', kind: 'reference' as const, volume: 1, page: 4 }];
    const file = join(dir, 'index-list.pdf');
    writeFileSync(file, await renderIndexVolume(entries, { units: 'm', page: 'a5' }, { years: '2027', volumes: 2, invented: true }));
    const [table, ...more] = nodesOf(structureTree(file), 'Table');
    expect(more).toEqual([]);
    const [head, ...rows] = table?.children ?? [];
    expect(head?.children.map((c) => c.type)).toEqual(['TH', 'TH', 'TH']);
    expect(rows.map((r) => r.children.map(spoken))).toEqual([['Brinewold Head', '1', '4'], ['Saltgrist Cove North Coast', '2', '31']]);
    for (const r of rows) expect(r.children[0]?.attrs).toContain('Scope /Row');
  });

  it.skipIf(!POPPLER)('stream book: the station and the book as its heading, the facts as labelled rows', { timeout: 600_000 }, async () => {
    const stream = buildStreamYear(set.streams!.find((s) => s.id === 'wrackrun-narrows')!, set, 2027);
    const first = firstSection(await renderStreamBook(stream, { units: 'm', page: 'a5' }), 'stream');
    expect(types(first).slice(0, 4)).toEqual(['H1', 'Table', 'H2', 'P']);
    expect(spoken(first.children[0])).toMatch(/^Wrackrun Narrows \(invented\) Tide predictions · tidal streams 2027$/);
    expect(nodesOf(first, 'TH').length).toBe(7);
  });

  it.skipIf(!POPPLER)('pocket table: the cover panel reads like a cover, and carries the logo', { timeout: 600_000 }, async () => {
    const pdf = await renderPocketTable(model, { units: 'm', sheet: 'a4', publisher: publisher.publisher, logo: publisher.logo });
    const cover = firstSection(pdf, 'pocket');
    expect(types(cover)).toEqual(['H1', 'Figure', 'Table', 'P', 'P', 'P']);
    expect(spoken(cover.children[0])).toBe('TIDE PREDICTIONS 2027 Brinewold Head (invented)');
    expectRowHeaded(cover.children[2], ['Heights', 'Times', 'Position']);
    expect(figureAlts(pdf)[0]).toBe(`Logo of ${publisher.publisher}`);
  });
});
