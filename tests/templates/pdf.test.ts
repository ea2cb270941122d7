// The printed tide book, read back from the PDF: every event of a month as the model has it, fonts
// embedded, page count and imposition, byte-identical rebuilds, feet, and hostile station names.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf, itemAt, loadStationSet } from '../../engine/index.js';
import type { AlmanacEvent, StationYear } from '../../engine/index.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';
import { wordsFor } from '../../templates/locale/index.js';

// Intl is the reference for printed numbers (it rounds the shortest decimal form of a tie away from zero).
const fixed = (v: number, digits: number): string =>
  new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }).format(v);

const en = wordsFor();
import { datumLadder } from '../../templates/site/datums.js';

const POPPLER = ['pdftotext', 'pdffonts', 'pdfinfo'].every((t) => existsSync(`/usr/bin/${t}`));
if (!POPPLER) console.warn('poppler-utils (pdftotext, pdffonts, pdfinfo) not found in /usr/bin: PDF text and font checks are SKIPPED');

let dir = '';
const write = (name: string, buf: Buffer) => { const p = join(dir, name); writeFileSync(p, buf); return p; };
const run = (cmd: string, args: string[]) => execFileSync(cmd, args, { encoding: 'utf8', maxBuffer: 64 << 20 });
/** Text of each page (pdftotext separates pages with form feeds). */
const pagesText = (file: string) => run('pdftotext', ['-layout', file, '-']).split('\f');
/** The text of the 0-based page `i`, empty when the book has no such page (the expectation then fails). */
const pageOf = (pages: readonly string[], i: number): string => pages[i] ?? '';
const pageCount = (buf: Buffer) => (buf.toString('latin1').match(/\/Type \/Page\n/g) ?? []).length;

/** Heights as a reader sees them, written here independently of the renderer: cm or tenths of a foot, true minus. */
function printed(e: AlmanacEvent, units: 'm' | 'ft'): string {
  const v = units === 'ft' ? e.height / 0.3048 : e.height;
  const s = fixed(Math.abs(v), units === 'ft' ? 1 : 2);
  return e.belowDatum ? `\u2212${s}` : s;
}

/** All "clock height" pairs in the text (a clock-change day adds a small offset such as +01 after the clock). */
function pairs(text: string, units: 'm' | 'ft'): string[] {
  const re = units === 'ft'
    ? /(\d\d:\d\d)(?:\s*(?:UTC)?[+\u2212]\d\d:\d\d(?::\d\d)?)?\s+(\u2212?\d+\.\d)(?!\d)/g
    : /(\d\d:\d\d)(?:\s*(?:UTC)?[+\u2212]\d\d:\d\d(?::\d\d)?)?\s+(\u2212?\d+\.\d\d)(?!\d)/g;
  return [...text.matchAll(re)].map((m) => `${m[1]} ${m[2]}`).sort();
}

function monthEvents(model: StationYear, month: number, units: 'm' | 'ft'): string[] {
  const mm = String(month).padStart(2, '0');
  return model.events.filter((e) => e.local.slice(5, 7) === mm).map((e) => `${e.clock} ${printed(e, units)}`).sort();
}

/** The model with every height lowered, so some low waters fall below chart datum. */
function lowered(model: StationYear, by: number): StationYear {
  const m = structuredClone(model);
  const drop = (e: AlmanacEvent) => {
    e.height = Math.round((e.height - by) * 1000) / 1000;
    e.belowDatum = e.height < 0;
  };
  m.events.forEach(drop);
  for (const d of m.days) { d.events.forEach(drop); d.curve = d.curve.map((h) => h - by); }
  return m;
}

// Real demo station-years: Brinewold Head (reference port, Europe/Lisbon with two clock changes) and
// Galewrack Point (reference port in the southern hemisphere) for the combined book.
const set = loadStationSet('stations-demo');
const demo = (id: string) => buildStationYear(set.byId.get(id)!, set, 2027);
const model = demo('brinewold-head');
// A5 book: cover, facts, caution, two facing pages per month, the year overview, the imprint
const expectedPages = 3 + 2 * model.months.length + 1 + 1;
let book: Buffer;
let bookFile: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tidewright-pdf-'));
  book = await renderStationBook(model, { units: 'm', page: 'a5', publisher: 'Test Harbour Office' });
  bookFile = write('book.pdf', book);
});
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

