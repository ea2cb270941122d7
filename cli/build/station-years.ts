// The build's station-years as the main thread keeps them: each one's small summary (for the index,
// the map and the volumes' plan) and its cache key; the model itself is read back from the build
// cache whenever a renderer needs it, and dropped after, so the memory does not grow with the set.
import type { StationYear } from '../../engine/index.js';
import type { StationYearSummary } from '../../templates/site/summary.js';
import { readEntry } from './cache.js';
import type { StationOutcome } from './station-job.js';

/** A station-year's model from its cache entry (checked whole), or an error naming what is missing. */
export function cachedModel(cacheDir: string, id: string, key: string, year?: number): StationYear {
  const json = readEntry(cacheDir, key, ['model.json'])?.files['model.json'];
  const model = json ? JSON.parse(json.toString('utf8')) as StationYear : null;
  if (!model || model.station.id !== id || (year !== undefined && model.year !== year)) {
    throw new Error(`the model of station "${id}" is missing from the build cache ${cacheDir} (was the folder removed during the build?)`);
  }
  return model;
}

export interface StationYears {
  summaries: StationYearSummary[]; // in the order added
  add(outcome: StationOutcome, key: string | undefined): void;
  /** The cache key of a station-year, when it has one. */
  keyOf(id: string, year: number): string | undefined;
  model(stationYear: StationYearSummary): StationYear;
}

export function stationYears(cacheDir: string): StationYears {
  const keys = new Map<string, string>();
  const handed = new Map<string, StationYear>(); // models of station jobs without a cache (stand-ins in tests)
  const summaries: StationYearSummary[] = [];
  const name = (id: string, year: number): string => `${id}/${year}`;
  return {
    summaries,
    add(outcome, key) {
      const { summary } = outcome;
      summaries.push(summary);
      if (key !== undefined) keys.set(name(summary.station.id, summary.year), key);
      if (outcome.model) handed.set(name(summary.station.id, summary.year), outcome.model);
    },
    keyOf: (id, year) => keys.get(name(id, year)),
    model(sy) {
      const id = sy.station.id;
      const own = handed.get(name(id, sy.year));
      if (own) return own;
      const key = keys.get(name(id, sy.year));
      if (key === undefined) throw new Error(`station "${id}" ${sy.year} has neither a model nor a cache entry`);
      return cachedModel(cacheDir, id, key, sy.year);
    },
  };
}
