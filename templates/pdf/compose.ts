// Lays out books as lists of logical pages: the order of the parts, and a notes page where a month
// that fills two pages would otherwise start on a right-hand page and not face itself.
import { firstOf, lastOf } from '../../engine/index.js';
import { bookCoverPage } from './book-cover.js';
import { cautionPage } from './caution.js';
import { contentsPageCount, contentsPages } from './contents.js';
import type { CoverText, GuideEntry } from './cover.js';
import { coverPage } from './cover.js';
import { factsPage } from './facts.js';
import { imprintPage, type ImprintText } from './imprint.js';
import { contentBox } from './geometry.js';
import type { PageGeometry } from './geometry.js';
import { hoursPage, windowsPage } from './after-month.js';
import { monthPage } from './month-page.js';
import { notesPage } from './notes.js';
import { overviewPage } from './overview.js';
import type { LogicalPage } from './page.js';
import type { StationView } from './station-view.js';
import type { Picture } from './picture.js';

/** Where the parts and the months of a station's pages start, for its cover. */
function guide(pages: LogicalPage[], firstNumber: number): NonNullable<CoverText['guide']> {
  const parts: GuideEntry[] = [];
  const months: GuideEntry[] = [];
  pages.forEach((p, i) => {
    if (!p.outline || p.kind === 'section' || p.kind === 'cover') return;
    const entry = { label: p.outline.title, page: firstNumber + i };
    if (p.kind === 'month') months.push({ ...entry, label: entry.label.replace(/ \d+$/, '') }); else parts.push(entry);
  });
  return { parts, months };
}

/** What follows each month besides its own pages: its hourly heights (a project's `hourly: true`). */
export interface AfterMonth { hourly?: boolean }

/** The publisher's own pages before the tide tables and after them. */
export interface OwnPlaces { front: LogicalPage[]; back: LogicalPage[] }

const NO_OWN: OwnPlaces = { front: [], back: [] };

/** The pages of one station, the first of which will be page `firstNumber`. */
export function stationPages(view: StationView, firstNumber: number, row: number, cover: CoverText,
  section: boolean, after: AfterMonth = {}, imprint: ImprintText = {}, own: OwnPlaces = NO_OWN): LogicalPage[] {
  const pages: LogicalPage[] = [coverPage(view, cover, section ? 'section' : 'cover'), factsPage(view)];
  if (!section) pages.push(cautionPage(view), ...own.front);
  for (const part of view.parts) {
    const next = firstNumber + pages.length;
    if (part.partIndex === 0 && part.partCount % 2 === 0 && next % 2 === 1) {
      pages.push(notesPage({ invented: view.model.invented, label: view.name }));
    }
    pages.push(monthPage(view, part, row));
    if (part.partIndex === part.partCount - 1) {
      if (view.model.windows.length > 0) pages.push(windowsPage(view, part.month));
      if (after.hourly) pages.push(hoursPage(view, part.month));
    }
  }
  pages.push(overviewPage(view));
  if (!section) pages.push(...own.back, imprintPage([view.model], view.words, imprint, view.name));
  cover.guide = guide(pages, firstNumber);
  return pages;
}

export interface CombinedText { title: string; publisher?: string; hourly?: boolean; logo?: Picture; coverImage?: Picture; accent?: string }

/** The combined book up to the last station's pages; the caller adds what follows (streams, back pages, imprint). */
export function combinedPages(views: StationView[], g: PageGeometry, row: number, text: CombinedText, front: LogicalPage[] = []): LogicalPage[] {
  const invented = views.some((v) => v.model.invented);
  const lead = firstOf(views, 'stations of the combined book');
  const years = [...new Set(views.map((v) => v.model.year))].sort((a, b) => a - b);
  const [firstYear, lastYear] = [firstOf(years, 'years'), lastOf(years, 'years')];
  const yearText = firstYear === lastYear ? String(firstYear) : `${firstYear}\u2013${lastYear}`;
  const cover: LogicalPage[] = [bookCoverPage(views, { ...text, years: yearText }, lead.words.caution, invented)];
  const contentsCount = contentsPageCount(views.length, contentBox(g, 1).height, g.scale);
  const mixed = views.some((v) => v.southern) && views.some((v) => !v.southern);
  const caution = cautionPage(lead, { combined: true, mixedHemispheres: mixed });
  let next = 1 + contentsCount + 2 + front.length; // after the cover, the contents, the caution page and the publisher's front pages
  const sections: LogicalPage[] = [];
  const entries = views.map((view) => {
    const kicker = view.words.t(view.model.station.kind === 'secondary' ? 'port.secondary' : 'port.reference');
    const pages = stationPages(view, next, row, { kicker: `${kicker} \u00b7 ${text.title}` }, true, { hourly: text.hourly });
    const entry = { view, page: next };
    next += pages.length;
    sections.push(...pages);
    return entry;
  });
  return [...cover, ...contentsPages(entries, contentBox(g, 1).height, g.scale, invented, lead.words), caution, ...front, ...sections];
}
