// One volume of the combined output of a large set: its own cover, contents and bookmarks, the
// stations' sections (full, or compact for secondary ports), and an imprint. The page counts a
// planner needs to fill volumes come from the same composition, before anything is drawn.
import { firstOf, type StationYear } from '../../engine/index.js';
import { wordsFor } from '../locale/index.js';
import { bookCoverPage } from './book-cover.js';
import { cautionPage } from './caution.js';
import { stationPages } from './compose.js';
import { contentsPageCount, contentsPages } from './contents.js';
import { editionDate } from './document.js';
import { printable } from './format.js';
import { contentBox, pageGeometry } from './geometry.js';
import { imprintPage } from './imprint.js';
import { imprintText, publisherParts } from './publisher.js';
import { rowHeight } from './month-layout.js';
import { notesPage } from './notes.js';
import { checkBookOptions, type BookOptions } from './options.js';
import type { LogicalPage } from './page.js';
import { renderBook } from './render.js';
import { stationView, type StationView } from './station-view.js';
import { compactPages, type WorkedExample } from './worked-example.js';

export interface VolumeStation {
  model: StationYear;
  compact: boolean; // a secondary port printed as its compact section
  worked: WorkedExample | null;
}

export interface VolumeText {
  volume: number; // 1-based
  volumes: number;
  label?: string; // the region (or reference ports) the volume holds
}

export interface VolumeEntry { id: string; page: number }

/** Pages of a station's section starting on an odd and on an even page: [odd, even]. */
export interface SectionPages { full: [number, number]; compact: [number, number] }

function words(options: BookOptions) {
  return wordsFor({ locale: options.locale, units: options.units, caution: options.caution });
}

function sectionOf(view: StationView, station: VolumeStation, first: number, row: number, kicker: string, hourly: boolean | undefined): LogicalPage[] {
  if (station.compact && view.model.station.kind === 'secondary') return compactPages(view, station.worked);
  return stationPages(view, first, row, { kicker }, true, { hourly });
}

export function sectionPageCounts(model: StationYear, options: BookOptions): SectionPages {
  const g = pageGeometry(options.page);
  const view = stationView(model, g, words(options));
  const full = (first: number): number => stationPages(view, first, 10, { kicker: '' }, true, { hourly: options.hourly }).length;
  const compact = model.station.kind === 'secondary' ? 2 : -1;
  return { full: [full(1), full(2)], compact: compact < 0 ? [full(1), full(2)] : [compact, compact] };
}

/** Pages before the first station's section: cover, contents and caution page. */
export function volumeFrontPages(stations: number, options: BookOptions): number {
  const g = pageGeometry(options.page);
  return 1 + contentsPageCount(stations, contentBox(g, 1).height, g.scale) + 1;
}

/** Pages after the last section (the imprint). */
export const VOLUME_BACK_PAGES = 1;

export async function renderVolume(stations: VolumeStation[], options: BookOptions, text: VolumeText): Promise<{ pdf: Buffer; entries: VolumeEntry[] }> {
  checkBookOptions(options);
  if (stations.length === 0) throw new RangeError('a volume needs at least one station');
  const g = pageGeometry(options.page);
  const w = words(options);
  const members = stations.map((station) => ({ station, view: stationView(station.model, g, w) }));
  const views = members.map((m) => m.view);
  const title = printable(options.title ?? w.t('book.defaultTitle'));
  const invented = views.some((v) => v.model.invented);
  const years = [...new Set(views.map((v) => v.model.year))].sort((a, b) => a - b);
  const yearText = years.length === 1 ? String(years[0]) : `${years[0]}\u2013${years[years.length - 1]}`;
  const volumeLine = text.volumes > 1 ? w.t('volume.label', { volume: text.volume, count: text.volumes })
    + (text.label ? ` \u00b7 ${printable(text.label)}` : '') : undefined;
  const own = publisherParts(options, g, invented, 0);
  const cover = bookCoverPage(views, { title, years: yearText, ...(options.publisher !== undefined && { publisher: options.publisher }),
    ...(own.logo && { logo: own.logo }), ...(own.coverImage && { coverImage: own.coverImage }), ...(own.accent && { accent: own.accent }),
    ...(volumeLine !== undefined && { volume: volumeLine }) }, w.caution, invented);
  const fullParts = members.filter(({ station, view }) => !(station.compact && view.model.station.kind === 'secondary')).flatMap(({ view }) => view.parts);
  const row = rowHeight(fullParts, g);
  const contentsCount = contentsPageCount(views.length, contentBox(g, 1).height, g.scale);
  const mixed = views.some((v) => v.southern) && views.some((v) => !v.southern);
  const caution = cautionPage(firstOf(views, 'stations of the volume'), { combined: true, mixedHemispheres: mixed });
  let next = 1 + contentsCount + 1 + 1;
  const sections: LogicalPage[] = [];
  const entries = members.map(({ station, view }) => {
    const kicker = `${w.t(view.model.station.kind === 'secondary' ? 'port.secondary' : 'port.reference')} \u00b7 ${title}`;
    const pages = sectionOf(view, station, next, row, kicker, options.hourly);
    const entry = { view, page: next };
    next += pages.length;
    sections.push(...pages);
    return entry;
  });
  const pages = [cover, ...contentsPages(entries, contentBox(g, 1).height, g.scale, invented, w), caution, ...sections,
    imprintPage(views.map((v) => v.model), w, imprintText(options))];
  const pdf = await renderBook(pages, { units: options.units, geometry: g, title, publisher: options.publisher, words: w, press: options.press, warn: options.warn }, {
    title: volumeLine === undefined ? title : `${title}: ${volumeLine}`,
    author: options.publisher,
    subject: w.t('book.subjectCombined', { count: views.length }) + `${invented ? ` (${w.t('book.inventedSubject')})` : ''}`,
    keywords: w.t('book.keywords'),
    date: options.stamp !== undefined ? new Date(options.stamp) : editionDate(firstOf(years, 'years of the volume')),
    lang: w.tag,
    tagged: options.tagged,
  }, options.imposition ?? 'none', () => notesPage({ invented }));
  return { pdf, entries: entries.map((e) => ({ id: e.view.model.station.id, page: e.page })) };
}
