// The PDF book of a stream-year: a first page with both cautions and one page per month with every
// slack, flood and ebb of the model (time and rate) — read back with poppler's pdftotext.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStreamYear, firstOf, loadStationSet, type StreamYear } from '../../engine/index.js';
import { renderCombinedBook } from '../../templates/pdf/book.js';
import { renderStreamBook } from '../../templates/pdf/stream-book.js';
import { wordsFor } from '../../templates/locale/index.js';
import { demoModels } from './site-build.js';
import { zipSame } from '../fixtures/lists.js';
import { nodesOf, structureTree, textUnder } from '../fixtures/pdf-structure.js';

const POPPLER = ['pdftotext', 'pdffonts', 'pdfinfo'].every((t) => existsSync(`/usr/bin/${t}`));
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the stream book checks are SKIPPED');
const DEMO = join(import.meta.dirname, '..', '..', 'stations-demo');
let tmp: string;
let file: string;
let model: StreamYear;
let pdf: Buffer;

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-stream-pdf-'));
  file = join(tmp, 'book.pdf');
  const set = loadStationSet(DEMO);
  model = buildStreamYear(set.streams!.find((s) => s.id === 'wrackrun-narrows')!, set, 2027);
  pdf = await renderStreamBook(model, { units: 'm', page: 'a5' });
  writeFileSync(file, pdf);
}, 60_000);

afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('renderStreamBook', () => {
  it('is the same bytes every time', async () => {
    expect((await renderStreamBook(model, { units: 'm', page: 'a5' })).equals(pdf)).toBe(true);
  });

  it.skipIf(!POPPLER)('a first page with both cautions, then the twelve months in order, then the imprint', () => {
    const pages = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).split('\f').filter((p) => p.trim() !== '');
    expect(pages).toHaveLength(14);
    expect(pages[13]).toContain(wordsFor().t('site.imprint'));
    expect(pages[13]).toContain(model.station.provenance);
    const first = firstOf(pages, 'pages').replace(/\s+/g, ' ');
    expect(first).toContain('Astronomical predictions only');
    expect(first).toContain('Tidal streams vary across a channel');
    expect(first).toContain('INVENTED DATA');
    expect(first).toContain('070° true');
    model.months.forEach((m, i) => expect(pages[i + 1]).toContain(wordsFor().monthName(m.month)));
  });

  it.skipIf(!POPPLER)('prints every slack, flood and ebb of March with its clock time, floods and ebbs with their rate', () => {
    const march = execFileSync('pdftotext', ['-layout', '-f', '4', '-l', '4', file, '-'], { encoding: 'utf8' });
    const lines = march.split('\n');
    for (const day of model.days.filter((d) => d.month === 3)) {
      const line = lines.find((l) => new RegExp(`^\\s*${wordsFor().weekdayShort(day.weekday)} ${day.dayOfMonth}\\b`).test(l));
      expect(line, `${day.date}`).toBeDefined();
      for (const e of day.events) {
        expect(line).toContain(e.clock);
        if (e.type !== 'slack') expect(line).toContain(`${e.clock} ${e.speed.toFixed(1)}`);
      }
    }
  });

  it.skipIf(!POPPLER)('reads each month as a table: column headers, then each day a row headed by its date, with its events', () => {
    const tables = nodesOf(structureTree(file), 'Table').filter((t) => (t.children[0]?.children ?? []).every((c) => c.type === 'TH'));
    expect(tables).toHaveLength(12);
    for (const [i, table] of tables.entries()) {
      const [head, ...rows] = table.children;
      expect(head?.children.map((c) => c.attrs)).toEqual([['Scope /Column'], ['Scope /Column'], ['Scope /Column'], ['Scope /Column']]);
      const days = model.days.filter((d) => d.month === i + 1);
      expect(rows).toHaveLength(days.length);
      for (const [row, day] of zipSame(rows, days, 'days of the month')) {
        expect(row.children.map((c) => c.type)).toEqual(['TH', 'TD', 'TD', 'TD']);
        expect(row.children[0]?.attrs).toContain('Scope /Row');
        const said = textUnder(row).replace(/\s+/g, ' ');
        expect(said).toContain(`${wordsFor().weekdayShort(day.weekday)} ${day.dayOfMonth}`);
        for (const e of day.events) expect(said).toContain(e.type === 'slack' ? e.clock : `${e.clock} ${e.speed.toFixed(1)}`);
      }
    }
  });

  it.skipIf(!POPPLER)('the combined book carries the stream pages after the tide stations', async () => {
    const combined = join(tmp, 'combined.pdf');
    writeFileSync(combined, await renderCombinedBook(demoModels(['brinewold-head']), { units: 'm', page: 'a5' }, [model]));
    const text = execFileSync('pdftotext', ['-layout', combined, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    const streamPart = text.slice(text.indexOf('Tidal streams vary across a channel'));
    expect(streamPart.length).toBeGreaterThan(1000);
    for (const m of model.months) expect(streamPart).toContain(wordsFor().monthName(m.month));
    expect(text.indexOf('Wrackrun Narrows')).toBeGreaterThan(text.indexOf('Brinewold Head'));
  }, 60_000);
});
