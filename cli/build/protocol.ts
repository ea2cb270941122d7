// Messages between the build and its worker threads. Everything is plain data (structured clone).
import type { StationYear, StreamYear } from '../../engine/index.js';
import type { ImageWarning } from '../../templates/pdf/image-resolution.js';
import type { SerializedError } from './failure.js';
import type { RenderChoices } from './options.js';
import type { StationCache, StationOutcome } from './station-job.js';
import type { VolumeJob, VolumeResult } from './volume-job.js';

/** What a station worker is started with (`workerData`): it loads the station set itself. */
export interface WorkerSetup {
  job?: 'stations';
  stationsDir: string;
  year: number;
  tempDir: string;
  render: RenderChoices;
  cache?: StationCache;
}

/** A worker that draws the combined book while the main thread renders the website. */
export interface CombinedSetup {
  job: 'combined';
  render: RenderChoices;
}

/** A worker that draws combined volumes from the models in the build cache, one volume at a time. */
export interface VolumeSetup {
  job: 'volumes';
  cacheDir: string;
  render: RenderChoices;
}

export type ToWorker =
  | { type: 'unit'; ids: string[] }
  | { type: 'close' }
  | { type: 'stop' } // finish the current station or book, send nothing more, exit
  | { type: 'combined'; models: StationYear[]; streams?: StreamYear[] }
  | { type: 'volume'; job: VolumeJob };

export type FromWorker =
  | { type: 'ready' }
  | { type: 'station'; outcome: StationOutcome }
  | { type: 'unit-done' }
  | { type: 'combined-done'; pdf: Uint8Array; imageWarnings: ImageWarning[] } // one per picture
  | { type: 'volume-done'; result: VolumeResult }
  | { type: 'failed'; id: string | null; error: SerializedError };
