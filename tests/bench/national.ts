// Benchmark of a national set (opt-in: `npm run bench -- --national`, about half an hour on two cores):
// 100 and 1,000 generated stations, one year, two workers, each a clean build (no cache), then a
// rebuild of the 1,000 after one secondary port's differences were edited. `--stations 100` (or
// `--stations 100,300`) builds those sizes instead, the rebuild on the largest. Targets (issue 15): 1,000
// stations under 10 minutes and 1.5 GB peak resident set; memory growth per added station near zero;
// time per station-year within 10 % from 100 to 1,000; the one-edit rebuild under 10 % of the full build.
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { firstOf, lastOf } from '../../engine/index.js';
import { buildOnce, generateStations, repoRoot, type BuildRun } from './build.js';

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

/** The sizes asked for with `--stations N[,M…]`, else 100 and 1,000. */
function sizes(argv: readonly string[]): number[] {
  const at = argv.indexOf('--stations');
  if (at < 0) return [100, 1000];
  const list = (argv[at + 1] ?? '').split(',').map(Number);
  if (list.length === 0 || list.some((n) => !Number.isInteger(n) || n < 2)) throw new Error('--stations wants whole numbers of stations, e.g. --stations 100 or --stations 100,300');
  return [...new Set(list)].sort((a, b) => a - b);
}

export async function bench(argv: readonly string[] = process.argv): Promise<void> {
  const root = repoRoot();
  const counts = sizes(argv);
  const largest = lastOf(counts, 'station counts');
  const work = mkdtempSync(join(tmpdir(), 'tw-bench-national-'));
  try {
    console.log(`national: ${availableParallelism()} cores, ${WORKERS} workers, load average ${firstOf(loadavg(), 'load averages').toFixed(1)}`);
    const runs = new Map<number, BuildRun>();
    for (const count of counts) {
      const stations = join(work, `stations-${count}`);
      generateStations(join(root, 'stations-demo'), stations, count);
      clean(work);
      const run = buildOnce(root, work, stations, join(work, `out-${count}`), WORKERS);
      runs.set(count, run);
      report(`${count} stations, clean`, count, run);
      if (count !== largest) rmSync(join(work, `out-${count}`), { recursive: true, force: true });
    }
    const edited = editOneSecondary(join(work, `stations-${largest}`));
    const rebuild = buildOnce(root, work, join(work, `stations-${largest}`), join(work, `out-${largest}`), WORKERS);
    report(`${largest} stations, rebuilt after editing ${edited.split('/').pop()}`, largest, rebuild);
    const smallest = firstOf(counts, 'station counts');
    const small = runs.get(smallest);
    const big = runs.get(largest);
    if (!small || !big) throw new Error('a benchmark build did not run');
    if (largest > smallest) {
      const growth = (big.maxRssBytes - small.maxRssBytes) / (largest - smallest);
      const perStation = (big.ms / largest) / (small.ms / smallest);
      console.log(`  memory growth per added station: ${(growth / 1024 ** 2).toFixed(2)} MiB (${smallest} → ${largest}: ${mib(small.maxRssBytes)} → ${mib(big.maxRssBytes)})`);
      console.log(`  time per station-year, ${largest} against ${smallest}: ${(perStation * 100).toFixed(0)} % (target within 10 %: ${Math.abs(perStation - 1) <= 0.1 ? 'met' : 'MISSED'})`);
    }
    const targets = largest === 1000
      ? `target 1,000 under ${s(TARGET_MS)}: ${big.ms < TARGET_MS ? 'met' : 'MISSED'}; peak under ${mib(TARGET_BYTES)}: ${big.maxRssBytes < TARGET_BYTES ? 'met' : 'MISSED'}; ` : '';
    console.log(`  ${targets}rebuild ${((rebuild.ms / big.ms) * 100).toFixed(1)} % of the full build (target under 10 %: ${rebuild.ms < big.ms / 10 ? 'met' : 'MISSED'}) `
      + `(load average now ${firstOf(loadavg(), 'load averages').toFixed(1)})`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

// Run on its own: node dist/tests/bench/national.js
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await bench();
}
