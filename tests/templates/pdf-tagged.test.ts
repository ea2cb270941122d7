// Tagged books: poppler says Tagged: yes; the structure tree (walked with pdfinfo -struct) holds a table
// per month page whose first row is column header cells and whose day rows start with a row header;
// every figure carries alternative text; language and title are set to show; the text read in content
// order (pdftotext -raw) goes day by day with each day's tides; the imposed booklet keeps bookmarks.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear } from '../../engine/index.js';
import { loadStationSet } from '../../engine/index.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';
import { nodesOf, structureTree, textUnder } from '../fixtures/pdf-structure.js';
import { zipSame } from '../fixtures/lists.js';

const POPPLER = ['pdfinfo', 'pdftotext'].every((t) => existsSync(`/usr/bin/${t}`));
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the tagged-PDF checks are SKIPPED');

// Intl is the reference for printed numbers (it rounds the shortest decimal form of a tie away from zero).
const fixed = (v: number, digits: number): string =>
  new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }).format(v);
const run = (cmd: string, args: string[]) => execFileSync(cmd, args, { encoding: 'utf8', maxBuffer: 64 << 20 });
const set = loadStationSet('stations-demo');
const model = buildStationYear(set.byId.get('brinewold-head')!, set, 2027);
let dir = '';
let book: Buffer;
let file = '';

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tidewright-tagged-'));
  book = await renderStationBook(model, { units: 'm', page: 'a5' });
  file = join(dir, 'book.pdf');
  writeFileSync(file, book);
});
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

const structure = structureTree;
const all = nodesOf;

describe('tagged station book', () => {
  it.skipIf(!POPPLER)('is tagged, in English, and shows its title rather than its file name', () => {
    expect(run('pdfinfo', [file])).toMatch(/Tagged:\s+yes/);
    const raw = book.toString('latin1');
    expect(raw).toMatch(/\/Lang \(en\)/);
    expect(raw).toMatch(/\/DisplayDocTitle true/);
    expect(raw).toMatch(/\/MarkInfo \d+ 0 R/);
  });

  it.skipIf(!POPPLER)('has a table per month page, column header cells first, and a row header on every day', () => {
    const tree = structure(file);
    // month tables open with a row of column headers; the facts page's two tables have row headers only
    const tables = all(tree, 'Table').filter((t) => (t.children[0]?.children ?? []).every((c) => c.type === 'TH'));
    expect(tables.length).toBe(24);
    let days = 0;
    for (const t of tables) {
      const [head, ...rows] = t.children;
      if (head === undefined) throw new Error('a month table without rows');
      expect(head.type).toBe('TR');
      expect(head.children.length).toBeGreaterThanOrEqual(5);
      for (const cell of head.children) {
        expect(cell.type).toBe('TH');
        expect(cell.attrs).toContain('Scope /Column');
      }
      for (const row of rows) {
        expect(row.type).toBe('TR');
        if (row.children.length === 1) continue; // the note under a day on which the clocks change
        expect(row.children[0]?.type).toBe('TH');
        expect(row.children[0]?.attrs).toContain('Scope /Row');
        expect(row.children.slice(1).every((c) => c.type === 'TD')).toBe(true);
        days++;
      }
    }
    expect(days).toBe(365);
    expect(all(tree, 'H1').length).toBeGreaterThanOrEqual(24 + 4);
  });

  it.skipIf(!POPPLER)('outside the month tables: facts as row-headed tables, the key as a list, each page a section', () => {
    const tree = structure(file);
    const document = tree.children[0];
    expect(document?.type).toBe('Document');
    expect((document?.children ?? []).every((c) => c.type === 'Sect')).toBe(true); // one section per page
    const facts = (document?.children ?? []).find((c) => c.attrs.length === 0 && textUnder(c).includes('Station facts'));
    const factTables = all(facts ?? tree, 'Table').filter((t) => t.children.every((r) => r.children[0]?.type === 'TH' && r.children[0].attrs.includes('Scope /Row')));
    expect(factTables.length).toBeGreaterThanOrEqual(2); // the facts and the datums
    expect(textUnder(factTables[0] ?? tree)).toContain('Age of the tide');
    expect(all(factTables[1] ?? tree, 'TH').map((th) => textUnder(th).trim())).toEqual(expect.arrayContaining(['HAT', 'MSL', 'LAT']));
    const [key] = all(tree, 'L');
    const items = key?.children ?? [];
    expect(items.length).toBeGreaterThanOrEqual(6);
    for (const li of items) {
      expect(li.type).toBe('LI');
      expect(li.children.map((c) => c.type)).toEqual(['LBody']);
    }
    expect(textUnder(key ?? tree)).toContain('High water: clock time and height, on the upper line of each day, in time');
  });

  it('gives every figure alternative text', () => {
    const raw = book.toString('latin1');
    const figures = [...raw.matchAll(/\d+ 0 obj\s*<<([\s\S]*?)>>\s*endobj/g)].filter((m) => /\/S \/Figure\b/.test(m[1] ?? ''));
    // the cover's fortnight, the overview, a curve and two sun marks a day, the quarters, springs, neaps
    expect(figures.length).toBeGreaterThan(3 * 365);
    for (const f of figures) expect(f[1]).toMatch(/\/Alt (\(.+\)|<FEFF[0-9A-F]+>)/);
  });

  it.skipIf(!POPPLER)('reads day by day in content order, each day with its own tides', () => {
    const pages = run('pdftotext', ['-raw', file, '-']).split('\f');
    for (const month of [3, 10]) {
      const text = (pages[3 + 2 * (month - 1)] ?? '') + (pages[4 + 2 * (month - 1)] ?? '');
      // a moon quarter's minute sits on the weekday's line
      const chunks = text.split(/^(\d{1,2})\n(?:Mon|Tue|Wed|Thu|Fri|Sat|Sun)(?: \d\d:\d\d)?$/m);
      const days = model.days.filter((d) => d.month === month);
      const numbers = chunks.filter((_, i) => i % 2 === 1).map(Number);
      expect(numbers).toEqual(days.map((d) => d.dayOfMonth));
      days.forEach((d, i) => {
        const body = chunks[2 + 2 * i] ?? '';
        const seen = [...body.matchAll(/(\d\d:\d\d)(?:\s*(?:UTC)?[+\u2212]\d\d:\d\d)?\s+(\d+\.\d\d)/g)].map((m) => `${m[1]} ${m[2]}`);
        const want = [...d.events.filter((e) => e.type === 'high'), ...d.events.filter((e) => e.type === 'low')]
          .map((e) => `${e.clock} ${fixed(e.height, 2)}`);
        expect(seen).toEqual(want);
      });
    }
  });
});

