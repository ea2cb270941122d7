// Stopping worker threads cooperatively. A worker is asked to stop ({type: 'stop'}) and finishes what
// it is drawing (a PDF stream is never cut off mid-write, which could bring the process down from
// native code), then exits on its own; only one that has not exited after the grace period is
// terminated. Every worker started for a build is tracked by the build's AbortSignal, so Ctrl-C can
// wait until all of them are gone before the temporary folder is removed and the process exits.
import type { Worker } from 'node:worker_threads';
import type { ToWorker } from './protocol.js';

/** How long a worker may take to finish its current station or book once asked to stop. */
export const STOP_GRACE_MS = 30_000;

const exits = new WeakMap<AbortSignal, Set<Promise<void>>>();

/** Resolves when the worker has exited (for whatever reason). */
export function exitOf(worker: Worker): Promise<void> {
  return new Promise((resolve) => {
    if (worker.threadId === -1) resolve();
    else worker.once('exit', () => resolve());
  });
}

/** Records a worker of the build that `signal` belongs to. */
export function trackWorker(signal: AbortSignal | undefined, worker: Worker): Promise<void> {
  const exited = exitOf(worker);
  if (signal) {
    const set = exits.get(signal) ?? new Set();
    exits.set(signal, set);
    set.add(exited);
    void exited.then(() => set.delete(exited));
  }
  return exited;
}

/** Resolves once every worker tracked under `signal` has exited. */
export async function workersExited(signal: AbortSignal): Promise<void> {
  for (let set = exits.get(signal); set && set.size > 0; set = exits.get(signal)) await Promise.all([...set]);
}

/** Asks the worker to stop and waits for it to exit; terminates it after `graceMs`. */
export async function stopWorker(worker: Worker, exited: Promise<void>, graceMs: number = STOP_GRACE_MS): Promise<void> {
  const stop: ToWorker = { type: 'stop' };
  try {
    worker.postMessage(stop);
  } catch {
    // already gone
  }
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<'late'>((resolve) => { timer = setTimeout(() => resolve('late'), graceMs); });
  const outcome = await Promise.race([exited, late]);
  clearTimeout(timer);
  if (outcome === 'late') await worker.terminate();
}
