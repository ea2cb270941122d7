// Shared by the language tests: builds a secondary port of the demo and its reference port in one
// language (website and a station book), and finds English catalogue words in the result. Intl is the
// outside reference for month and weekday names and the decimal separator.
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildStationYear, buildStreamYear, firstOf, itemAt, loadStationSet } from '../../engine/index.js';
import type { StationYear, StreamYear } from '../../engine/index.js';
import { renderStreamBook } from '../../templates/pdf/stream-book.js';
import { CATALOGUES, type Catalogue, type Language } from '../../templates/locale/catalogue.js';
import { wordsFor } from '../../templates/locale/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { renderPocketTable } from '../../templates/pdf/pocket.js';
import { renderSite } from '../../templates/site/render.js';
import { DEMO_DIR, htmlFiles, read } from './site-build.js';

export const POPPLER = existsSync('/usr/bin/pdftotext');

/** A secondary port of the demo and its reference port, for 2027 (whatever the demo's ids are). */
export function demoPair(): StationYear[] {
  const set = loadStationSet(DEMO_DIR);
  const secondary = set.stations.find((s) => s.kind === 'secondary')!;
  if (secondary.kind !== 'secondary') throw new Error('the demo needs a secondary port');
  const reference = set.byId.get(secondary.reference)!;
  return [reference, secondary].map((s) => buildStationYear(s, set, 2027));
}

function words(text: string): string[] {
  return (text.toLowerCase().match(/\p{L}+/gu) ?? []);
}

function catalogueText(c: Catalogue): string {
  return Object.values(c).map((m) => (typeof m === 'string' ? m : Object.values(m).join(' '))).join(' ');
}

/**
 * English words of the catalogue (four letters or more) that the other language does not use itself
 * (many words are shared: "station", "position", "notes") and that station files do not bring in.
 */
export function englishOnlyWords(language: Language, models: readonly { station: { name: string; provenance: string }; timezone: string; reference: { name: string } | null }[]): Set<string> {
  const own = new Set(words(catalogueText(CATALOGUES[language])));
  const stationText = new Set(models.flatMap((m) => words(`${m.station.name} ${m.station.provenance} ${'datum' in m.station ? String(m.station.datum) : ''} `
    + `${m.timezone} ${m.reference?.name ?? ''}`)));
  const technical = new Set(['tidewright', 'icalendar', 'json', 'build', 'greenwich']);
  return new Set(words(catalogueText(CATALOGUES.en))
    .filter((w) => w.length >= 4 && !own.has(w) && !stationText.has(w) && !technical.has(w)));
}

/** A tidal stream station of the demo (the first one), for 2027; null when the demo has none. */
export function demoStream(): StreamYear | null {
  const set = loadStationSet(DEMO_DIR);
  const station = set.streams?.[0];
  return station ? buildStreamYear(station, set, 2027) : null;
}

export interface BuiltLanguage {
  dir: string;
  site: string;
  pages: Map<string, string>; // site-relative path → visible text
  book: string; // pdftotext of the secondary port's book and pocket table and of the stream book ('' without poppler)
  models: StationYear[];
}

/** Visible text of a page: tags dropped, entities decoded, spaces collapsed. */
export function visibleText(html: string): string {
  return html.replace(/<script[\s\S]*?<\/script>/g, ' ').replace(/<[^>]+>/g, ' ')
    .replace(/&nbsp;/g, ' ').replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/\s+/g, ' ');
}

