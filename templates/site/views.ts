// The site's page structure: the grouped index from the station-years' summaries, one entry per
// station-year page and per month page (with their URLs and neighbours). Numbers stay in the models;
// formatting and drawing happen in the filters while each page renders.
import type {
  MonthEntry, OffsetChange, Station, StationYear, TideTypeCode, StreamYear,
} from '../../engine/index.js';
import { extname } from 'node:path';
import type { PublisherPage } from '../pages/types.js';
import { siteOwnPages, type SiteOwnPage } from './own-pages.js';
import { wordsFor, type Units, type Words } from '../locale/index.js';
import { siteIndex, type SiteIndex } from './index-views.js';
import { stationYearPages, stationYearUrl, type StationPageFacts } from './station-pages.js';
import type { StationYearSummary } from './summary.js';
import { indexStreams, streamPages, type IndexStream, type StreamMonthPage, type StreamYearPage } from './stream-views.js';

export interface SiteOptions {
  units: Units;
  title?: string;
  publisher?: string;
  locale?: string;
  caution?: string; // the publisher's own caution, replacing the catalogue's
  stamp?: number; // UTC ms: the date of this edition's outputs
  contact?: string; // who to call: the imprint page
  accent?: string; // #rrggbb (checked for contrast by the build): headings, links and the masthead
  logo?: string; // path of the publisher's logo (SVG, PNG or JPEG, checked by the build): the masthead
  coverImage?: string; // path of the publisher's cover picture (checked by the build): the front page
  pages?: readonly PublisherPage[]; // the publisher's own pages (checked by the build)
}

/** A clock change with the local date of the day it happens on. */
export interface DatedChange {
  date: string;
  change: OffsetChange;
}

export interface IndexYear {
  year: number;
  url: string;
}

export interface IndexStation {
  id: string;
  name: string;
  kind: Station['kind'];
  position: Station['position'];
  timezone: string;
  tideType: TideTypeCode;
  invented: boolean;
  number?: string; // the publisher's station number
  region?: string; // the region it is listed under
  years: IndexYear[];
}

export interface IndexGroup {
  id: string; // the group's anchor on the index
  referenceId: string | null; // null for the group of stream stations that name no tide station
  referenceName: string;
  reference: IndexStation | null; // null when the reference port itself is not in this build
  secondaries: IndexStation[];
  streams: IndexStream[]; // tidal stream stations of the same area
  streamsOnly: boolean; // a group of stream stations that name no tide station
  /** The reference port when it is in this build but listed under another region: its page and region. */
  elsewhere: { url: string; region: string | null } | null;
}

/** One year of the same station (and, on a month page, the same month) in the year switch. */
export interface YearLink {
  year: number;
  url: string;
  current: boolean;
}

export interface PageLink {
  url: string;
  label: string;
  short: string; // the label in a narrow strip (a month's short name)
}

export interface StationYearPage {
  url: string;
  model: StationYear;
  referenceUrl: string | null;
  months: { month: MonthEntry; url: string }[];
  clockChanges: DatedChange[];
  years: YearLink[]; // every year of this station in the build (a switch is shown when there are several)
  downloads: { csv: string; json: string; ics: string; hourly: string; windows: null | { csv: string; json: string } };
}

export interface MonthPage {
  url: string;
  yearUrl: string;
  model: StationYear;
  month: MonthEntry;
  days: StationYear['days'];
  prev: PageLink | null;
  next: PageLink | null;
  siblings: PageLink[]; // every month of the same station-year, for the month strip
  clockChanges: DatedChange[];
  years: YearLink[]; // the same month in every year of this station in the build
}

