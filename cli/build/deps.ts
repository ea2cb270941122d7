// The real pieces of a build: the stations checker, the engine (in workers) and the renderers.
// The renderers load only when needed, so a build refused for bad input answers at once.
import { availableParallelism } from 'node:os';
import { createEngineContext, loadStationSet, buildStreamYear } from '../../engine/index.js';
import { checkStations } from '../check.js';
import { combinedBookInWorker } from './combined.js';
import { compiledWorkerUrl, computeStations } from './compute.js';
import type { BuildDeps } from './run.js';

export const realBuildDeps: BuildDeps = {
  // The same verdict as `tidewright check`: schema, references, and suspicious constants.
  checkSet: (dir) => {
    const { problems, notes } = checkStations(dir);
    if (problems.length > 0) return { stations: [], problems, notes };
    const set = loadStationSet(dir);
    return { stations: set.stations, streams: set.streams ?? [], problems, notes };
  },
  computeStreams: (stations, streams, year) => {
    const set = { byId: new Map(stations.map((s) => [s.id, s])), streams };
    const context = createEngineContext(); // shared by the stream-years of this build, dropped after
    return streams.map((s) => buildStreamYear(s, set, year, 30, context));
  },
  computeStations: async (request, onStation, signal) => {
    const { stationJobDeps } = await import('./engine-deps.js');
    return computeStations(request, onStation, stationJobDeps, signal);
  },
  renderSite: async (source, siteDir, options, siteFiles, streams) => {
    const { renderSiteFrom } = await import('../../templates/site/render.js');
    return renderSiteFrom(source, siteDir, { ...options, quiet: true, ...(siteFiles !== undefined && { siteFiles }), ...(streams && { streams }) });
  },
  renderCombinedBook: (models, options, beside, signal, streams, warn) => {
    const workerUrl = beside ? compiledWorkerUrl() : null;
    if (workerUrl) return combinedBookInWorker(workerUrl, models, options, signal, streams, warn);
    return import('../../templates/pdf/book.js').then(({ renderCombinedBook }) => renderCombinedBook(models, { ...options, ...(warn && { warn }) }, streams));
  },
  renderStreamBook: (model, options, warn) => import('../../templates/pdf/stream-book.js')
    .then(({ renderStreamBook }) => renderStreamBook(model, { ...options, ...(warn && { warn }) })),
  cores: () => availableParallelism(),
};
