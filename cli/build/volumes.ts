// The combined output of a large set: volumes planned from each station's section length, drawn in a
// pool of worker threads from the models in the build cache (so memory does not grow with the set),
// then an index volume listing every station with its volume and page. Output names:
//   <name>-<year>-vol-01.pdf, <name>-<year>-vol-02.pdf, …, <name>-<year>-index.pdf
// A set that fits in one volume keeps one combined book, <name>-<year>.pdf.
import { Worker } from 'node:worker_threads';
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { ImageWarningSink } from '../../templates/pdf/image-resolution.js';
import type { IndexEntry } from '../../templates/pdf/index-volume.js';
import { cacheKey } from './cache.js';
import { codeFingerprint } from './cache-keys.js';
import { BuildStepError, deserializeError } from './failure.js';
import type { RenderChoices } from './options.js';
import { assertSafeId } from './paths.js';
import { workerExecArgv } from './pool.js';
import type { FromWorker, ToWorker, VolumeSetup } from './protocol.js';
import { countPdfPages, type StationCache } from './station-job.js';
import { stopWorker, trackWorker } from './threads.js';
import type { VolumeJob, VolumeResult } from './volume-job.js';
import type { VolumeChoices } from './volume-options.js';
import { planVolumes, type PlanStation, type VolumePlan } from './volume-plan.js';

export interface BindRequest {
  stations: PlanStation[]; // in the set's order
  choices: VolumeChoices;
  render: RenderChoices;
  year: number;
  name: string; // the combined book's base name (cli/build/paths.ts)
  pdfDir: string; // in the build's temporary folder
  cache: StationCache;
  workers: number;
  workerUrl: URL | null; // null: draw in this thread (tests run the TypeScript sources)
  signal?: AbortSignal;
  warn?: ImageWarningSink; // hears of the publisher's pictures on the covers (each volume's, drawn or cached)
}

/** The plan for the combined output (page counts from the real page composition). */
export async function planCombined(stations: PlanStation[], choices: VolumeChoices, render: RenderChoices): Promise<VolumePlan> {
  const { volumeFrontPages, VOLUME_BACK_PAGES } = await import('../../templates/pdf/volume.js');
  return planVolumes(stations, choices, { front: (n) => volumeFrontPages(n, render), back: VOLUME_BACK_PAGES });
}

/** `<name>-<year>-vol-07.pdf`, `<name>-<year>-index.pdf`, or the one book's `<name>-<year>.pdf`. */
export function volumeFileName(name: string, year: number, part: number | 'index' | null): string {
  const suffix = part === null ? '' : part === 'index' ? '-index' : `-vol-${String(part).padStart(2, '0')}`;
  return `${assertSafeId(name)}-${year}${suffix}.pdf`;
}

function jobsOf(plan: VolumePlan, req: BindRequest): VolumeJob[] {
  const byId = new Map(req.stations.map((s) => [s.id, s]));
  const key = (id: string): string => {
    const k = req.cache.keys[id];
    if (k === undefined) throw new Error(`station "${id}" has no cache key`);
    return k;
  };
  const code = codeFingerprint();
  const count = plan.volumes.length;
  return plan.volumes.map((v, index) => {
    const stations = v.stations.map((s) => {
      const ref = byId.get(s.id)?.reference;
      return { id: s.id, key: key(s.id), compact: s.compact, ...(s.compact && ref !== undefined && byId.has(ref) && { reference: { id: ref, key: key(ref) } }) };
    });
    const text = { volume: index + 1, volumes: count, ...(count > 1 && { label: v.label }) };
    return {
      index, text, stations,
      file: join(req.pdfDir, volumeFileName(req.name, req.year, count > 1 ? index + 1 : null)),
      key: cacheKey({ what: 'volume', code, year: req.year, text, stations, render: req.render }),
    };
  });
}

