// renderSite: the website of a set of station-years, written by Eleventy 3 into outDir. The site's
// structure and filters are handed to Eleventy here (templates/_data/site.js returns the handoff), and
// every station-year's downloads are written inside the site (outDir/data/), once, so the site is
// whole wherever it is uploaded as one folder and its links reach them.
//
// Memory stays flat however many stations there are: the shared pages (index, map, imprint) are drawn
// by one Eleventy run from the station-years' small summaries, and each station-year's model is read
// (from the build cache, by the caller's `model`) only when its own pages are drawn, one station-year
// at a time, with Nunjucks directly (station-render.ts: templates compiled once per build). A
// station-year whose pages were kept from an earlier build under the same facts is copied instead.
import { createHash } from 'node:crypto';
import { copyFile, cp, mkdir, mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, relative, resolve } from 'node:path';
import Eleventy from '@11ty/eleventy';
import type { StationYear, StreamYear } from '../../engine/index.js';
import { writeStreamExports } from '../exports/streams.js';
import { writeExports } from '../exports/write.js';
import { registerSiteFilters } from './filters.js';
import { projectRoot } from './paths.js';
import { stationPageRenderer, NUNJUCKS_OPTIONS } from './station-render.js';
import { stationPageChrome, stationYearPages, stationYearUrl, type StationPageFacts } from './station-pages.js';
import type { StationYearSummary } from './summary.js';
import { pageFacts, sharedSiteData, siteOrder, siteWords, type SiteData, type SiteOptions } from './views.js';

export interface RenderSiteOptions extends SiteOptions {
  quiet?: boolean;
  /** A publisher's own files (e.g. CNAME), copied into the site as they are; none may replace a page of the site. */
  siteFiles?: string;
  /** The stream-years of the build's tidal stream stations (pages written with the shared pages). */
  streams?: readonly StreamYear[];
  /** A publisher's `site/` folder: its files take the place of the built-in templates and CSS of the same path. */
  siteTheme?: string;
}

/** The global-data name under which renderSite hands the site to templates/_data/site.js. */
export const HANDOFF_KEY = 'tidewrightSite';

// Drawn by stationPageRenderer, so left out of the Eleventy run.
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
      config.setNunjucksEnvironmentOptions(NUNJUCKS_OPTIONS);
      for (const name of skip) config.ignores.add(join(input, name));
      config.addPassthroughCopy({ [join(input, 'assets')]: 'assets' });
      if (copy) config.addPassthroughCopy({ [copy]: '/' });
      config.addGlobalData(HANDOFF_KEY, handoff);
    },
  });
  if (options.quiet) eleventy.disableLogger();
  await eleventy.write();
}

/** The station-years of a site: their summaries, and each one's model when its pages are drawn. */
export interface SiteSource {
  stationYears: readonly StationYearSummary[];
  model(stationYear: StationYearSummary): StationYear | Promise<StationYear>;
  /** Pages and downloads of station-years kept from earlier builds (the build cache). */
  pages?: StationPageStore;
}

/** What a station-year's pages depend on beyond its own model and the site's options. */
export interface StationPageKey {
  shared: string; // digest of what every station page shows of the site as a whole
  page: StationPageFacts;
}

export interface StationPageStore {
  /** Writes the station-year's kept files into the site folder; false when none are kept under `key`. */
  restore(stationYear: StationYearSummary, key: StationPageKey, siteDir: string): Promise<boolean>;
  /** Keeps the station-year's files (paths relative to the site folder, just written) under `key`. */
  store(stationYear: StationYearSummary, key: StationPageKey, files: readonly string[], siteDir: string): Promise<void>;
}

/**
 * Digest of what the station pages show of the site as a whole. A publisher's own templates may show
 * anything handed to them (the index, every station's name…), so then it is all of it.
 */
function sharedDigest(site: SiteData, themed: boolean): string {
  const view = themed ? { ...site, stationYears: [], monthPages: [] } : stationPageChrome(site);
  return createHash('sha256').update(JSON.stringify(view)).digest('hex');
}

/** Every file under a folder, as paths relative to `root`. */
async function filesUnder(root: string, dir: string): Promise<string[]> {
  const files: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) files.push(relative(root, join(entry.parentPath, entry.name)).split('\\').join('/'));
  }
  return files.sort();
}

export async function renderSite(models: StationYear[], outDir: string, options: RenderSiteOptions): Promise<void> {
  return renderSiteFrom({ stationYears: models, model: (sy) => sy as StationYear }, outDir, options);
}

export async function renderSiteFrom(source: SiteSource, outDir: string, options: RenderSiteOptions): Promise<void> {
  const root = projectRoot();
  const out = resolve(outDir);
  const words = siteWords(options);
  const site = sharedSiteData(source.stationYears, options, true, options.streams ?? []);
  const facts = pageFacts(source.stationYears);
  const shared = source.pages ? sharedDigest(site, options.siteTheme !== undefined) : '';
  const keyOf = (sy: StationYearSummary): StationPageKey => ({ shared, page: facts(sy) });
  const siteData = join(out, 'data');
  await mkdir(siteData, { recursive: true });
  const toDraw: StationYearSummary[] = [];
  for (const sy of siteOrder(source.stationYears)) {
    if (!source.pages || !await source.pages.restore(sy, keyOf(sy), out)) toDraw.push(sy);
  }
  const layered = options.siteTheme === undefined ? null : await layeredTemplates(root, options.siteTheme);
  const input = layered ?? join(root, 'templates');
  try {
    const stationPages = stationPageRenderer(input, site, words);
    for (const sy of toDraw) {
      const model = await source.model(sy);
      const { page, months } = stationYearPages(model, facts(model), words);
      await stationPages.write(page, months, out);
      const names = await writeExports(model, siteData, words, options.stamp);
      if (!source.pages) continue;
      const exports = [names.csv, names.json, names.ics, names.hourly, ...(names.windows ? [names.windows.csv, names.windows.json] : [])];
      const files = [...await filesUnder(out, join(out, stationYearUrl(model.station.id, model.year))), ...exports.map((n) => `data/${n}`)];
      await source.pages.store(model, keyOf(model), files, out);
    }
    await runEleventy(root, input, out, site, STATION_PAGES, options, options.siteFiles);
  } finally {
    if (layered !== null) await rm(layered, { recursive: true, force: true });
  }

  if (options.logo !== undefined && site.logo !== null) await copyFile(options.logo, join(out, site.logo.slice(1)));
  if (options.coverImage !== undefined && site.coverImage !== null) await copyFile(options.coverImage, join(out, site.coverImage.slice(1)));
  for (const own of site.ownPages) {
    for (const file of own.files) await copyFile(file.from, join(out, own.url.slice(1), file.name));
  }
  for (const model of options.streams ?? []) await writeStreamExports(model, siteData, words, options.stamp);
}
