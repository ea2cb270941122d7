// Print-ready PDF tide books: one per station-year, and one combined book for a station set.
import { readFileSync } from 'node:fs';
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import type { StreamYear } from '../../engine/index.js';
import { combinedPages, stationPages } from './compose.js';
import { bookOrder } from './contents.js';
import { editionDate } from './document.js';
import { printable } from './format.js';
import { pageGeometry } from './geometry.js';
import { imprintPage, type ImprintText } from './imprint.js';
import { rowHeight } from './month-layout.js';
import { notesPage } from './notes.js';
import type { BookOptions } from './options.js';
import { checkBookOptions } from './options.js';
import type { BookSettings } from './page.js';
import { renderBook } from './render.js';
import { stationView } from './station-view.js';
import { streamBookPages } from './stream-book.js';

export type { BookOptions } from './options.js';
export { saddleStitchOrder } from './imposition.js';

function bookWords(options: BookOptions): Words {
  return wordsFor({ locale: options.locale, units: options.units, caution: options.caution });
}

export async function renderStationBook(model: StationYear, options: BookOptions): Promise<Buffer> {
  checkBookOptions(options);
  const g = pageGeometry(options.page);
  const words = bookWords(options);
  const view = stationView(model, g, words);
  const title = printable(options.title ?? words.t('book.defaultTitle'));
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher, words, press: options.press };
  const logo = rasterLogo(options.logo);
  const pages = stationPages(view, 1, rowHeight(view.parts, g),
    { kicker: title, publisher: options.publisher, ...(logo && { logo }) }, false, { hourly: options.hourly }, imprintText(options));
  return renderBook(pages, settings, {
    title: `${view.name}: ${title} ${model.year}`,
    author: options.publisher,
    subject: words.t('book.subject', { station: view.name, year: model.year })
      + `${model.invented ? ` (${words.t('book.inventedSubject')})` : ''}`,
    keywords: words.t('book.keywords'),
    date: options.stamp !== undefined ? new Date(options.stamp) : editionDate(model.year),
    lang: words.tag,
    tagged: options.tagged,
  }, options.imposition ?? 'none', () => notesPage({ invented: model.invented, label: view.name }));
}

/** The logo's bytes when pdfkit can draw it (PNG, JPEG); an SVG logo appears on the site only. */
function rasterLogo(path: string | undefined): Buffer | undefined {
  if (path === undefined || !/\.(png|jpe?g)$/i.test(path)) return undefined;
  return readFileSync(path);
}

function imprintText(options: BookOptions): ImprintText {
  return { publisher: options.publisher, contact: options.contact, stamp: options.stamp };
}

/** The whole set's book; the stream stations' pages (if any) follow the tide stations'. */
export async function renderCombinedBook(models: StationYear[], options: BookOptions, streams: readonly StreamYear[] = []): Promise<Buffer> {
  checkBookOptions(options);
  if (models.length === 0) throw new RangeError('a combined book needs at least one station');
  const g = pageGeometry(options.page);
  const words = bookWords(options);
  const views = bookOrder(models).map((m) => stationView(m, g, words));
  const title = printable(options.title ?? words.t('book.defaultTitle'));
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher, words, press: options.press };
  const row = rowHeight(views.flatMap((v) => v.parts), g);
  const logo = rasterLogo(options.logo);
  const pages = [...combinedPages(views, g, row, { title, publisher: options.publisher, hourly: options.hourly, ...(logo && { logo }) }),
    ...streams.flatMap((m) => streamBookPages(m, title, words)),
    imprintPage(views.map((v) => v.model), words, imprintText(options))];
  const invented = models.some((m) => m.invented) || streams.some((m) => m.invented);
  const year = Math.min(...models.map((m) => m.year));
  return renderBook(pages, settings, {
    title,
    author: options.publisher,
    subject: words.t('book.subjectCombined', { count: models.length })
      + `${invented ? ` (${words.t('book.inventedSubject')})` : ''}`,
    keywords: words.t('book.keywords'),
    date: options.stamp !== undefined ? new Date(options.stamp) : editionDate(year),
    lang: words.tag,
    tagged: options.tagged,
  }, options.imposition ?? 'none', () => notesPage({ invented }));
}
