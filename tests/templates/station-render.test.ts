// The station-year pages are drawn with Nunjucks directly (templates/site/station-render.ts), from the
// same templates Eleventy draws on its own (their front matter: pagination alias, permalink): every
// page must be the page Eleventy writes from the same data, byte for byte.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import Eleventy from '@11ty/eleventy';
import { afterAll, expect, it } from 'vitest';
import { registerSiteFilters } from '../../templates/site/filters.js';
import { projectRoot } from '../../templates/site/paths.js';
import { HANDOFF_KEY, renderSite } from '../../templates/site/render.js';
import { NUNJUCKS_OPTIONS } from '../../templates/site/station-render.js';
import { buildSiteData, siteWords } from '../../templates/site/views.js';
import { demoModels } from './site-build.js';

const tmp = mkdtempSync(join(tmpdir(), 'tidewright-station-render-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

/** The HTML pages under each station's folder (the station-year, month and hours pages). */
function stationPages(dir: string, ids: readonly string[]): Map<string, string> {
  const files = new Map<string, string>();
  for (const id of ids) {
    for (const entry of readdirSync(join(dir, id), { withFileTypes: true, recursive: true })) {
      if (!entry.isFile() || !entry.name.endsWith('.html')) continue;
      const path = join(entry.parentPath, entry.name);
      files.set(relative(dir, path), readFileSync(path, 'utf8'));
    }
  }
  return files;
}

it('writes every station page exactly as Eleventy draws it from the same templates', async () => {
  const ids = ['brinewold-head', 'saltgrist-cove', 'palmsward-reach'] as const;
  const models = demoModels(ids);
  const options = { units: 'm', quiet: true } as const;
  const direct = join(tmp, 'direct');
  await renderSite(models, direct, options);

  const root = projectRoot();
  const viaEleventy = join(tmp, 'eleventy');
  const site = Object.freeze(buildSiteData(models, options));
  const eleventy = new Eleventy(join(root, 'templates'), viaEleventy, {
    quietMode: true,
    configPath: join(root, '.eleventy.js'),
    config: (config) => {
      config.benchmarks?.config?.setIsVerbose(false);
      registerSiteFilters(config, siteWords(options));
      config.setNunjucksEnvironmentOptions(NUNJUCKS_OPTIONS);
      config.addGlobalData(HANDOFF_KEY, site);
    },
  });
  eleventy.disableLogger();
  await eleventy.write();

  const a = stationPages(viaEleventy, ids);
  const b = stationPages(direct, ids);
  expect(a.size).toBe(3 * (1 + 2 * 12)); // a year page, and a month page and an hours page per month
  expect([...b.keys()].sort()).toEqual([...a.keys()].sort());
  for (const [path, html] of a) expect(b.get(path) === html, path).toBe(true);
});