export interface SiteData {
  title: string;
  publisher: string | null;
  locale: string; // BCP 47 tag of the pages' language (the html lang attribute)
  units: Units;
  downloads: boolean; // false when Eleventy runs on its own and no exports were written
  caution: string;
  anyInvented: boolean;
  provenances: string[];
  generator: string;
  computed: string; // ISO date (YYYY-MM-DD) the predictions are stamped with: the edition's date
  contact: string | null;
  accent: string | null;
  logo: string | null; // site path of the logo, e.g. /assets/logo.svg
  coverImage: string | null; // site path of the cover picture, e.g. /assets/cover.jpg
  ownPages: SiteOwnPage[]; // the publisher's pages, front ones first
  imprint: { epochs: string[]; sources: { name: string; provenance: string }[] };
  groups: IndexGroup[];
  index: SiteIndex; // the groups by region, the A–Z jump list, the map, the search's words
  stationYears: StationYearPage[];
  monthPages: MonthPage[];
  streamYears: StreamYearPage[];
  streamMonthPages: StreamMonthPage[];
  streamCaution: string | null; // present when the build has stream stations
}

const byName = (a: { name: string }, b: { name: string }): number => a.name.localeCompare(b.name, 'en');


/** The index's groups of a set of station-years: each reference port with its secondary ports and streams. */
export function indexGroups(models: readonly StationYearSummary[], streams: readonly StreamYear[], words: Words): IndexGroup[] {
  const stations = new Map<string, IndexStation>();
  const referenceOf = new Map<string, { id: string; name: string } | null>();
  for (const m of models) {
    const st = m.station;
    let entry = stations.get(st.id);
    if (!entry) {
      entry = { id: st.id, name: st.name, kind: st.kind, position: st.position, timezone: m.timezone,
        tideType: m.tideType.kind, invented: m.invented, ...(st.number === undefined ? {} : { number: st.number }),
        ...(st.region === undefined ? {} : { region: st.region }), years: [] };
      stations.set(st.id, entry);
      referenceOf.set(st.id, st.kind === 'secondary' ? (m.reference ?? { id: st.reference, name: st.reference }) : null);
    }
    entry.years.push({ year: m.year, url: stationYearUrl(st.id, m.year) });
  }
  const groups = new Map<string, IndexGroup>();
  for (const entry of stations.values()) {
    entry.years.sort((a, b) => a.year - b.year);
    if (entry.kind === 'reference') {
      const g = groups.get(entry.id);
      if (g) g.reference = entry;
      else groups.set(entry.id, groupOf(entry.id, entry.name, entry));
    }
  }
  for (const entry of stations.values()) {
    const ref = referenceOf.get(entry.id);
    if (!ref) continue;
    let g = groups.get(ref.id);
    if (!g) {
      g = groupOf(ref.id, ref.name, null);
      groups.set(ref.id, g);
    }
    g.secondaries.push(entry);
  }
  const tideGroupOf = (tideId: string): string | null => {
    const key = referenceOf.get(tideId)?.id ?? tideId;
    return groups.has(key) ? key : null;
  };
  let loose: IndexStream[] = [];
  for (const [key, list] of indexStreams(streams, tideGroupOf)) {
    if (key === null) loose = list;
    else groups.get(key)!.streams.push(...list);
  }
  const list = [...groups.values()];
  for (const g of list) g.secondaries.sort(byName);
  list.sort((a, b) => a.referenceName.localeCompare(b.referenceName, 'en'));
  if (loose.length > 0) list.push({ ...groupOf(null, words.t('stream.groupName'), null), streams: loose, streamsOnly: true });
  return list;
}

function groupOf(referenceId: string | null, referenceName: string, reference: IndexStation | null): IndexGroup {
  return { id: referenceId === null ? 'streams' : `port-${referenceId}`, referenceId, referenceName, reference,
    secondaries: [], streams: [], streamsOnly: false, elsewhere: null };
}

/** The words of a site: its language, units and caution. */
export function siteWords(options: SiteOptions): Words {
  return wordsFor({ locale: options.locale, units: options.units, caution: options.caution });
}

