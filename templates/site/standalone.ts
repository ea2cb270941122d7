// What templates/_data/site.js returns when Eleventy runs on its own (npx @11ty/eleventy), with no
// models handed over: the demo station set for next calendar year, straight from the engine.
// Downloads are written only by renderSite, so the pages say so instead of linking to them.
import { join } from 'node:path';
import { buildStationYear, createEngineContext, loadStationSet } from '../../engine/index.js';
import { projectRoot } from './paths.js';
import { buildSiteData, type SiteData } from './views.js';

export function standaloneSite(): SiteData {
  const set = loadStationSet(join(projectRoot(), 'stations-demo'));
  const year = new Date().getUTCFullYear() + 1;
  const context = createEngineContext();
  const models = set.stations.map((station) => buildStationYear(station, set, year, { context }));
  return Object.freeze(buildSiteData(models, { units: 'm' }, false));
}