describe('tagged combined book', () => {
  it.skipIf(!POPPLER)('tags each contents entry as a TOCI holding a Link whose OBJR is the entry\u2019s link annotation', { timeout: 600_000 }, async () => {
    const second = buildStationYear(set.byId.get('saltgrist-cove')!, set, 2027);
    const combined = join(dir, 'combined.pdf');
    const buf = await renderCombinedBook([model, second], { units: 'm', page: 'a5' });
    writeFileSync(combined, buf);
    const tree = structure(combined);
    const [toc, ...moreTocs] = all(tree, 'TOC');
    expect(moreTocs).toEqual([]); // two stations: one contents page
    const entries = toc?.children ?? [];
    expect(entries.map((e) => e.type)).toEqual(['TOCI', 'TOCI']);
    for (const [entry, station] of zipSame(entries, [model, second], 'contents entries')) {
      const links = all(entry, 'Link');
      expect(links).toHaveLength(1);
      expect(textUnder(entry)).toContain(station.station.name);
    }
    // every link annotation of the book is a structure element's OBJR, and its StructParent leads back to a Link
    const raw = buf.toString('latin1');
    const annots = [...raw.matchAll(/(\d+) 0 obj\s*<<([\s\S]*?)>>\s*endobj/g)].filter(([, , body = '']) => /\/Subtype \/Link/.test(body));
    expect(annots.length).toBeGreaterThanOrEqual(2);
    for (const [, id = '', body = ''] of annots) {
      expect(body).toMatch(/\/StructParent \d+/);
      expect(raw).toMatch(new RegExp(`/Type /OBJR\\s*/Obj ${id} 0 R`));
    }
    expect(raw.match(/\/S \/Link\b/g)?.length).toBe(annots.length);
  });
});

describe('imposed booklet', () => {
  it('keeps the bookmarks in book order and the links to each station', async () => {
    const second = buildStationYear(set.byId.get('saltgrist-cove')!, set, 2027);
    const flat = (await renderCombinedBook([model, second], { units: 'm', page: 'a5' })).toString('latin1');
    const imposed = (await renderCombinedBook([model, second], { units: 'm', page: 'a5', imposition: 'saddle-stitch' })).toString('latin1');
    const titles = (raw: string) => [...raw.matchAll(/\/Parent \d+ 0 R\n\/Title \(([^)]*)\)/g)].map((m) => m[1]);
    expect(titles(flat).length).toBeGreaterThan(26);
    expect(titles(imposed)).toEqual(titles(flat));
    for (const id of ['brinewold-head', 'saltgrist-cove']) {
      expect(imposed).toContain(`(station-${id})`); // named destination
      expect(imposed).toMatch(new RegExp(`/Dest \\(station-${id}\\)|/D \\(station-${id}\\)`)); // the contents' link
    }
    expect(imposed).toMatch(/\/StructTreeRoot/);
  });
});
