// Print-ready PDF tide books: one per station-year, and one combined book for a station set.
import type { StationYear } from '../../engine/types.js';
import { combinedPages, stationPages } from './compose.js';
import { bookOrder } from './contents.js';
import { editionDate } from './document.js';
import { printable } from './format.js';
import { pageGeometry } from './geometry.js';
import { rowHeight } from './month-layout.js';
import { notesPage } from './notes.js';
import type { BookOptions } from './options.js';
import { checkBookOptions } from './options.js';
import type { BookSettings } from './page.js';
import { renderBook } from './render.js';
import { stationView } from './station-view.js';

export type { BookOptions } from './options.js';
export { saddleStitchOrder } from './imposition.js';

/** The words of the book are English; a locale only refines that (en-GB, en-US), never replaces it. */
function pdfLanguage(locale: string | undefined): string {
  return locale && /^en(-[A-Za-z0-9]+)*$/.test(locale) ? locale : 'en';
}

export async function renderStationBook(model: StationYear, options: BookOptions): Promise<Buffer> {
  checkBookOptions(options);
  const g = pageGeometry(options.page);
  const view = stationView(model, g);
  const title = printable(options.title ?? 'Tide predictions');
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher };
  const pages = stationPages(view, 1, rowHeight(view.parts, g), { kicker: title, publisher: options.publisher }, false);
  return renderBook(pages, settings, {
    title: `${view.name}: ${title} ${model.year}`,
    author: options.publisher,
    subject: `High and low waters, moon, sun, springs and neaps for ${view.name} in ${model.year}`
      + `${model.invented ? ' (invented demonstration data)' : ''}`,
    keywords: 'tide predictions, high water, low water, chart datum',
    date: editionDate(model.year),
    lang: pdfLanguage(options.locale),
  }, options.imposition ?? 'none', () => notesPage({ invented: model.invented, label: view.name }));
}

export async function renderCombinedBook(models: StationYear[], options: BookOptions): Promise<Buffer> {
  checkBookOptions(options);
  if (models.length === 0) throw new RangeError('a combined book needs at least one station');
  const g = pageGeometry(options.page);
  const views = bookOrder(models).map((m) => stationView(m, g));
  const title = printable(options.title ?? 'Tide predictions');
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher };
  const row = rowHeight(views.flatMap((v) => v.parts), g);
  const pages = combinedPages(views, g, row, { title, publisher: options.publisher });
  const invented = models.some((m) => m.invented);
  const year = Math.min(...models.map((m) => m.year));
  return renderBook(pages, settings, {
    title,
    author: options.publisher,
    subject: `Tide predictions for ${models.length} stations${invented ? ' (invented demonstration data)' : ''}`,
    keywords: 'tide predictions, high water, low water, chart datum',
    date: editionDate(year),
    lang: pdfLanguage(options.locale),
  }, options.imposition ?? 'none', () => notesPage({ invented }));
}
