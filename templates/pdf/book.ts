// Print-ready PDF tide books: one per station-year, and one combined book for a station set.
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import type { StreamYear } from '../../engine/index.js';
import { combinedPages, stationPages } from './compose.js';
import type { CoverText } from './cover.js';
import { bookOrder } from './contents.js';
import { editionDate } from './document.js';
import { printable } from './format.js';
import { pageGeometry } from './geometry.js';
import { imprintPage } from './imprint.js';
import { imprintText, publisherParts } from './publisher.js';
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
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher, words, press: options.press, warn: options.warn };
  const own = publisherParts(options, g, model.invented, 1);
  const pages = stationPages(view, 1, rowHeight(view.parts, g), { kicker: title, publisher: options.publisher, ...coverParts(own) },
    false, { hourly: options.hourly }, imprintText(options), own.own);
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

function coverParts(own: ReturnType<typeof publisherParts>): Pick<CoverText, 'logo' | 'coverImage' | 'accent'> {
  return { ...(own.logo && { logo: own.logo }), ...(own.coverImage && { coverImage: own.coverImage }), ...(own.accent && { accent: own.accent }) };
}

/** The whole set's book; the stream stations' pages (if any) follow the tide stations'. */
export async function renderCombinedBook(models: StationYear[], options: BookOptions, streams: readonly StreamYear[] = []): Promise<Buffer> {
  checkBookOptions(options);
  if (models.length === 0) throw new RangeError('a combined book needs at least one station');
  const g = pageGeometry(options.page);
  const words = bookWords(options);
  const views = bookOrder(models).map((m) => stationView(m, g, words));
  const title = printable(options.title ?? words.t('book.defaultTitle'));
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher, words, press: options.press, warn: options.warn };
  const row = rowHeight(views.flatMap((v) => v.parts), g);
  const invented = models.some((m) => m.invented) || streams.some((m) => m.invented);
  const own = publisherParts(options, g, invented, 0);
  const pages = [...combinedPages(views, g, row, { title, publisher: options.publisher, hourly: options.hourly, ...coverParts(own) }, own.own.front),
    ...streams.flatMap((m) => streamBookPages(m, title, words)),
    ...own.own.back,
    imprintPage([...views.map((v) => v.model), ...streams], words, imprintText(options))];
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
