// The real pieces of a build: the stations checker, the engine (in workers) and the renderers.
import { availableParallelism } from 'node:os';
import { loadStationSet } from '../../engine/stations.js';
import { renderCombinedBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { checkStations } from '../check.js';
import { combinedBookInWorker } from './combined.js';
import { compiledWorkerUrl, computeStations } from './compute.js';
import { stationJobDeps } from './engine-deps.js';
import type { BuildDeps } from './run.js';

export const realBuildDeps: BuildDeps = {
  // The same verdict as `tidewright check`: schema, references, and suspicious constants.
  checkSet: (dir) => {
    const { problems } = checkStations(dir);
    return problems.length > 0 ? { stations: [], problems } : { stations: loadStationSet(dir).stations, problems };
  },
  computeStations: (request, onStation, signal) => computeStations(request, onStation, stationJobDeps, signal),
  renderSite: (models, siteDir, dataDir, options) => renderSite(models, siteDir, { ...options, dataDir, quiet: true }),
  renderCombinedBook: (models, options, beside, signal) => {
    const workerUrl = beside ? compiledWorkerUrl() : null;
    return workerUrl ? combinedBookInWorker(workerUrl, models, options, signal) : renderCombinedBook(models, options);
  },
  cores: () => availableParallelism(),
};
