// The full fuzz run (`npm run stress:fuzz [-- COUNT [SEED]]`, default 1,000 mutants, seed 17): every
// mutant of the demo station files through check; every distinct station set that passes through a
// real build (worker threads, website, books, downloads) into a scratch folder. The mutants run in a
// worker thread watched from here, so a hang is reported (with its seed and mutant) instead of waited on.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { checkMutant, demoFiles, describeMutant, mutant } from './fuzz-run.js';

const HANG_MS = 300_000; // no word from the worker for this long: a hang

interface Job { count: number; seed: number; work: string }
type Report = { type: 'mutant'; index: number; outcome: 'refused' | 'passed' | 'built' | 'same'; where: string }
  | { type: 'failed'; where: string; error: string } | { type: 'done' };

async function runMutants({ count, seed, work }: Job, post: (r: Report) => void): Promise<void> {
  const { buildAlmanac } = await import('../../cli/build/run.js');
  const { realBuildDeps } = await import('../../cli/build/deps.js');
  const files = demoFiles();
  const builtSets = new Set<string>();
  for (let i = 0; i < count; i++) {
    const m = mutant(seed, i, files);
    const where = describeMutant(seed, m);
    const dir = join(work, 'set');
    try {
      const verdict = checkMutant(m, files, dir);
      if (verdict.outcome === 'refused') {
        post({ type: 'mutant', index: i, outcome: 'refused', where });
        continue;
      }
      const key = JSON.stringify(verdict.stations.map(({ sourceFile: _, ...s }) => s));
      if (builtSets.has(key)) {
        post({ type: 'mutant', index: i, outcome: 'same', where });
        continue;
      }
      builtSets.add(key);
      await buildAlmanac(
        { stationsDir: dir, outDir: join(work, 'out'), year: 2027, render: { units: 'm', page: 'a5', imposition: 'none' }, quiet: true, workers: 1, projectFile: null },
        realBuildDeps,
        { progress: { stage() {}, tick() {}, clear() {} }, note() {}, tempCreated() {}, committed() {} },
      );
      post({ type: 'mutant', index: i, outcome: 'built', where });
    } catch (error) {
      post({ type: 'failed', where, error: error instanceof Error ? (error.stack ?? error.message) : String(error) });
    }
  }
  post({ type: 'done' });
}

async function main(): Promise<number> {
  const count = Number(process.argv[2] ?? 1000);
  const seed = Number(process.argv[3] ?? 17);
  const work = mkdtempSync(join(tmpdir(), 'tw-fuzz-long-'));
  const worker = new Worker(fileURLToPath(import.meta.url), { workerData: { count, seed, work } satisfies Job });
  const tally = { refused: 0, passed: 0, built: 0, same: 0, failed: 0 };
  const started = Date.now();
  let last = Date.now();
  let lastWhere = `seed ${seed}, mutant 0`;
  const code = await new Promise<number>((resolve) => {
    const watch = setInterval(() => {
      if (Date.now() - last > HANG_MS) {
        console.log(`HANG: nothing for ${HANG_MS / 1000} s after ${lastWhere}`);
        clearInterval(watch);
        void worker.terminate().then(() => resolve(1));
      }
    }, 1000);
    worker.on('message', (r: Report) => {
      last = Date.now();
      if (r.type === 'done') {
        clearInterval(watch);
        resolve(tally.failed === 0 ? 0 : 1);
      } else if (r.type === 'failed') {
        tally.failed++;
        console.log(`FAILED ${r.where}: ${r.error}`);
      } else {
        tally[r.outcome]++;
        lastWhere = r.where;
        if (r.outcome === 'built' || (r.index + 1) % 100 === 0) console.log(`${r.index + 1}/${count} ${r.outcome}: ${r.where}`);
      }
    });
    worker.on('error', (error) => { console.log(`CRASH after ${lastWhere}: ${error.stack ?? error.message}`); clearInterval(watch); resolve(1); });
  });
  console.log(`seed ${seed}: ${count} mutants in ${((Date.now() - started) / 1000).toFixed(0)} s: ${tally.refused} refused in one-line problems, ` +
    `${tally.built} distinct passing sets built, ${tally.same} passing duplicates, ${tally.failed} failures`);
  rmSync(work, { recursive: true, force: true });
  return code;
}

if (isMainThread) main().then((code) => { process.exitCode = code; });
else void runMutants(workerData as Job, (r) => parentPort!.postMessage(r));