describe('station book (A5, metres)', () => {
  it('has cover, facts, caution, two pages per month, the year overview and the imprint', () => {
    expect(pageCount(book)).toBe(expectedPages);
  });

  it('is byte-identical when rendered again, with fixed dates from the model year', async () => {
    const again = await renderStationBook(model, { units: 'm', page: 'a5', publisher: 'Test Harbour Office' });
    expect(again.equals(book)).toBe(true);
    if (POPPLER) {
      const info = run('pdfinfo', [bookFile]);
      expect(info).toMatch(/CreationDate:\s+\w+ Jan\s+1 00:00:00 2027 UTC/);
      expect(info).toMatch(/ModDate:\s+\w+ Jan\s+1 00:00:00 2027 UTC/);
    }
  });

  it.skipIf(!POPPLER)('embeds every font and uses no standard PDF font', () => {
    const rows = run('pdffonts', [bookFile]).trim().split('\n').slice(2);
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      expect(row).toMatch(/DejaVu/);
      expect(row).toMatch(/\byes\s+yes\s+yes\b/); // emb sub uni
    }
    expect(run('pdffonts', [bookFile])).not.toMatch(/Helvetica|Times|Courier|Symbol|ZapfDingbats/);
  });

  it.skipIf(!POPPLER)('prints the months in order, each on two facing pages (even page first)', () => {
    const pages = pagesText(bookFile);
    model.months.forEach((m, i) => {
      const left = pages[3 + 2 * i];
      const right = pages[4 + 2 * i];
      expect(left).toContain(`${en.monthName(m.month)} ${model.year}`);
      expect(left).toContain(`days 1\u2013${Math.ceil(m.dayCount / 2)} of ${m.dayCount}`);
      expect(right).toContain(`${en.monthName(m.month)} ${model.year}`);
      expect(right).toContain(`of ${m.dayCount}`);
    });
  });

  it.skipIf(!POPPLER)('prints every high and low water of March and October with its local clock time and height', () => {
    const pages = pagesText(bookFile);
    for (const month of [3, 10]) {
      const text = pageOf(pages, 3 + 2 * (month - 1)) + pageOf(pages, 4 + 2 * (month - 1));
      const expected = monthEvents(model, month, 'm');
      expect(expected.length).toBeGreaterThan(100);
      expect(pairs(text, 'm')).toEqual(expected);
    }
  });

  it.skipIf(!POPPLER)('puts a day\u2019s high waters on its upper line and low waters on the lower, each in time order, as the site does', () => {
    const lines = itemAt(pagesText(bookFile), 3 + 2 * 2, 'pages').split('\n'); // March, days 1 to 16
    const inLine = (line: string) => [...line.matchAll(/(\d\d:\d\d)\s+(\u2212?\d+\.\d\d)(?!\d)/g)].map((m) => `${m[1]} ${m[2]}`);
    let lowFirst = 0;
    for (const day of model.days.filter((d) => d.month === 3 && d.dayOfMonth <= 16 && !d.offsetChange)) {
      const lane = (type: string) => day.events.filter((e) => e.type === type).map((e) => `${e.clock} ${printed(e, 'm')}`);
      const at = (want: string[]) => lines.findIndex((l) => inLine(l).join('|') === want.join('|'));
      const high = at(lane('high'));
      const low = at(lane('low'));
      expect(high, `${day.date} high waters on one line`).toBeGreaterThanOrEqual(0);
      expect(low - high, `${day.date} low waters on the line below`).toBeGreaterThan(0);
      expect(low - high).toBeLessThanOrEqual(3);
      if (firstOf(day.events, 'events').type === 'low') lowFirst++;
    }
    expect(lowFirst).toBeGreaterThan(3);
  });

  it.skipIf(!POPPLER)('marks each clock change on its day and states the month\u2019s UTC offsets', () => {
    const pages = pagesText(bookFile);
    expect(model.offsetChanges.length).toBe(2);
    for (const change of model.offsetChanges) {
      const day = model.days.find((d) => d.offsetChange?.time === change.time)!;
      const page = pages[3 + 2 * (day.month - 1) + (day.dayOfMonth > 16 ? 1 : 0)];
      expect(page).toContain(en.offsetChange(change));
      expect(page).toContain(`UTC${change.to}`);
    }
    expect(pages[3]).toContain(`All times UTC${model.days[0]?.offsetStart}`);
  });

  it.skipIf(!POPPLER)('carries the caution and the invented-data notice on every page', () => {
    const pages = pagesText(bookFile).filter((p) => p.trim().length > 0);
    expect(pages.length).toBe(expectedPages);
    for (const p of pages) {
      const flat = p.replace(/\s+/g, ' ');
      expect(flat).toContain('Astronomical predictions only');
      expect(flat).toContain('INVENTED DATA');
    }
    expect(pageOf(pages, 0).replace(/\s+/g, ' ')).toContain(en.caution);
  });
});

