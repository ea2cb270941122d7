// renderSite: the website of a set of station-years, written by Eleventy 3 into outDir. The models and
// filters are handed to Eleventy here (templates/_data/site.js returns the handoff), and every
// station-year's downloads are written inside the site (outDir/data/) so the site is whole wherever it
// is uploaded; with `dataDir` the same files are also placed there (hard links where the disk allows).
import { copyFile, link, mkdir, rm } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import Eleventy from '@11ty/eleventy';
import type { StationYear } from '../../engine/types.js';
import { writeExports } from '../exports/write.js';
import { registerSiteFilters } from './filters.js';
import { projectRoot } from './paths.js';
import { buildSiteData, type SiteOptions } from './views.js';

export interface RenderSiteOptions extends SiteOptions {
  quiet?: boolean;
  dataDir?: string; // also place the downloads here (e.g. out/data beside out/site)
}

/** The global-data name under which renderSite hands the site to templates/_data/site.js. */
export const HANDOFF_KEY = 'tidewrightSite';

async function linkOrCopy(from: string, to: string): Promise<void> {
  await rm(to, { force: true });
  try {
    await link(from, to);
  } catch {
    await copyFile(from, to); // another file system, or links not allowed
  }
}

export async function renderSite(models: StationYear[], outDir: string, options: RenderSiteOptions): Promise<void> {
  const root = projectRoot();
  const out = resolve(outDir);
  // Frozen so Eleventy passes it by reference instead of deep-copying every model into every page.
  const site = Object.freeze(buildSiteData(models, options, true));
  const eleventy = new Eleventy(join(root, 'templates'), out, {
    quietMode: true, // no line per written file; the caller reports progress
    configPath: join(root, '.eleventy.js'),
    config: (config) => {
      // Eleventy times every filter and warns on stderr when one takes a large share; drawing the
      // curves always does, by design, so the warning only adds noise to the build's output.
      config.benchmarks?.config?.setIsVerbose(false);
      registerSiteFilters(config, options.units);
      config.addGlobalData(HANDOFF_KEY, site);
    },
  });
  if (options.quiet) eleventy.disableLogger();
  await eleventy.write();

  const siteData = join(out, 'data');
  await mkdir(siteData, { recursive: true });
  for (const model of models) {
    const names = await writeExports(model, siteData, { units: options.units });
    if (options.dataDir) {
      await mkdir(options.dataDir, { recursive: true });
      for (const name of [names.csv, names.json, names.ics]) {
        await linkOrCopy(join(siteData, name), join(options.dataDir, name));
      }
    }
  }
}
