// renderSite: the website of a set of station-years, written by Eleventy 3 into outDir. The models and
// filters are handed to Eleventy here (templates/_data/site.js returns the handoff), and every
// station-year's downloads are written inside the site (outDir/data/), once, so the site is whole
// wherever it is uploaded as one folder and its links reach them.
//
// Eleventy keeps every page it renders in memory until its run ends (about 5 MiB per station-year),
// so the pages are written in several runs into the same folder: one per batch of station-years (their
// year and month pages only) and one for the shared pages (index, datums, assets). Every run sees the
// same site-wide facts, so the pages are the same as from one run; the memory no longer grows with
// the number of stations beyond the models themselves.
import { copyFile, cp, mkdir, mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import Eleventy from '@11ty/eleventy';
import type { StationYear, StreamYear } from '../../engine/index.js';
import { writeStreamExports } from '../exports/streams.js';
import { writeExports } from '../exports/write.js';
import { registerSiteFilters } from './filters.js';
import { projectRoot } from './paths.js';
import { buildSiteData, siteWords, type MonthPage, type SiteData, type SiteOptions, type StationYearPage } from './views.js';

export interface RenderSiteOptions extends SiteOptions {
  quiet?: boolean;
  /** Station-years per Eleventy run (default STATION_YEARS_PER_RUN); bounds the renderer's memory. */
  stationYearsPerRun?: number;
  /** A publisher's own files (e.g. CNAME), copied into the site as they are; none may replace a page of the site. */
  siteFiles?: string;
  /** The stream-years of the build's tidal stream stations (pages written with the shared pages). */
  streams?: readonly StreamYear[];
  /** A publisher's `site/` folder: its files take the place of the built-in templates and CSS of the same path. */
  siteTheme?: string;
}

/** The global-data name under which renderSite hands the site to templates/_data/site.js. */
export const HANDOFF_KEY = 'tidewrightSite';

/** 25 station-years ≈ 130 MiB of Eleventy's page content; more per run saves little time. */
export const STATION_YEARS_PER_RUN = 25;

// Which templates each kind of run leaves out.
const SHARED_PAGES = ['index.njk', 'datums.njk', 'imprint.njk', 'stream-year.njk', 'stream-month.njk', 'own-page.njk'];
const STATION_PAGES = ['station-year.njk', 'month.njk', 'hours.njk'];

/** Tidewright's site templates with the publisher's `site/` files laid over them, in a temporary folder. */
async function layeredTemplates(root: string, theme: string): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'tidewright-site-'));
  const builtIn = join(root, 'templates');
  // only what Eleventy reads: the page templates, the includes, the data file and the assets
  for (const entry of await readdir(builtIn, { withFileTypes: true })) {
    if (entry.isFile() ? entry.name.endsWith('.njk') : ['_includes', '_data', 'assets'].includes(entry.name)) {
      await cp(join(builtIn, entry.name), join(dir, entry.name), { recursive: true });
    }
  }
  await cp(theme, dir, { recursive: true, force: true });
  return dir;
}

/** One Eleventy run over `site`, leaving out the templates named in `skip`. */
async function runEleventy(root: string, input: string, out: string, site: SiteData, skip: string[], options: RenderSiteOptions, copy?: string): Promise<void> {
  // Frozen so Eleventy passes it by reference instead of deep-copying every model into every page.
  const handoff = Object.freeze(site);
  const eleventy = new Eleventy(input, out, {
    quietMode: true, // no line per written file; the caller reports progress
    configPath: join(root, '.eleventy.js'),
    config: (config) => {
      // Eleventy times every filter and warns on stderr when one takes a large share; drawing the
      // curves always does, by design, so the warning only adds noise to the build's output.
      config.benchmarks?.config?.setIsVerbose(false);
      registerSiteFilters(config, siteWords(options));
      for (const name of skip) config.ignores.add(join(input, name));
      config.addPassthroughCopy({ [join(input, 'assets')]: 'assets' });
      if (copy) config.addPassthroughCopy({ [copy]: '/' });
      config.addGlobalData(HANDOFF_KEY, handoff);
    },
  });
  if (options.quiet) eleventy.disableLogger();
  await eleventy.write();
}

/** The station-year pages in runs of at most `size`, each with its own month pages (same order as in `site`). */
function batches(site: SiteData, size: number): { stationYears: StationYearPage[]; monthPages: MonthPage[] }[] {
  const list: { stationYears: StationYearPage[]; monthPages: MonthPage[] }[] = [];
  let month = 0;
  for (let i = 0; i < site.stationYears.length; i += size) {
    const stationYears = site.stationYears.slice(i, i + size);
    const count = stationYears.reduce((n, sy) => n + sy.months.length, 0);
    list.push({ stationYears, monthPages: site.monthPages.slice(month, month + count) });
    month += count;
  }
  return list;
}

export async function renderSite(models: StationYear[], outDir: string, options: RenderSiteOptions): Promise<void> {
  const root = projectRoot();
  const out = resolve(outDir);
  const size = options.stationYearsPerRun ?? STATION_YEARS_PER_RUN;
  if (!Number.isInteger(size) || size < 1) throw new RangeError(`stationYearsPerRun must be a whole number from 1, not ${size}`);
  const site = buildSiteData(models, options, true, options.streams ?? []);
  const layered = options.siteTheme === undefined ? null : await layeredTemplates(root, options.siteTheme);
  const input = layered ?? join(root, 'templates');
  try {
    for (const batch of batches(site, size)) await runEleventy(root, input, out, { ...site, ...batch }, SHARED_PAGES, options);
    await runEleventy(root, input, out, { ...site, stationYears: [], monthPages: [] }, STATION_PAGES, options, options.siteFiles);
  } finally {
    if (layered !== null) await rm(layered, { recursive: true, force: true });
  }

  if (options.logo !== undefined && site.logo !== null) await copyFile(options.logo, join(out, site.logo.slice(1)));
  if (options.coverImage !== undefined && site.coverImage !== null) await copyFile(options.coverImage, join(out, site.coverImage.slice(1)));
  for (const own of site.ownPages) {
    for (const file of own.files) await copyFile(file.from, join(out, own.url.slice(1), file.name));
  }

  const siteData = join(out, 'data');
  await mkdir(siteData, { recursive: true });
  for (const model of models) await writeExports(model, siteData, siteWords(options), options.stamp);
  for (const model of options.streams ?? []) await writeStreamExports(model, siteData, siteWords(options), options.stamp);
}