describe('station book in feet, with a hostile name and water below chart datum', () => {
  const name = '<script>alert("x")</script> & Ørsted\nBay \u00d1';
  // the demo tide never falls below chart datum: lower it by 0.4 m so that some low waters do
  const low = lowered({ ...model, station: { ...model.station, name } }, 0.4);
  let file = '';
  beforeAll(async () => { file = write('feet.pdf', await renderStationBook(low, { units: 'ft', page: 'a5' })); });

  it.skipIf(!POPPLER)('prints the name as plain text, control characters removed', () => {
    const pages = pagesText(file);
    const shown = '<script>alert("x")</script> & Ørsted Bay \u00d1';
    expect(pageOf(pages, 0).replace(/\s+/g, ' ')).toContain(shown); // the cover may wrap it over two lines
    expect(pages[3]).toContain(shown);
  });

  it.skipIf(!POPPLER)('prints heights in feet, those below chart datum with a minus sign', () => {
    const pages = pagesText(file);
    const text = pageOf(pages, 3) + pageOf(pages, 4);
    const expected = monthEvents(low, 1, 'ft');
    expect(expected.some((e) => e.includes('\u2212'))).toBe(true);
    expect(pairs(text, 'ft')).toEqual(expected);
    expect(pages[3]).toContain('feet above Chart Datum');
  });
});

describe('datums table of the facts page', () => {
  /** The level keys in the order the facts page prints them. */
  const printedOrder = (page: string) => page.split("\n").map((l) => /^\s*(HAT|MHWS|MHWN|MSL|MLWN|MLWS|LAT|CD)\s+(?:Highest|Mean|Lowest|Chart)/.exec(l)?.[1]).filter((k) => k !== undefined);

  it.skipIf(!POPPLER)('lists the levels in height order, chart datum at the bottom when LAT lies above it', () => {
    const facts = itemAt(pagesText(bookFile), 1, 'pages');
    expect(model.datums.LAT).toBeGreaterThan(0);
    expect(printedOrder(facts)).toEqual(['HAT', 'MHWS', 'MHWN', 'MSL', 'MLWN', 'MLWS', 'LAT', 'CD']);
    expect(facts).not.toContain('below Chart Datum: at the lowest tides');
  });

  it.skipIf(!POPPLER)('puts chart datum above LAT, as the site does, and says in words how far LAT lies below it', async () => {
    const sunk = { ...model, datums: { ...model.datums, LAT: -0.12 } };
    const file = write('lat-below.pdf', await renderStationBook(sunk, { units: 'm', page: 'a5' }));
    const facts = itemAt(pagesText(file), 1, 'pages');
    expect(printedOrder(facts)).toEqual(['HAT', 'MHWS', 'MHWN', 'MSL', 'MLWN', 'MLWS', 'CD', 'LAT']);
    // in reading order (the layout view interleaves the sentence with the tide staff beside it)
    expect(run('pdftotext', ['-f', '2', '-l', '2', file, '-']).replace(/\s+/g, ' ')).toContain('LAT lies 0.12 m below Chart Datum: at the lowest tides the sea falls below the charted depths.');
    // the site's table and ladder use the same order
    expect(datumLadder(sunk.datums).map((r) => r.key)).toEqual(printedOrder(facts));
  });
});

