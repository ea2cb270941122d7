// Messages between the build and its worker threads. Everything is plain data (structured clone).
import type { SerializedError } from './failure.js';
import type { RenderChoices } from './options.js';
import type { StationOutcome } from './station-job.js';

/** What every worker is started with (`workerData`): it loads the station set itself. */
export interface WorkerSetup {
  stationsDir: string;
  year: number;
  tempDir: string;
  render: RenderChoices;
}

export type ToWorker = { type: 'unit'; ids: string[] } | { type: 'close' };

export type FromWorker =
  | { type: 'ready' }
  | { type: 'station'; outcome: StationOutcome }
  | { type: 'unit-done' }
  | { type: 'failed'; id: string | null; error: SerializedError };
