// Computing the stations: in worker threads when running compiled (dist/), in this thread when the
// TypeScript sources run directly (under vitest there is no worker.js to start).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createSkyEphemeris, loadStationSet } from '../../engine/index.js';
import { BuildStepError } from './failure.js';
import { runPool } from './pool.js';
import type { ComputeRequest } from './run.js';
import { runStationJob, unitEngine, type StationJobDeps, type StationOutcome } from './station-job.js';

/** The compiled worker entry beside this module, or null when this module is not compiled. */
export function compiledWorkerUrl(): URL | null {
  if (!import.meta.url.endsWith('.js')) return null;
  const url = new URL('./worker.js', import.meta.url);
  return existsSync(fileURLToPath(url)) ? url : null;
}

/** The same work as the workers do, one station after another in this thread. */
export async function computeInProcess(
  request: ComputeRequest, onStation: (outcome: StationOutcome) => void, deps: StationJobDeps, signal?: AbortSignal,
): Promise<void> {
  const ctx = { set: loadStationSet(request.stationsDir), year: request.year, tempDir: request.tempDir, render: request.render, ...(request.cache && { cache: request.cache }) };
  const sky = createSkyEphemeris();
  for (const ids of request.units) {
    const unit = { ...ctx, engine: unitEngine(sky) };
    for (const id of ids) {
      signal?.throwIfAborted();
      try {
        onStation(await runStationJob(id, unit, deps));
      } catch (error) {
        throw new BuildStepError(`station ${id}`, error);
      }
    }
  }
}

export async function computeStations(
  request: ComputeRequest, onStation: (outcome: StationOutcome) => void, deps: StationJobDeps, signal?: AbortSignal,
): Promise<void> {
  const workerUrl = compiledWorkerUrl();
  if (!workerUrl) return computeInProcess(request, onStation, deps, signal);
  const setup = { stationsDir: request.stationsDir, year: request.year, tempDir: request.tempDir, render: request.render, ...(request.cache && { cache: request.cache }) };
  return runPool({ workerUrl, setup, size: request.workers, units: request.units, onStation, ...(signal && { signal }) });
}
