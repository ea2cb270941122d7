// Messages between the build and its worker threads. Everything is plain data (structured clone).
import type { StationYear, StreamYear } from '../../engine/index.js';
import type { SerializedError } from './failure.js';
import type { RenderChoices } from './options.js';
import type { StationOutcome } from './station-job.js';

/** What a station worker is started with (`workerData`): it loads the station set itself. */
export interface WorkerSetup {
  job?: 'stations';
  stationsDir: string;
  year: number;
  tempDir: string;
  render: RenderChoices;
}

/** A worker that draws the combined book while the main thread renders the website. */
export interface CombinedSetup {
  job: 'combined';
  render: RenderChoices;
}

export type ToWorker =
  | { type: 'unit'; ids: string[] }
  | { type: 'close' }
<<<<<<< HEAD
  | { type: 'combined'; models: StationYear[]; streams?: StreamYear[] };
=======
  | { type: 'stop' } // finish the current station or book, send nothing more, exit
  | { type: 'combined'; models: StationYear[] };
>>>>>>> 59233c6 (Ctrl-C stops the build's worker threads cooperatively (each finishes its station or book, then exits; terminated only after a grace period) before the temporary folder goes; Ctrl-C is answered from the launcher's first line and a signal caught during start-up is no longer lost; an interrupt test over a small set and a 50-moment stress script)

export type FromWorker =
  | { type: 'ready' }
  | { type: 'station'; outcome: StationOutcome }
  | { type: 'unit-done' }
  | { type: 'combined-done'; pdf: Uint8Array }
  | { type: 'failed'; id: string | null; error: SerializedError };
