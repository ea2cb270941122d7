// Access windows on the book's month pages: bars under each day's curve at the open times, on the
// day's own length (23 and 25-hour days included), the key in the heading, the times in the figure's
// alternative text.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf, itemAt } from '../../engine/index.js';
import type { Station } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { drawWindowBars, windowLookup, windowsAlt } from '../../templates/pdf/window-bars.js';
import { wordsFor } from '../../templates/locale/index.js';
import { windowedStandStation } from '../fixtures/engine-stations.js';

const POPPLER = existsSync('/usr/bin/pdftotext');
if (!POPPLER) console.warn('poppler-utils (pdftotext) not found in /usr/bin: the month-page window key check is SKIPPED');

const station = windowedStandStation();
const model = buildStationYear(station, { byId: new Map<string, Station>([[station.id, station]]) }, 2027);
const dir = mkdtempSync(join(tmpdir(), 'tidewright-window-bars-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A stand-in for pdfkit that keeps the rectangles filled, the only marks the bars make. */
function recorder() {
  const rects: { x: number; y: number; w: number; h: number }[] = [];
  let pending: { x: number; y: number; w: number; h: number } | null = null;
  const doc: Record<string, (...a: number[]) => unknown> = {};
  for (const name of ['save', 'restore', 'lineWidth', 'strokeColor', 'dash', 'undash', 'moveTo', 'lineTo', 'stroke']) {
    doc[name] = () => doc;
  }
  doc.rect = (x, y, w, h) => { pending = { x: x!, y: y!, w: w!, h: h! }; return doc; };
  doc.fill = () => { if (pending) rects.push(pending); pending = null; return doc; };
  return { doc: doc as unknown as PDFKit.PDFDocument, rects };
}

describe('window bars under the day curve', () => {
  const lookup = windowLookup(model.windows);
  const box = { x: 100, y: 0, width: 250, height: 20 };
  const scale = { low: -0.5, high: 3.5 };

  it('a bar spans each opening at its place in the local day, on 24-, 23- and 25-hour days', () => {
    for (const date of ['2027-03-10', '2027-03-28', '2027-10-31']) {
      const day = model.days.find((d) => d.date === date)!;
      const { doc, rects } = recorder();
      drawWindowBars(doc, lookup, day, box, scale, 1);
      const sill = firstOf(model.windows, 'windows').days.find((d) => d.date === date)!;
      const bridge = itemAt(model.windows, 1, 'windows').days.find((d) => d.date === date)!;
      const dayStart = Date.parse(day.start);
      const length = Date.parse(day.end) - dayStart;
      // Worked by hand for the 25-hour day (31 October, clocks back at 02:00 local): the day is 25 h
      // long, so an opening at 12:00 local (13 h after midnight, the hour 01:00 counted twice) starts
      // 13/25 of the way along the bar, not 12/24.
      const expected = [sill, bridge].flatMap((w, k) => (w.state === 'closed' ? [] : w.state === 'open' ? [{ k, a: 0, b: 1 }]
        : w.pieces.map((p) => ({ k, a: (Date.parse(p.start) - dayStart) / length, b: (Date.parse(p.end) - dayStart) / length }))));
      expect(rects).toHaveLength(expected.length);
      expected.forEach((e, i) => {
        const r = itemAt(rects, i, 'rects');
        expect(r.x).toBeCloseTo(box.x + e.a * box.width, 6);
        expect(r.w).toBeCloseTo(Math.max((e.b - e.a) * box.width, 0.6), 6); // a sliver stays visible
        expect(r.y).toBeGreaterThanOrEqual(box.y + box.height); // under the curve
        expect(r.y).toBeCloseTo(rects.find((o, j) => itemAt(expected, j, 'expected').k === e.k)!.y, 9); // one line per window
      });
      const ys = [...new Set(rects.map((r) => r.y))].sort((a, b) => a - b);
      expect(ys.length).toBeLessThanOrEqual(2);
      if (date === '2027-10-31') expect(length).toBe(25 * 3_600_000);
      if (date === '2027-03-28') expect(length).toBe(23 * 3_600_000);
    }
  });

  it('the curve figure says the openings in words', () => {
    const day = model.days.find((d) => d.date === '2027-03-10')!;
    const sill = firstOf(model.windows, 'windows').days.find((d) => d.date === '2027-03-10')!;
    const alt = windowsAlt(windowLookup(model.windows), day, wordsFor({ locale: 'en' }));
    expect(alt.startsWith('Marina sill: ')).toBe(true);
    for (const p of sill.pieces) expect(alt).toContain(`${p.startClock}\u2013${p.endClock}`);
    expect(alt).toContain('Road bridge: ');
  });

  it.skipIf(!POPPLER)('the month page heading keys the bars to the windows', async () => {
    const file = join(dir, 'book.pdf');
    writeFileSync(file, await renderStationBook(model, { units: 'm', page: 'a5' }));
    const pages = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).split('\f');
    const months = pages.filter((p) => /March\s+2027/.test(p) && /HIGH WATER/.test(p));
    expect(months.length).toBeGreaterThan(0);
    for (const page of months) {
      expect(page).toContain('open: Marina sill');
      expect(page).toContain('open: Road bridge');
    }
  });
});
