// The worker pool with a small stand-in worker (written here, speaking the build's message protocol):
// every unit handed out once, results from both threads, failures and aborts stop everything.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { StationFileError } from '../../engine/index.js';
import { BuildStepError, deserializeError, serializeError } from '../../cli/build/failure.js';
import { runPool, workerExecArgv, type PoolRun } from '../../cli/build/pool.js';
import type { StationOutcome } from '../../cli/build/station-job.js';

const root = mkdtempSync(join(tmpdir(), 'tw-build-pool-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const workerFile = join(root, 'toy-worker.mjs');
writeFileSync(workerFile, `
import { parentPort, threadId, workerData } from 'node:worker_threads';
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
parentPort.on('message', async (m) => {
  if (m.type === 'close') { parentPort.close(); return; }
  if (m.type === 'stop') { if (workerData.deaf) return; process.exit(0); }
  for (const id of m.ids) {
    if (id === 'bad') {
      parentPort.postMessage({ type: 'failed', id, error: { name: 'StationFileError', message: 'x',
        fields: { file: 'bad.yaml', field: 'timezone', problem: 'is unknown', fix: 'write Europe/Lisbon' } } });
      return;
    }
    if (id === 'crash') throw new Error('worker fell over');
    if (id === 'slow') await sleep(60_000);
    await sleep(id.length * 3);
    parentPort.postMessage({ type: 'station', outcome: { id, model: { thread: threadId, year: workerData.year }, pdfPages: 1 } });
  }
  parentPort.postMessage({ type: 'unit-done' });
});
parentPort.postMessage({ type: 'ready' });
`);

function run(units: string[][], size: number, extra: Partial<PoolRun> = {}): { outcomes: StationOutcome[]; done: Promise<void> } {
  const outcomes: StationOutcome[] = [];
  const done = runPool({
    workerUrl: pathToFileURL(workerFile),
    setup: { stationsDir: root, year: 2027, tempDir: root, render: { units: 'm', page: 'a5', imposition: 'none' } },
    size, units, onStation: (o) => outcomes.push(o), ...extra,
  });
  return { outcomes, done };
}

describe('runPool', () => {
  it('hands every unit out once and uses every worker', async () => {
    const units = Array.from({ length: 12 }, (_, i) => [`s${i}`, `s${i}-x`]);
    const { outcomes, done } = run(units, 2);
    await done;
    expect(outcomes.map((o) => o.id).sort()).toEqual(units.flat().sort());
    const threads = new Set(outcomes.map((o) => (o.model as unknown as { thread: number }).thread));
    expect(threads.size).toBe(2);
    expect(outcomes.every((o) => (o.model as unknown as { year: number }).year === 2027)).toBe(true);
  });

  it('never starts more workers than there are units', async () => {
    const { outcomes, done } = run([['only']], 4);
    await done;
    expect(outcomes.map((o) => o.id)).toEqual(['only']);
  });

  it('turns a station failure in a worker into a build step error of the same class', async () => {
    const { done } = run([['a'], ['bad'], ['slow']], 2);
    const error = await done.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(BuildStepError);
    expect((error as BuildStepError).step).toBe('station bad');
    expect((error as BuildStepError).cause).toBeInstanceOf(StationFileError);
    expect((error as BuildStepError).message).toBe('station bad: bad.yaml: timezone: is unknown; write Europe/Lisbon');
  });

  it('reports a worker that crashed', async () => {
    const { done } = run([['crash'], ['slow']], 2);
    await expect(done).rejects.toThrow(/a worker thread: worker fell over/);
  });

  it('stops all workers when aborted', async () => {
    const abort = new AbortController();
    const { done } = run([['slow'], ['slow']], 2, { signal: abort.signal });
    setTimeout(() => abort.abort(new Error('interrupted by SIGINT')), 100);
    const started = Date.now();
    await expect(done).rejects.toThrow(/interrupted by SIGINT/);
    expect(Date.now() - started).toBeLessThan(10_000);
  });

  it('waits for a worker to finish what it is doing when stopped, and terminates one that does not listen', async () => {
    const abort = new AbortController();
    const setup = { stationsDir: root, year: 2027, tempDir: root, render: { units: 'm', page: 'a5', imposition: 'none' } } as const;
    const { done } = run([['slow']], 1, { signal: abort.signal, setup: { ...setup, deaf: true } as typeof setup, stopGraceMs: 300 });
    setTimeout(() => abort.abort(new Error('interrupted by SIGINT')), 100);
    const started = Date.now();
    await expect(done).rejects.toThrow(/interrupted by SIGINT/);
    expect(Date.now() - started).toBeGreaterThanOrEqual(250); // it was given the grace period
    expect(Date.now() - started).toBeLessThan(10_000);
  });
});

describe('workerExecArgv', () => {
  it('keeps Node options and drops those only a main script may have', () => {
    expect(workerExecArgv(['--input-type=module', '-e', 'await run()', '--max-old-space-size=4096', '--cpu-prof']))
      .toEqual(['--max-old-space-size=4096', '--cpu-prof']);
    expect(workerExecArgv(['--input-type', 'module', '--eval=x', '-p', 'y', '--stack-size=2000']))
      .toEqual(['--stack-size=2000']);
  });
});

describe('errors crossing threads', () => {
  it('keep their class and fields', () => {
    const original = new StationFileError('a.yaml', 'id', 'has a slash', 'write brinewold-head');
    const back = deserializeError(structuredClone(serializeError(original)));
    expect(back).toBeInstanceOf(StationFileError);
    expect(back.message).toBe(original.message);
    const io = deserializeError(serializeError(Object.assign(new Error('disk'), { code: 'ENOSPC' })));
    expect((io as NodeJS.ErrnoException).code).toBe('ENOSPC');
  });
});