/** Where each station's years and built station-years are: the facts each station-year's pages show of the others. */
export function pageFacts(summaries: readonly StationYearSummary[]): (sy: StationYearSummary) => StationPageFacts {
  const built = new Set(summaries.map((m) => stationYearUrl(m.station.id, m.year)));
  const yearsOf = new Map<string, number[]>();
  for (const m of summaries) yearsOf.set(m.station.id, [...(yearsOf.get(m.station.id) ?? []), m.year]);
  return (sy) => ({
    referenceBuilt: sy.reference !== null && built.has(stationYearUrl(sy.reference.id, sy.year)),
    years: [...new Set(yearsOf.get(sy.station.id))].sort((a, b) => a - b),
  });
}

/** Station-years in the site's order: by station id, then year. */
export function siteOrder<T extends StationYearSummary>(summaries: readonly T[]): T[] {
  return [...summaries].sort((a, b) => a.station.id.localeCompare(b.station.id, 'en') || a.year - b.year);
}

/** Everything of the site but its station-year pages (`stationYears` and `monthPages` left empty). */
export function sharedSiteData(summaries: readonly StationYearSummary[], options: SiteOptions, downloads = true, streams: readonly StreamYear[] = []): SiteData {
  const words = siteWords(options);
  const sorted = siteOrder(summaries);
  const seen = new Set<string>();
  for (const m of sorted) {
    const url = stationYearUrl(m.station.id, m.year);
    if (seen.has(url)) throw new Error(`two models for ${m.station.id} ${m.year}: each station-year may appear once`);
    seen.add(url);
  }
  const first = sorted[0];
  const stream = streamPages(streams, words);
  const groups = indexGroups(sorted, streams, words);
  return {
    title: options.title ?? words.t('site.defaultTitle'),
    publisher: options.publisher ?? null,
    locale: words.tag,
    units: options.units,
    downloads,
    caution: words.caution,
    anyInvented: sorted.some((m) => m.invented) || streams.some((m) => m.invented),
    provenances: [...new Set([...sorted, ...streams].map((m) => m.station.provenance))].sort(),
    generator: first ? `${first.generator.name} ${first.generator.version}` : 'tidewright',
    computed: new Date(options.stamp ?? Date.UTC(first?.year ?? 1970, 0, 1)).toISOString().slice(0, 10),
    contact: options.contact ?? null,
    logo: options.logo === undefined ? null : `/assets/logo${(/\.(svg|png|jpe?g)$/i.exec(options.logo)?.[0] ?? '.png').toLowerCase()}`,
    coverImage: options.coverImage === undefined ? null : `/assets/cover${extname(options.coverImage).toLowerCase()}`,
    ownPages: siteOwnPages(options.pages),
    accent: options.accent !== undefined && /^#[0-9a-f]{6}$/i.test(options.accent) ? options.accent : null,
    imprint: {
      epochs: [...new Set(sorted.map((m) => `${m.datums.epoch.from}\u2013${m.datums.epoch.to}`))],
      sources: [...new Map([...sorted, ...streams].map((m) => [m.station.id, { name: m.station.name, provenance: m.station.provenance }])).values()],
    },
    groups,
    index: siteIndex(sorted, streams, words, groups),
    stationYears: [],
    monthPages: [],
    ...stream,
    streamCaution: streams.length > 0 ? words.t('caution.streams') : null,
  };
}

/** The whole site's data, every station-year's pages included (small sets, tests, Eleventy on its own). */
export function buildSiteData(models: StationYear[], options: SiteOptions, downloads = true, streams: readonly StreamYear[] = []): SiteData {
  const site = sharedSiteData(models, options, downloads, streams);
  const facts = pageFacts(models);
  const words = siteWords(options);
  for (const model of siteOrder(models)) {
    const { page, months } = stationYearPages(model, facts(model), words);
    site.stationYears.push(page);
    site.monthPages.push(...months);
  }
  return site;
}
