// Benchmark of a national set (opt-in: `npm run bench -- --national`, about half an hour on two cores):
// 100 and 1,000 generated stations, one year, two workers, each a clean build (no cache), then a
// rebuild of the 1,000 after one secondary port's differences were edited. Targets (issue 15): 1,000
// stations under 10 minutes and 1.5 GB peak resident set; memory growth per added station near zero;
// time per station-year within 10 % from 100 to 1,000; the one-edit rebuild under 10 % of the full build.
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { buildOnce, generateStations, repoRoot, type BuildRun } from './build.js';
import { entryOf, firstOf } from '../../engine/index.js';

const TARGET_MS = 10 * 60_000;
const TARGET_BYTES = 1.5 * 1024 ** 3;
const WORKERS = 2;

const s = (ms: number): string => `${(ms / 1000).toFixed(1)} s`;
const mib = (bytes: number): string => `${(bytes / 1024 ** 2).toFixed(0)} MiB`;

function clean(work: string): void {
  rmSync(join(work, '.tidewright-cache'), { recursive: true, force: true });
}

function report(label: string, count: number, run: BuildRun): void {
  const steps = Object.entries(run.summary.stepMs).map(([k, v]) => `${k} ${s(v)}`).join(', ');
  console.log(`  ${label}: ${s(run.ms)} (${s(run.ms / count)} per station-year), CPU ${s(run.cpuMs)}, peak RSS ${mib(run.maxRssBytes)}; `
    + `${run.summary.pdfPages} PDF pages, ${run.summary.webPages} web pages, ${mib(run.summary.bytes)} `
    + `(${(run.summary.bytes / count / 1024 ** 2).toFixed(2)} MiB per station-year); ${steps}`);
}

/** Moves one secondary port's high-water spring time difference by 3 minutes. */
function editOneSecondary(dir: string): string {
  const file = readdirSync(dir).sort().map((f) => join(dir, f)).find((f) => readFileSync(f, 'utf8').includes('kind: secondary'))!;
  const text = readFileSync(file, 'utf8');
  writeFileSync(file, text.replace(/(high_water:\s*\n\s*springs:\s*\n\s*time: )(-?\d+)/, (_m, head: string, t: string) => `${head}${Number(t) + 3}`));
  if (readFileSync(file, 'utf8') === text) throw new Error(`could not edit ${file}`);
  return file;
}

export async function bench(): Promise<void> {
  const root = repoRoot();
  const work = mkdtempSync(join(tmpdir(), 'tw-bench-national-'));
  try {
    console.log(`national: ${availableParallelism()} cores, ${WORKERS} workers, load average ${firstOf(loadavg(), 'load averages').toFixed(1)}`);
    const runs: Record<number, BuildRun> = {};
    for (const count of [100, 1000]) {
      const stations = join(work, `stations-${count}`);
      generateStations(join(root, 'stations-demo'), stations, count);
      clean(work);
      runs[count] = buildOnce(root, work, stations, join(work, `out-${count}`), WORKERS);
      report(`${count} stations, clean`, count, entryOf(runs, count, 'runs'));
      if (count !== 1000) rmSync(join(work, `out-${count}`), { recursive: true, force: true });
    }
    const edited = editOneSecondary(join(work, 'stations-1000'));
    const rebuild = buildOnce(root, work, join(work, 'stations-1000'), join(work, 'out-1000'), WORKERS);
    report(`1000 stations, rebuilt after editing ${edited.split('/').pop()}`, 1000, rebuild);
    const small = entryOf(runs, 100, 'runs');
    const big = entryOf(runs, 1000, 'runs');
    const growth = (big.maxRssBytes - small.maxRssBytes) / 900;
    const perStation = (big.ms / 1000) / (small.ms / 100);
    console.log(`  memory growth per added station: ${(growth / 1024 ** 2).toFixed(2)} MiB (100 → 1,000: ${mib(small.maxRssBytes)} → ${mib(big.maxRssBytes)})`);
    console.log(`  time per station-year, 1,000 against 100: ${(perStation * 100).toFixed(0)} % (target within 10 %: ${Math.abs(perStation - 1) <= 0.1 ? 'met' : 'MISSED'})`);
    console.log(`  target 1,000 under ${s(TARGET_MS)}: ${big.ms < TARGET_MS ? 'met' : 'MISSED'}; peak under ${mib(TARGET_BYTES)}: ${big.maxRssBytes < TARGET_BYTES ? 'met' : 'MISSED'}; `
      + `rebuild ${((rebuild.ms / big.ms) * 100).toFixed(1)} % of the full build (target under 10 %: ${rebuild.ms < big.ms / 10 ? 'met' : 'MISSED'}) `
      + `(load average now ${firstOf(loadavg(), 'load averages').toFixed(1)})`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

// Run on its own: node dist/tests/bench/national.js
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await bench();
}
