// A small pool of worker threads fed with units of work (lists of station ids), one unit at a time
// per worker, so a fast worker takes more. Results arrive in any order; the caller files them by id.
import { Worker } from 'node:worker_threads';
import { BuildStepError, deserializeError } from './failure.js';
import type { FromWorker, ToWorker, WorkerSetup } from './protocol.js';
import type { StationOutcome } from './station-job.js';
import { stopWorker, trackWorker } from './threads.js';

export interface PoolRun {
  workerUrl: URL;
  setup: WorkerSetup;
  size: number;
  units: readonly string[][];
  onStation(outcome: StationOutcome): void;
  signal?: AbortSignal;
  stopGraceMs?: number; // default STOP_GRACE_MS
}

/** Node options for the workers: this process's, less those that only make sense for a main script. */
export function workerExecArgv(argv: readonly string[] = process.execArgv): string[] {
  const out: string[] = [];
  let value = -1; // the index of the value of a dropped option
  for (const [i, arg] of argv.entries()) {
    if (i === value) continue;
    const name = arg.replace(/=.*$/s, '');
    if (['-e', '--eval', '-p', '--print', '--input-type'].includes(name)) {
      if (!arg.includes('=')) value = i + 1; // its value is the next word
    } else if (!['--test', '--watch', '--check', '-c', '-i', '--interactive'].includes(name)) {
      out.push(arg);
    }
  }
  return out;
}

export function runPool(run: PoolRun): Promise<void> {
  const queue = [...run.units];
  const workers: { worker: Worker; exited: Promise<void> }[] = [];
  return new Promise<void>((resolve, reject) => {
    let settled = false;
    let open = 0;
    const fail = (error: Error): void => {
      if (settled) return;
      settled = true;
      run.signal?.removeEventListener('abort', onAbort);
      // Each worker finishes the station it is on, then exits; its files go with the temporary folder.
      Promise.all(workers.map((w) => stopWorker(w.worker, w.exited, run.stopGraceMs))).finally(() => reject(error));
    };
    const onAbort = (): void => fail(new BuildStepError('computing the stations', run.signal?.reason ?? new Error('stopped')));
    run.signal?.addEventListener('abort', onAbort, { once: true });

    const feed = (worker: Worker): void => {
      const ids = queue.shift();
      const message: ToWorker = ids ? { type: 'unit', ids } : { type: 'close' };
      worker.postMessage(message);
    };

    const size = Math.max(1, Math.min(run.size, run.units.length));
    if (run.units.length === 0) {
      resolve();
      return;
    }
    if (run.signal?.aborted) {
      settled = true;
      reject(new BuildStepError('computing the stations', run.signal.reason ?? new Error('stopped')));
      return;
    }
    for (let i = 0; i < size; i++) {
      const worker = new Worker(run.workerUrl, { workerData: run.setup, execArgv: workerExecArgv() });
      workers.push({ worker, exited: trackWorker(run.signal, worker) });
      open++;
      worker.on('message', (message: FromWorker) => {
        if (settled) return;
        switch (message.type) {
          case 'ready':
          case 'unit-done':
            feed(worker);
            break;
          case 'station':
            run.onStation(message.outcome);
            break;
          case 'failed': {
            const step = message.id === null ? 'starting a worker' : `station ${message.id}`;
            fail(new BuildStepError(step, deserializeError(message.error)));
            break;
          }
        }
      });
      worker.on('error', (error) => fail(new BuildStepError('a worker thread', error)));
      worker.on('exit', (code) => {
        open--;
        if (settled) return;
        if (code !== 0) fail(new BuildStepError('a worker thread', new Error(`stopped with exit code ${code}`)));
        else if (open === 0 && queue.length > 0) fail(new BuildStepError('a worker thread', new Error('stopped before the work was done')));
        else if (open === 0) {
          settled = true;
          run.signal?.removeEventListener('abort', onAbort);
          resolve();
        }
      });
    }
  });
}