describe('saddle-stitched book', () => {
  it.skipIf(!POPPLER)('prints two pages per A4 side, sheets × 2 sides, outer sheet first', async () => {
    const imposed = await renderStationBook(model, { units: 'm', page: 'a5', imposition: 'saddle-stitch' });
    const sheets = Math.ceil(expectedPages / 4);
    expect(pageCount(imposed)).toBe(sheets * 2);
    const file = write('imposed.pdf', imposed);
    expect(run('pdfinfo', [file])).toMatch(/Page size:\s+841\.89 x 595\.276 pts/);
    // text of the left and right half of a sheet side (pdftotext crops in points at 72 dpi)
    const half = (page: number, right: boolean) => run('pdftotext', ['-layout', '-f', String(page), '-l', String(page),
      '-x', right ? '421' : '0', '-y', '0', '-W', '421', '-H', '596', file, '-']);
    const n = sheets * 4;
    expect(half(1, true)).toContain('TIDE PREDICTIONS'); // page 1, the cover
    expect(half(1, false)).toContain(n === expectedPages ? 'Imprint' : 'Notes'); // page n
    expect(half(2, false)).toContain('Station facts'); // page 2
    expect(half(2, true)).toMatch(new RegExp(n - 1 === expectedPages ? 'Imprint' : n - 1 === expectedPages - 1 ? 'at a glance' : 'Notes'));
    expect(half(3, true)).toContain('Caution'); // page 3 on the second sheet's front
  });
});

describe('combined book', () => {
  it.skipIf(!POPPLER)('shows the moon glyphs of both hemispheres in its key when its stations lie on both sides of the equator', async () => {
    const south = demo('galewrack-point');
    expect(south.station.position.latitude).toBeLessThan(0);
    const mixed = pagesText(write('combined-mixed.pdf', await renderCombinedBook([model, south], { units: 'm', page: 'a5' })));
    const key = mixed.find((p) => p.includes('Caution') && p.includes('New moon'))!.replace(/\s+/g, ' ');
    expect(key).toContain('as seen from the northern hemisphere.');
    expect(key).toContain('as seen from the southern hemisphere.');
    const north = pagesText(write('combined-north.pdf', await renderCombinedBook([model, demo('saltgrist-cove')], { units: 'm', page: 'a5' })));
    const northKey = north.find((p) => p.includes('Caution') && p.includes('New moon'))!.replace(/\s+/g, ' ');
    expect(northKey).toContain('as seen from the northern hemisphere.');
    expect(northKey).not.toContain('southern hemisphere');
  });

  it.skipIf(!POPPLER)('lists every station on the contents page with the page its section starts on', async () => {
    const second = demo('saltgrist-cove'); // a secondary port of Brinewold Head
    const buf = await renderCombinedBook([second, model], { units: 'm', page: 'a5', title: 'Club tide book' });
    const file = write('combined.pdf', buf);
    const pages = pagesText(file);
    expect(pages[0]).toContain('Club tide book');
    for (const st of [model, second]) {
      const line = pageOf(pages, 1).split('\n').find((l) => l.includes(st.station.name)) ?? '';
      const page = Number(line.trim().split(/\s+/).pop());
      // the section's title page sets the name large and may break it over two lines
      expect(pageOf(pages, page - 1).replace(/\s+/g, ' ')).toContain(st.station.name);
      expect(pages[page]).toContain('Station facts');
    }
    expect(pageCount(buf)).toBe(pages.filter((p) => p.trim()).length);
    // the secondary port is listed under its reference port, whatever order the models came in
    const lines = pageOf(pages, 1).split('\n');
    const refLine = lines.findIndex((l) => l.includes(model.station.name));
    expect(lines[refLine + 1]).toContain(second.station.name);
    expect(lines[refLine + 1]).toContain('secondary port');
  });
});

describe('options', () => {
  it('refuses a page size it does not know', async () => {
    await expect(renderStationBook(model, { units: 'm', page: 'b5' as 'a5' })).rejects.toThrow(/page size "b5"/);
  });
});
