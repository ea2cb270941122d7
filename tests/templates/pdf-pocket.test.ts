// The pocket table read back from its PDF: one sheet, two sides; every high and low water of the year
// with its time and height; type measured at 6 pt or more; the caution; byte-identical rebuilds.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf } from '../../engine/index.js';
import { pdfWords } from '../fixtures/pdf-words.js';
import { loadStationSet } from '../../engine/index.js';
import { createDocument, finish } from '../../templates/pdf/document.js';
import type { PocketSheet } from '../../templates/pdf/pocket.js';
import { renderPocketTable } from '../../templates/pdf/pocket.js';
import { put } from '../../templates/pdf/text.js';
import { wordsFor } from '../../templates/locale/index.js';

const POPPLER = ['pdftotext', 'pdfinfo'].every((t) => existsSync(`/usr/bin/${t}`));
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the pocket table\u2019s text and size checks are SKIPPED');

// Intl is the reference for printed numbers (it rounds the shortest decimal form of a tie away from zero).
const fixed = (v: number, digits: number): string =>
  new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }).format(v);
const run = (cmd: string, args: string[]) => execFileSync(cmd, args, { encoding: 'utf8', maxBuffer: 64 << 20 });
let dir = '';
let heightPerPoint = 0;

function wordBoxes(file: string): { text: string; h: number }[] {
  return pdfWords(file).map((w) => ({ text: w.text, h: w.y1 - w.y0 }));
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tidewright-pocket-'));
  if (!POPPLER) return;
  // poppler's word box height per point of type, from a word set at 10 pt in the same faces
  const doc = createDocument({ title: 't', subject: 't', keywords: 't', date: new Date(0), lang: 'en' });
  doc.addPage({ size: [200, 100], margin: 0 });
  put(doc, '12:34', 20, 50, { font: 'narrow', size: 10 });
  const file = join(dir, 'ruler.pdf');
  writeFileSync(file, await finish(doc));
  heightPerPoint = firstOf(wordBoxes(file), 'ruler words').h / 10;
});
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

const set = loadStationSet('stations-demo');
const model = buildStationYear(set.byId.get('brinewold-head')!, set, 2027); // two clock changes in the year

describe.each([['a4', '841.89 x 595.276'], ['letter', '792 x 612']] as [PocketSheet, string][])('pocket table on %s', (sheet, size) => {
  let pdf: Buffer;
  let file = '';
  beforeAll(async () => {
    pdf = await renderPocketTable(model, { units: 'm', sheet, publisher: 'Invented Harbour Authority' });
    file = join(dir, `pocket-${sheet}.pdf`);
    writeFileSync(file, pdf);
  });

  it('is byte-identical when rendered again', async () => {
    expect((await renderPocketTable(model, { units: 'm', sheet, publisher: 'Invented Harbour Authority' })).equals(pdf)).toBe(true);
  });

  it.skipIf(!POPPLER)('is one landscape sheet printed on both sides', () => {
    const info = run('pdfinfo', [file]);
    expect(info).toMatch(/Pages:\s+2\n/);
    expect(info).toContain(`Page size:       ${size} pts`);
  });

  it.skipIf(!POPPLER)('prints every high and low water of the year, each with its time and height', () => {
    const text = run('pdftotext', ['-raw', file, '-']);
    const pairs = [...text.matchAll(/(\d\d:\d\d) (\u2212?\d+\.\d\d)(?!\d)/g)].map((m) => `${m[1]} ${m[2]}`).sort();
    const expected = model.events.map((e) => `${e.clock} ${e.belowDatum ? '\u2212' : ''}${fixed(Math.abs(e.height), 2)}`).sort();
    expect(expected.length).toBeGreaterThan(1400);
    // … and the key's sample entry
    expect(pairs).toEqual([...expected, '06:29 4.54'].sort());
  });

  it.skipIf(!POPPLER)('sets no word below 6 pt', () => {
    const words = wordBoxes(file).filter((w) => w.h > 0);
    const sizes = words.map((w) => w.h / heightPerPoint);
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(5.99);
  });

  it.skipIf(!POPPLER)('carries the station, the year, the datum, the caution and the invented-data notice', () => {
    const flat = run('pdftotext', ['-f', '1', '-l', '1', file, '-']).replace(/\s+/g, ' ');
    for (const s of [model.station.name, '2027', 'metres above Chart Datum', 'Astronomical predictions only',
      'INVENTED DATA', 'Invented Harbour Authority', 'January', 'June']) expect(flat).toContain(s);
    const inside = run('pdftotext', ['-f', '2', '-l', '2', file, '-']).replace(/\s+/g, ' ');
    for (const s of ['July', 'December', 'Levels of the tide', wordsFor().caution.slice(0, 60)]) expect(inside).toContain(s);
  });
});
