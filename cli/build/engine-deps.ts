// The real engine and renderers a station job uses (the worker and the in-process path share these).
import { buildStationYear, createSkyEphemeris } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import type { StationJobDeps } from './station-job.js';

// The Sun's and Moon's positions for the build's year, shared by every station this worker (or
// process) computes; it goes with the worker.
const sky = createSkyEphemeris();

export const stationJobDeps: StationJobDeps = {
  buildStationYear: (station, set, year) => buildStationYear(station, set, year, { sky }),
  renderStationBook: (model, options) => renderStationBook(model, options),
};
