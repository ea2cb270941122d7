// The site's pages for tidal stream stations, built once from their StreamYear models: a page per
// stream-year and one per month, with their URLs and neighbours. Stream stations are listed in the
// index with the tide stations of their area: the group of their tide_reference (or of their
// reference stream station's tide_reference); the others form a group of their own.
import type { MonthEntry, StreamYear } from '../../engine/index.js';
import type { Words } from '../locale/index.js';
import { streamExportFileNames } from '../exports/streams.js';
import type { DatedChange, IndexYear, PageLink, YearLink } from './views.js';

export interface StreamYearPage {
  url: string;
  model: StreamYear;
  referenceUrl: string | null; // a stream-secondary station's reference stream station, when in this build
  months: { month: MonthEntry; url: string }[];
  years: YearLink[]; // every year of this station in the build (a switch is shown when there are several)
  downloads: { csv: string; json: string; ics: string };
}

export interface StreamMonthPage {
  url: string;
  yearUrl: string;
  model: StreamYear;
  month: MonthEntry;
  days: StreamYear['days'];
  prev: PageLink | null;
  next: PageLink | null;
  siblings: PageLink[];
  clockChanges: DatedChange[];
  years: YearLink[]; // the same month in every year of this station in the build
}

export interface IndexStream {
  id: string;
  name: string;
  kind: 'stream' | 'stream-secondary';
  position: { latitude: number; longitude: number };
  timezone: string;
  floodDirection: number;
  referenceName: string | null; // a stream-secondary station's reference stream station
  invented: boolean;
  region?: string; // the region it is listed under
  years: IndexYear[];
}

export const streamYearUrl = (id: string, year: number): string => `/${id}/${year}/`;

function monthPagesOf(model: StreamYear, yearUrl: string, words: Words): StreamMonthPage[] {
  const pages: StreamMonthPage[] = model.months.map((month) => {
    const days = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
    const clockChanges = days.flatMap((d) => (d.offsetChange ? [{ date: d.date, change: d.offsetChange }] : []));
    return { url: `${yearUrl}${month.slug}/`, yearUrl, model, month, days, prev: null, next: null, siblings: [], clockChanges, years: [] };
  });
  const link = (p: StreamMonthPage): PageLink => ({ url: p.url, label: words.monthName(p.month.month), short: words.monthShort(p.month.month) });
  const siblings = pages.map(link);
  pages.forEach((p, i) => {
    p.siblings = siblings;
    const before = pages[i - 1], after = pages[i + 1];
    if (before) p.prev = link(before);
    if (after) p.next = link(after);
  });
  return pages;
}

export function streamPages(models: readonly StreamYear[], words: Words): { streamYears: StreamYearPage[]; streamMonthPages: StreamMonthPage[] } {
  const sorted = [...models].sort((a, b) => a.station.id.localeCompare(b.station.id, 'en') || a.year - b.year);
  const built = new Set(sorted.map((m) => streamYearUrl(m.station.id, m.year)));
  const streamYears: StreamYearPage[] = [];
  const streamMonthPages: StreamMonthPage[] = [];
  const yearsOf = new Map<string, number[]>();
  for (const m of sorted) yearsOf.set(m.station.id, [...new Set([...(yearsOf.get(m.station.id) ?? []), m.year])]);
  for (const model of sorted) {
    const url = streamYearUrl(model.station.id, model.year);
    const names = streamExportFileNames(model);
    const months = monthPagesOf(model, url, words);
    const yearLinks = (suffix: string): YearLink[] => (yearsOf.get(model.station.id) ?? []).map((year) =>
      ({ year, url: `${streamYearUrl(model.station.id, year)}${suffix}`, current: year === model.year }));
    for (const p of months) p.years = yearLinks(`${p.month.slug}/`);
    const ref = model.reference;
    streamYears.push({
      url, model,
      referenceUrl: ref && built.has(streamYearUrl(ref.id, model.year)) ? streamYearUrl(ref.id, model.year) : null,
      months: months.map((p) => ({ month: p.month, url: p.url })),
      years: yearLinks(''),
      downloads: { csv: `/data/${names.csv}`, json: `/data/${names.json}`, ics: `/data/${names.ics}` },
    });
    streamMonthPages.push(...months);
  }
  return { streamYears, streamMonthPages };
}

/**
 * The index entries of the stream stations, keyed by the id of the reference port whose group they
 * join (`tideGroupOf` maps a tide station's id to its group's reference id); null: a group of their own.
 */
export function indexStreams(models: readonly StreamYear[], tideGroupOf: (tideId: string) => string | null): Map<string | null, IndexStream[]> {
  const entries = new Map<string, { entry: IndexStream; tide: string | null }>();
  const tideOf = new Map<string, string | null>(models.map((m) => [m.station.id, m.tideReference?.id ?? null]));
  for (const m of models) {
    const st = m.station;
    let found = entries.get(st.id);
    if (!found) {
      const ownTide = m.tideReference?.id ?? (m.reference ? tideOf.get(m.reference.id) ?? null : null);
      found = {
        entry: {
          id: st.id, name: st.name, kind: st.kind, position: st.position, timezone: m.timezone, floodDirection: m.floodDirection,
          referenceName: m.reference?.name ?? null, invented: m.invented,
          ...(st.region === undefined ? {} : { region: st.region }), years: [],
        },
        tide: ownTide,
      };
      entries.set(st.id, found);
    }
    found.entry.years.push({ year: m.year, url: streamYearUrl(st.id, m.year) });
  }
  const groups = new Map<string | null, IndexStream[]>();
  for (const { entry, tide } of entries.values()) {
    entry.years.sort((a, b) => a.year - b.year);
    const key = tide === null ? null : tideGroupOf(tide);
    const list = groups.get(key) ?? [];
    list.push(entry);
    groups.set(key, list);
  }
  for (const list of groups.values()) list.sort((a, b) => a.name.localeCompare(b.name, 'en'));
  return groups;
}