function runInWorkers(jobs: VolumeJob[], req: BindRequest, workerUrl: URL): Promise<VolumeResult[]> {
  const queue = [...jobs];
  const results: VolumeResult[] = [];
  const setup: VolumeSetup = { job: 'volumes', cacheDir: req.cache.dir, render: req.render };
  const size = Math.max(1, Math.min(req.workers, jobs.length));
  const workers: { worker: Worker; exited: Promise<void> }[] = [];
  return new Promise((resolve, reject) => {
    let settled = false;
    let open = size;
    const fail = (error: unknown): void => {
      if (settled) return;
      settled = true;
      const reason = error instanceof BuildStepError ? error : new BuildStepError('drawing the combined volumes', error);
      Promise.all(workers.map((w) => stopWorker(w.worker, w.exited))).finally(() => reject(reason));
    };
    const onAbort = (): void => fail(req.signal?.reason ?? new Error('stopped'));
    req.signal?.addEventListener('abort', onAbort, { once: true });
    for (let i = 0; i < size; i++) {
      const worker = new Worker(workerUrl, { workerData: setup, execArgv: workerExecArgv() });
      workers.push({ worker, exited: trackWorker(req.signal, worker) });
      const feed = (): void => {
        const job = queue.shift();
        const message: ToWorker = job ? { type: 'volume', job } : { type: 'close' };
        worker.postMessage(message);
      };
      worker.on('message', (message: FromWorker) => {
        if (settled) return;
        if (message.type === 'ready') feed();
        else if (message.type === 'volume-done') { results.push(message.result); feed(); }
        else if (message.type === 'failed') fail(deserializeError(message.error));
      });
      worker.on('error', fail);
      worker.on('exit', (code) => {
        open--;
        if (settled) return;
        if (code !== 0) fail(new Error(`a volume worker stopped with exit code ${code}`));
        else if (open === 0) {
          settled = true;
          req.signal?.removeEventListener('abort', onAbort);
          if (results.length === jobs.length) resolve(results);
          else reject(new BuildStepError('drawing the combined volumes', new Error('the workers stopped before every volume was drawn')));
        }
      });
    }
  });
}

async function runHere(jobs: VolumeJob[], req: BindRequest): Promise<VolumeResult[]> {
  const { runVolumeJob } = await import('./volume-job.js');
  const { renderVolume } = await import('../../templates/pdf/volume.js');
  const results: VolumeResult[] = [];
  for (const job of jobs) {
    req.signal?.throwIfAborted();
    results.push(await runVolumeJob(job, req.cache.dir, req.render, { renderVolume, countPages: countPdfPages }));
  }
  return results;
}

/** Draws the planned volumes (and the index volume when there are several); returns the pages drawn. */
export async function bindVolumes(plan: VolumePlan, req: BindRequest): Promise<{ pages: number; volumes: VolumeResult[] }> {
  await mkdir(req.pdfDir, { recursive: true });
  const jobs = jobsOf(plan, req);
  if (jobs.length === 0) return { pages: 0, volumes: [] };
  const results = (req.workerUrl ? await runInWorkers(jobs, req, req.workerUrl) : await runHere(jobs, req))
    .sort((a, b) => a.index - b.index);
  let pages = results.reduce((n, r) => n + r.pages, 0);
  for (const w of results.flatMap((r) => r.imageWarnings ?? [])) req.warn?.(w);
  if (jobs.length > 1) {
    const byId = new Map(req.stations.map((s) => [s.id, s]));
    const entries: IndexEntry[] = results.flatMap((r) => r.entries.map((e) => {
      const s = byId.get(e.id)!;
      return { name: s.name, kind: s.kind, ...(s.region !== undefined && { region: s.region }), volume: r.index + 1, page: e.page };
    }));
    const { renderIndexVolume } = await import('../../templates/pdf/index-volume.js');
    const pdf = await renderIndexVolume(entries, { ...req.render, ...(req.warn && { warn: req.warn }) }, { years: String(req.year), volumes: jobs.length, invented: req.stations.some((s) => s.invented) });
    await writeFile(join(req.pdfDir, volumeFileName(req.name, req.year, 'index')), pdf);
    pages += countPdfPages(pdf);
  }
  return { pages, volumes: results };
}
