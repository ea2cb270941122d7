// The combined book in a worker thread of its own, so it is drawn while the main thread renders the
// website (both need every model; neither needs the other).
import { Worker } from 'node:worker_threads';
import type { StationYear, StreamYear } from '../../engine/index.js';
import type { ImageWarningSink } from '../../templates/pdf/image-resolution.js';
import { BuildStepError, deserializeError } from './failure.js';
import { workerExecArgv } from './pool.js';
import type { RenderChoices } from './options.js';
import type { CombinedSetup, FromWorker, ToWorker } from './protocol.js';
import { stopWorker, trackWorker } from './threads.js';

export function combinedBookInWorker(workerUrl: URL, models: StationYear[], render: RenderChoices, signal?: AbortSignal, streams: StreamYear[] = [],
  warn?: ImageWarningSink): Promise<Buffer> {
  if (signal?.aborted) return Promise.reject(new BuildStepError('rendering the combined book', signal.reason ?? new Error('stopped')));
  const setup: CombinedSetup = { job: 'combined', render };
  const worker = new Worker(workerUrl, { workerData: setup, execArgv: workerExecArgv() });
  const exited = trackWorker(signal, worker);
  return new Promise<Buffer>((resolve, reject) => {
    let result: Buffer | null = null;
    let settled = false;
    const finish = (error: Error | null): void => {
      if (settled) return;
      settled = true;
      signal?.removeEventListener('abort', onAbort);
      // The book is finished (or dropped) by the worker itself before it exits.
      if (error) void stopWorker(worker, exited).finally(() => reject(error));
      else resolve(result!);
    };
    const onAbort = (): void => finish(new BuildStepError('rendering the combined book', signal?.reason ?? new Error('stopped')));
    signal?.addEventListener('abort', onAbort, { once: true });
    worker.on('message', (message: FromWorker) => {
      if (message.type === 'combined-done') {
        result = Buffer.from(message.pdf.buffer, message.pdf.byteOffset, message.pdf.byteLength);
        for (const w of message.imageWarnings) warn?.(w);
      }
      else if (message.type === 'failed') finish(new BuildStepError('rendering the combined book', deserializeError(message.error)));
    });
    worker.on('error', (error) => finish(new BuildStepError('rendering the combined book', error)));
    worker.on('exit', (code) => {
      if (result && code === 0) finish(null);
      else finish(new BuildStepError('rendering the combined book', new Error(`its worker stopped with exit code ${code}`)));
    });
    const message: ToWorker = { type: 'combined', models, streams };
    worker.postMessage(message);
  });
}
