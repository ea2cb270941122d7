// One station-year's pages (its year page and its month pages) from its model and the few facts of
// the rest of the build its pages show: whether its reference port's page for the same year is built
// (a link, else the name alone) and which years of the same station are built (the year switch).
// Built one station-year at a time, so only the models being drawn are ever in memory.
import type { StationYear } from '../../engine/index.js';
import { exportFileNames } from '../exports/write.js';
import type { Words } from '../locale/index.js';
import type { DatedChange, MonthPage, SiteData, StationYearPage, YearLink } from './views.js';

export const stationYearUrl = (id: string, year: number): string => `/${id}/${year}/`;

/** What a station-year's pages show of the other station-years of the build. */
export interface StationPageFacts {
  referenceBuilt: boolean; // the reference port's page of the same year is in this build
  years: number[]; // every year of this station in the build, in order
}

function clockChangesOf(days: StationYear['days']): DatedChange[] {
  return days.flatMap((d) => (d.offsetChange ? [{ date: d.date, change: d.offsetChange }] : []));
}

function monthPagesOf(model: StationYear, yearUrl: string, words: Words): MonthPage[] {
  const pages: MonthPage[] = model.months.map((month) => {
    const days = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
    const clockChanges = clockChangesOf(days);
    return { url: `${yearUrl}${month.slug}/`, yearUrl, model, month, days, prev: null, next: null, siblings: [], clockChanges, years: [] };
  });
  const label = (p: MonthPage): string => words.monthName(p.month.month);
  const siblings = pages.map((p) => ({ url: p.url, label: label(p), short: words.monthShort(p.month.month) }));
  pages.forEach((p, i) => {
    p.siblings = siblings;
    const prev = pages[i - 1];
    const next = pages[i + 1];
    if (prev) p.prev = { url: prev.url, label: label(prev), short: words.monthShort(prev.month.month) };
    if (next) p.next = { url: next.url, label: label(next), short: words.monthShort(next.month.month) };
  });
  return pages;
}

export function stationYearPages(model: StationYear, facts: StationPageFacts, words: Words): { page: StationYearPage; months: MonthPage[] } {
  const names = exportFileNames(model); // also checks the id is safe for a file name and a URL
  const url = stationYearUrl(model.station.id, model.year);
  const months = monthPagesOf(model, url, words);
  const yearLinks = (suffix: string): YearLink[] => facts.years.map((year) =>
    ({ year, url: `${stationYearUrl(model.station.id, year)}${suffix}`, current: year === model.year }));
  for (const p of months) p.years = yearLinks(`${p.month.slug}/`);
  const ref = model.reference;
  const page: StationYearPage = {
    url, model,
    referenceUrl: ref && facts.referenceBuilt ? stationYearUrl(ref.id, model.year) : null,
    months: months.map((p) => ({ month: p.month, url: p.url })),
    clockChanges: clockChangesOf(model.days),
    years: yearLinks(''),
    downloads: {
      csv: `/data/${names.csv}`, json: `/data/${names.json}`, ics: `/data/${names.ics}`, hourly: `/data/${names.hourly}`,
      windows: names.windows ? { csv: `/data/${names.windows.csv}`, json: `/data/${names.windows.json}` } : null,
    },
  };
  return { page, months };
}

/**
 * What every station-year page shows of the site as a whole, from the built-in templates: the
 * masthead (title, publisher, logo, accent, the publisher's pages' titles and links), the footer
 * (caution, generator, the edition's date, contact) and the language and units of its words. Not the
 * index, the map or the other stations: the station pages override the footer's provenance lines.
 */
export function stationPageChrome(site: SiteData): unknown {
  return {
    title: site.title, publisher: site.publisher, locale: site.locale, units: site.units, downloads: site.downloads,
    caution: site.caution, generator: site.generator, computed: site.computed, contact: site.contact, accent: site.accent,
    logo: site.logo, ownPages: site.ownPages.map((p) => ({ url: p.url, title: p.title, place: p.place })),
  };
}
