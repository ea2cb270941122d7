// The real engine and renderers a station job uses (the worker and the in-process path share these).
import { buildStationYear } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { renderPocketTable } from '../../templates/pdf/pocket.js';
import { sectionPageCounts } from '../../templates/pdf/volume.js';
import type { StationJobDeps } from './station-job.js';

export const stationJobDeps: StationJobDeps = {
  buildStationYear: (station, set, year, context) => buildStationYear(station, set, year, { context }),
  renderStationBook: (model, options, warn) => renderStationBook(model, warn === undefined ? options : { ...options, warn }),
  renderPocketTable: (model, options, warn) => renderPocketTable(model, {
    ...options, ...(warn && { warn }), sheet: options.page === 'letter' || options.page === 'half-letter' ? 'letter' : 'a4',
  }),
  sectionPages: (model, options) => sectionPageCounts(model, options),
};
