// Worker thread entry (compiled to dist/cli/build/worker.js). A station worker loads the station set
// once, then computes the stations it is handed, one unit at a time, posting each outcome back.
// A combined-book worker draws the whole set's book from the models it is sent.
import { parentPort, workerData } from 'node:worker_threads';
import { createSkyEphemeris, loadStationSet } from '../../engine/index.js';
import { renderCombinedBook } from '../../templates/pdf/book.js';
import { worstPerFile, type ImageWarning } from '../../templates/pdf/image-resolution.js';
import { serializeError } from './failure.js';
import type { CombinedSetup, FromWorker, ToWorker, VolumeSetup, WorkerSetup } from './protocol.js';
import { volumeWorker } from './volume-worker.js';
import { stationJobDeps } from './engine-deps.js';
import { runStationJob, unitEngine, type StationJobContext } from './station-job.js';

const port = parentPort;
if (!port) throw new Error('cli/build/worker.js runs only as a worker thread');
const setup = workerData as WorkerSetup | CombinedSetup | VolumeSetup;
const post = (message: FromWorker, transfer: ArrayBuffer[] = []): void => port.postMessage(message, transfer);

function stationWorker(init: WorkerSetup): void {
  let ctx: Omit<StationJobContext, 'engine'> | undefined;
  const sky = createSkyEphemeris(); // the Sun's and Moon's positions, shared by every unit of this worker
  try {
    ctx = { set: loadStationSet(init.stationsDir), year: init.year, tempDir: init.tempDir, render: init.render, ...(init.cache && { cache: init.cache }) };
    post({ type: 'ready' });
  } catch (error) {
    post({ type: 'failed', id: null, error: serializeError(error) });
  }
  // Asked to stop, the worker finishes the station it is on (its PDF written whole), then exits.
  let busy = false;
  let stopping = false;
  port!.on('message', (message: ToWorker) => {
    if (message.type === 'stop') stopping = true;
    if (message.type !== 'unit' || !ctx) {
      if (!busy) port!.close();
      return;
    }
    busy = true;
    void (async () => {
      let current: string | null = null;
      try {
        const unit = { ...ctx, engine: unitEngine(sky) };
        for (const id of message.ids) {
          if (stopping) break;
          current = id;
          const outcome = await runStationJob(id, unit, stationJobDeps);
          if (!stopping) post({ type: 'station', outcome });
        }
        if (!stopping) post({ type: 'unit-done' });
      } catch (error) {
        if (!stopping) post({ type: 'failed', id: current, error: serializeError(error) });
      }
      busy = false;
      if (stopping) port!.close();
    })();
  });
}

function combinedWorker(init: CombinedSetup): void {
  port!.once('message', (message: ToWorker) => {
    if (message.type !== 'combined') {
      port!.close();
      return;
    }
    void (async () => {
      try {
        const warnings: ImageWarning[] = [];
        const pdf = await renderCombinedBook(message.models, { ...init.render, warn: (w) => warnings.push(w) }, message.streams ?? []);
        // Handed over, not copied: the book can be tens of megabytes.
        const bytes = new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
        const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
        post({ type: 'combined-done', pdf: own, imageWarnings: worstPerFile(warnings) }, [own.buffer as ArrayBuffer]);
      } catch (error) {
        post({ type: 'failed', id: null, error: serializeError(error) });
      }
      port!.close();
    })();
  });
}

if (setup.job === 'combined') combinedWorker(setup);
else if (setup.job === 'volumes') volumeWorker(port, setup);
else stationWorker(setup);
