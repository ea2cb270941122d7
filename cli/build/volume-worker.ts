// The volume side of the worker thread: draws the volumes it is handed one at a time, from the models
// in the build cache, and reports each volume's contents entries back for the index volume.
import type { MessagePort } from 'node:worker_threads';
import { renderVolume } from '../../templates/pdf/volume.js';
import { serializeError } from './failure.js';
import type { FromWorker, ToWorker, VolumeSetup } from './protocol.js';
import { countPdfPages } from './station-job.js';
import { runVolumeJob, type VolumeJobDeps } from './volume-job.js';

export const volumeJobDeps: VolumeJobDeps = { renderVolume, countPages: countPdfPages };

export function volumeWorker(port: MessagePort, init: VolumeSetup): void {
  const post = (message: FromWorker): void => port.postMessage(message);
  let busy = false;
  let stopping = false;
  port.on('message', (message: ToWorker) => {
    if (message.type === 'stop') stopping = true;
    if (message.type !== 'volume') {
      if (!busy) port.close();
      return;
    }
    busy = true;
    void (async () => {
      try {
        const result = await runVolumeJob(message.job, init.cacheDir, init.render, volumeJobDeps);
        if (!stopping) post({ type: 'volume-done', result });
      } catch (error) {
        if (!stopping) post({ type: 'failed', id: null, error: serializeError(error) });
      }
      busy = false;
      if (stopping) port.close();
    })();
  });
  post({ type: 'ready' });
}
