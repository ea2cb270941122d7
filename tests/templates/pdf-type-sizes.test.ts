// Type sizes measured in the printed PDF (poppler's word boxes), not taken from the layout code: on
// every format the month pages print tide times, heights and sun and moon times at 7.5 pt or more,
// and no two words of a line run into each other.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf } from '../../engine/index.js';
import { pdfWords, type PdfWord } from '../fixtures/pdf-words.js';
import { loadStationSet } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { createDocument, finish } from '../../templates/pdf/document.js';
import type { PageSizeName } from '../../templates/pdf/options.js';
import { put } from '../../templates/pdf/text.js';

const POPPLER = existsSync('/usr/bin/pdftotext');
if (!POPPLER) console.warn('pdftotext not found in /usr/bin: the measured type-size checks are SKIPPED');


const words = (file: string, page: number): PdfWord[] => pdfWords(file, page);

let dir = '';
/** Box height of a word set at 10 pt in the books' faces: poppler's height per point of type. */
let heightPerPoint = 0;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tidewright-type-'));
  if (!POPPLER) return;
  const doc = createDocument({ title: 't', subject: 't', keywords: 't', date: new Date(0), lang: 'en' });
  doc.addPage({ size: [200, 100], margin: 0 });
  put(doc, '12:34', 20, 50, { font: 'narrow-bold', size: 10 });
  const file = join(dir, 'ruler.pdf');
  writeFileSync(file, await finish(doc));
  const w = firstOf(words(file, 1), 'ruler words');
  heightPerPoint = (w.y1 - w.y0) / 10;
});
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

const set = loadStationSet('stations-demo');
// a clock-changing reference port and a southern one
const models = ['brinewold-head', 'galewrack-point'].map((id) => buildStationYear(set.byId.get(id)!, set, 2027));
const CLOCK = /^\d\d:\d\d$/;
const HEIGHT = /^\u2212?\d+\.\d\d$/;

describe.each(['a6', 'a5', 'half-letter'] as PageSizeName[])('month pages on %s', (page) => {
  it.skipIf(!POPPLER)('print every time and height at 7.5 pt or more, words never overlapping', async () => {
    for (const model of models) {
      const file = join(dir, `${model.station.id}-${page}.pdf`);
      writeFileSync(file, await renderStationBook(model, { units: 'm', page }));
      const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).split('\f');
      const monthPages = text.flatMap((t, i) => (/days \d+\u2013\d+ of|\d\d days/.test(t) ? [i + 1] : []));
      expect(monthPages.length).toBeGreaterThanOrEqual(12);
      // the day curve (its hour ticks head the column) stays where there is room beside legible times
      const ticks = monthPages.filter((p) => /\b0\s+6\s+12\s+18\s+24\b/.test(text[p - 1] ?? '')).length;
      expect(ticks).toBe(page === 'a6' ? 0 : monthPages.length);
      let smallest = Infinity;
      let counted = 0;
      for (const p of monthPages) {
        const ws = words(file, p).filter((w) => w.y0 < 1e4);
        for (const w of ws) {
          if (!CLOCK.test(w.text) && !HEIGHT.test(w.text)) continue;
          const size = (w.y1 - w.y0) / heightPerPoint;
          smallest = Math.min(smallest, size);
          counted++;
        }
        // words sharing a line must not collide (0.3 pt of tolerance for kerning)
        for (const a of ws) {
          for (const b of ws) {
            if (a === b || Math.abs(a.y1 - b.y1) > 1 || a.x0 > b.x0) continue;
            if (a.x1 > b.x0 + 0.3 && a.x0 < b.x1) throw new Error(`${page} page ${p}: "${a.text}" runs into "${b.text}"`);
          }
        }
      }
      expect(counted).toBeGreaterThan(1000);
      expect(smallest).toBeGreaterThanOrEqual(7.49);
    }
  }, 60_000);
});
