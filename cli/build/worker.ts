// Worker thread entry (compiled to dist/cli/build/worker.js): loads the station set once, then
// computes the stations it is handed, one unit at a time, and posts each outcome back.
import { parentPort, workerData } from 'node:worker_threads';
import { loadStationSet } from '../../engine/stations.js';
import { serializeError } from './failure.js';
import type { FromWorker, ToWorker, WorkerSetup } from './protocol.js';
import { stationJobDeps } from './engine-deps.js';
import { runStationJob, type StationJobContext } from './station-job.js';

const port = parentPort;
if (!port) throw new Error('cli/build/worker.js runs only as a worker thread');
const setup = workerData as WorkerSetup;
const post = (message: FromWorker): void => port.postMessage(message);

let ctx: StationJobContext | undefined;
try {
  ctx = { set: loadStationSet(setup.stationsDir), year: setup.year, tempDir: setup.tempDir, render: setup.render };
  post({ type: 'ready' });
} catch (error) {
  post({ type: 'failed', id: null, error: serializeError(error) });
}

port.on('message', (message: ToWorker) => {
  if (message.type === 'close' || !ctx) {
    port.close();
    return;
  }
  void (async () => {
    let current: string | null = null;
    try {
      for (const id of message.ids) {
        current = id;
        post({ type: 'station', outcome: await runStationJob(id, ctx, stationJobDeps) });
      }
      post({ type: 'unit-done' });
    } catch (error) {
      post({ type: 'failed', id: current, error: serializeError(error) });
    }
  })();
});