export async function buildIn(locale: string, models: StationYear[], stream: StreamYear | null = null): Promise<BuiltLanguage> {
  const dir = mkdtempSync(join(tmpdir(), `tidewright-${locale}-`));
  const site = join(dir, 'site');
  await renderSite(models, site, { units: 'm', quiet: true, locale, streams: stream ? [stream] : [] });
  const pages = new Map<string, string>();
  for (const file of htmlFiles(site)) pages.set(file.slice(site.length + 1), visibleText(read(site, file.slice(site.length + 1))));
  let book = '';
  if (POPPLER) {
    const pdf = join(dir, 'book.pdf');
    writeFileSync(pdf, await renderStationBook(itemAt(models, 1, 'models'), { units: 'm', page: 'a5', locale }));
    book = execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
    const pocket = join(dir, 'pocket.pdf');
    writeFileSync(pocket, await renderPocketTable(itemAt(models, 1, 'models'), { units: 'm', sheet: 'a4', locale }));
    book += execFileSync('pdftotext', ['-layout', pocket, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
    if (stream) {
      const streamPdf = join(dir, 'stream.pdf');
      writeFileSync(streamPdf, await renderStreamBook(stream, { units: 'm', page: 'a5', locale }));
      book += execFileSync('pdftotext', ['-layout', streamPdf, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
    }
  }
  return { dir, site, pages, book, models };
}

export function cleanUp(built: BuiltLanguage | undefined): void {
  if (built) rmSync(built.dir, { recursive: true, force: true });
}

/** English words found in a text, with a little context for the failure message. */
export function englishIn(text: string, english: Set<string>): string[] {
  const found: string[] = [];
  const re = /\p{L}+/gu;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    if (english.has(m[0].toLowerCase())) found.push(`${m[0]} (…${text.slice(Math.max(0, m.index - 30), m.index + 30)}…)`);
  }
  return found;
}

// Each language builds the same two station-years; the checks read the pages and the book as a reader would.

const intlMonth = (tag: string, month: number): string =>
  new Intl.DateTimeFormat(tag === 'en' ? 'en-GB' : tag, { month: 'long', timeZone: 'UTC' }).format(Date.UTC(2027, month - 1, 15));
const intlDecimal = (tag: string): string =>
  new Intl.NumberFormat(tag === 'en' ? 'en-GB' : tag, { minimumFractionDigits: 2 }).format(1.25).replace(/\d/g, '');

export function publishedIn(languages: Language[]): void {
  const models: StationYear[] = [];
  let stream: StreamYear | null = null;
  beforeAll(() => {
    models.push(...demoPair());
    stream = demoStream();
  }, 60_000);
  describe.each(languages)('published in %s', (language: Language) => {
  let built: BuiltLanguage | undefined;
  beforeAll(async () => {
    built = await buildIn(language, models, stream);
  }, 60_000);
  afterAll(() => cleanUp(built));

  it('has no English word of the catalogue on any page of the website', () => {
    const english = englishOnlyWords(language, [...models, ...(stream ? [stream] : [])]);
    for (const [page, text] of built!.pages) expect(englishIn(text, english), `${language} ${page}`).toEqual([]);
  });

  it.skipIf(!POPPLER)('has no English word of the catalogue in the book', () => {
    const english = englishOnlyWords(language, [...models, ...(stream ? [stream] : [])]);
    expect(englishIn(built!.book, english)).toEqual([]);
  });

  it('names months and weekdays and writes decimals as Intl does for the locale', () => {
    const secondary = itemAt(built!.models, 1, 'models');
    const march = built!.pages.get(`${secondary.station.id}/2027/03/index.html`)!;
    expect(march).toContain(intlMonth(language, 3));
    const weekday = new Intl.DateTimeFormat(language, { weekday: 'short', timeZone: 'UTC' }).format(Date.UTC(2027, 2, 10));
    expect(march).toContain(`${weekday} 10`);
    const separator = intlDecimal(language);
    const day = secondary.days.find((d) => d.date === '2027-03-10')!;
    const e = firstOf(day.events, 'events');
    expect(march).toContain(`${e.clock} ${Math.abs(e.height).toFixed(2).replace('.', separator)}`);
    if (POPPLER) {
      expect(built!.book).toContain(intlMonth(language, 3));
      expect(built!.book).toMatch(new RegExp(`${e.clock}\\s+\\d+\\${separator}\\d\\d`));
    }
  });

  it('prints position, heights, the age of the tide and UTC offsets the same way on the site and in the book', () => {
    const w = wordsFor({ locale: language });
    const m = itemAt(built!.models, 1, 'models');
    const flat = (t: string): string => t.replace(/\u00a0/g, ' ').replace(/\s+/g, ' ');
    const site = flat(built!.pages.get(`${m.station.id}/2027/index.html`)!);
    const same = [w.position(m.station.position), w.hours(m.ageOfTideHours), w.height(m.meanSpringRange),
      w.offset(firstOf(m.days, 'days').offsetStart)].map(flat);
    for (const text of same) expect(site, text).toContain(text);
    if (POPPLER) for (const text of same) expect(flat(built!.book), text).toContain(text);
  });

  it('sets the html lang attribute and translates the caution', async () => {
    const { readFileSync } = await import('node:fs');
    const html = readFileSync(`${built!.site}/index.html`, 'utf8');
    expect(html).toContain(`<html lang="${language}">`);
    expect(built!.pages.get('index.html')).toContain(wordsFor({ locale: language }).caution);
  });
});
}
