// Both renderers print every sunrise and sunset of a day: near the polar circles a day can hold two
// sunsets (or two sunrises), and the second must not be lost in print. An invented reference port
// at sea at 69.68°N 13°E; the model's times are checked against astronomy-engine in
// tests/engine/sky-polar.test.ts, so here each printed day is compared with its own model.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear } from '../../engine/index.js';
import type { DayEntry, ReferenceStation, StationYear } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { rowById, textOf } from './site-build.js';

const POPPLER = existsSync('/usr/bin/pdftotext');
if (!POPPLER) console.warn('poppler-utils (pdftotext) not found in /usr/bin: the PDF check of second sunrises/sunsets is SKIPPED');

const station: ReferenceStation = {
  id: 'polar-sea-mark',
  name: 'Polar Sea Mark (invented)',
  kind: 'reference',
  position: { latitude: 69.68, longitude: 13 },
  timezone: 'Europe/Oslo',
  datum: 'Chart Datum',
  mean_level: 1.6,
  constituents: { M2: { amplitude: 0.9, phase: 30 }, S2: { amplitude: 0.3, phase: 70 }, K1: { amplitude: 0.05, phase: 140 } },
  provenance: 'Invented for the tests',
};

const sunEvents = (d: DayEntry, type?: string) => d.sky.filter((e) => e.body === 'sun' && (type === undefined || e.type === type));
const doubled = (d: DayEntry) => sunEvents(d, 'rise').length > 1 || sunEvents(d, 'set').length > 1;

let tmp = '';
let model: StationYear;
beforeAll(() => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-sky-print-'));
  model = buildStationYear(station, { byId: new Map([[station.id, station]]) }, 2027);
});
afterAll(() => {
  if (tmp) rmSync(tmp, { recursive: true, force: true });
});

describe('a day with two sunsets or two sunrises', () => {
  it('exists in this year at this latitude (edges of the midnight sun)', () => {
    expect(model.days.filter(doubled).length).toBeGreaterThanOrEqual(1);
  });

  it('the website month page lists every sunrise and sunset of the day in time order', async () => {
    const site = join(tmp, 'site');
    await renderSite([model], site, { units: 'm', quiet: true });
    let checked = 0;
    for (const day of model.days.filter((d) => sunEvents(d).length > 1)) {
      const html = readFileSync(join(site, station.id, '2027', String(day.month).padStart(2, '0'), 'index.html'), 'utf8');
      const row = rowById(html, `day-${day.dayOfMonth}`);
      const sun = textOf(row.slice(row.indexOf('class="col-sun"')));
      const words = sunEvents(day).map((e) => `${e.type === 'rise' ? 'Rise' : 'Set'} ${e.clock}`);
      if (!sunEvents(day, 'rise').length) words.unshift('Rise none');
      if (!sunEvents(day, 'set').length) words.push('Set none');
      expect(sun).toContain(words.join(' '));
      checked++;
    }
    expect(checked).toBeGreaterThan(20);
  });

  it.skipIf(!POPPLER)('the PDF month page prints both times on the line of their kind', async () => {
    const file = join(tmp, 'book.pdf');
    writeFileSync(file, await renderStationBook(model, { units: 'm', page: 'a5' }));
    const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
    for (const day of model.days.filter(doubled)) {
      for (const type of ['rise', 'set']) {
        const clocks = sunEvents(day, type).map((e) => e.clock);
        if (clocks.length > 1) expect(text).toContain(clocks.join(' '));
      }
    }
  });
});
