// The pages a book prints after each month: access windows for a station that has them, and the hourly
// heights when the project asks for them (hourly: true). Read back with poppler's pdftotext.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf, itemAt } from '../../engine/index.js';
import type { Station } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { countPdfPages } from '../../cli/build/station-job.js';
import { windowedStandStation } from '../fixtures/engine-stations.js';

const POPPLER = existsSync('/usr/bin/pdftotext');
if (!POPPLER) console.warn('poppler-utils (pdftotext) not found in /usr/bin: the text checks of the pages after each month are SKIPPED');

const station = windowedStandStation();
const model = buildStationYear(station, { byId: new Map<string, Station>([[station.id, station]]) }, 2027);
const plain = { ...model, windows: [] };
const dir = mkdtempSync(join(tmpdir(), 'tidewright-after-month-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function pageTexts(pdf: Buffer, name: string): string[] {
  const file = join(dir, name);
  writeFileSync(file, pdf);
  return execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).split('\f');
}

describe('pages after each month', () => {
  it('a windows page after every month; hourly pages only with hourly: true', async () => {
    const none = countPdfPages(await renderStationBook(plain, { units: 'm', page: 'a5' }));
    const withWindows = await renderStationBook(model, { units: 'm', page: 'a5' });
    const withBoth = await renderStationBook(model, { units: 'm', page: 'a5', hourly: true });
    expect(countPdfPages(withWindows)).toBeGreaterThanOrEqual(none + 12);
    // (a two-page month still opens on a left-hand page: a notes page may come before it)
    expect(countPdfPages(withBoth)).toBeGreaterThanOrEqual(none + 24);
    if (!POPPLER) return;
    const pages = pageTexts(withBoth, 'both.pdf');
    const windows = pages.filter((p) => /· access windows/.test(p));
    const hours = pages.filter((p) => /· heights hour by hour/.test(p));
    expect(windows).toHaveLength(12);
    expect(hours).toHaveLength(12);
    // the March windows page comes after the March month page and lists every day with both windows
    const marchIndex = pages.findIndex((p) => /March 2027 · access windows/.test(p));
    expect(pages.slice(0, marchIndex).some((p) => /March\s+2027/.test(p) && !/access windows|hour by hour/.test(p))).toBe(true);
    const march = itemAt(pages, marchIndex, 'pages');
    expect(march).toContain('MARINA SILL');
    expect(march).toContain('ROAD BRIDGE');
    const sill = firstOf(model.windows, 'windows').days.find((d) => d.date === '2027-03-10')!;
    const line = march.split('\n').find((l) => /^\s*Wed 10\b/.test(l))!;
    for (const p of sill.pieces) expect(line).toContain(`${p.startClock}–${p.endClock}`);
    // the 23-hour day shows the skipped hour empty; the 25-hour day shows the repeated hour twice
    const marchHours = hours.find((p) => /March 2027/.test(p))!;
    const short = model.hourly.days.find((d) => d.date === '2027-03-28')!;
    expect(marchHours.split('\n').find((l) => /^\s*Sun 28\b/.test(l))).toContain('–');
    expect(short.clocks).not.toContain('01:00');
    // 31 October: the hour 01:00 twice, stacked in its cell (so the row reads 25 heights over its lines)
    const october = model.hourly.days.find((d) => d.date === '2027-10-31')!;
    expect(october.clocks.filter((c) => c === '01:00')).toHaveLength(2);
    const octoberHours = hours.find((p) => /October 2027/.test(p))!;
    const lines = octoberHours.split('\n');
    const at = lines.findIndex((l) => /^\s*Sun 31\b/.test(l));
    const numbers = lines.slice(at - 1, at + 2).join(' ').match(/\d+\.\d\b/g) ?? [];
    expect(numbers.length).toBeGreaterThanOrEqual(25);
  });

  it.skipIf(!POPPLER)('speak the book\u2019s language: French headings, notes, window states and decimal commas', async () => {
    const pages = pageTexts(await renderStationBook(model, { units: 'm', page: 'a5', hourly: true, locale: 'fr' }), 'fr.pdf');
    const windows = pages.filter((p) => /· fenêtres d’accès/.test(p));
    const hours = pages.filter((p) => /· hauteurs heure par heure/.test(p));
    expect(windows).toHaveLength(12);
    expect(hours).toHaveLength(12);
    const text = [...windows, ...hours].join('\n');
    // English words of these pages' old wording (window names come from the station file and stay)
    for (const english of ['access windows', 'hour by hour', 'open all day', 'no opening', 'Open while', 'Leave a margin', 'skipped hour', 'Heights in'])
      expect(text).not.toContain(english);
    expect(text).toContain('à la minute près');
    // hourly heights with the decimal comma Intl gives French (outside reference: Intl.NumberFormat('fr'))
    const comma = new Intl.NumberFormat('fr', { minimumFractionDigits: 1 }).format(1.5).replace(/\d/g, '');
    expect(comma).toBe(',');
    expect(hours[2]).toMatch(/\b\d+,\d\b/);
    expect(hours[2]).not.toMatch(/\b\d+\.\d\b/);
  });
});
