// Benchmark (opt-in, not part of `npm run bench`): a build of several years against a build of one,
// on the same generated stations, to see that the time grows with the station-years (issue 15: three
// years of 200 stations, time linear in station-years) and how many bytes each station-year adds.
//   npm run build:ts && node dist/tests/bench/years.js [STATIONS] [WORKERS]   (default 200 stations, 2 workers)
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { generateStations } from './build.js';
import { firstOf, itemAt } from '../../engine/index.js';

function repoRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  while (!readdirSync(dir).includes('stations-demo')) dir = dirname(dir);
  return dir;
}

function bytesUnder(dir: string): number {
  let total = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    total += entry.isDirectory() ? bytesUnder(path) : statSync(path).size;
  }
  return total;
}

interface Run { ms: number; maxRssBytes: number; bytes: number; siteBytes: number }

/** One build in a fresh Node process, so its peak resident set is its own. */
function buildOnce(root: string, work: string, stations: string, out: string, years: string, workers: number): Run {
  const dist = pathToFileURL(join(root, 'dist', 'cli', 'build')).href;
  const script = join(work, 'drive-years.mjs');
  writeFileSync(script, `
    const { parseBuildArgs } = await import('${dist}/args.js');
    const { makePlan } = await import('${dist}/plan.js');
    const { buildAlmanac } = await import('${dist}/run.js');
    const { realBuildDeps } = await import('${dist}/deps.js');
    const plan = makePlan(parseBuildArgs(process.argv.slice(2)));
    const started = performance.now();
    await buildAlmanac(plan, realBuildDeps, { progress: { stage() {}, tick() {}, clear() {} }, note() {}, tempCreated() {}, committed() {} });
    process.stdout.write(JSON.stringify({ ms: performance.now() - started, maxRssBytes: process.resourceUsage().maxRSS * 1024 }));`);
  const stdout = execFileSync(process.execPath, [script, '--stations', stations, '--out', out, '--workers', String(workers), '--year', years],
    { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] });
  const run = JSON.parse(stdout) as Omit<Run, 'bytes' | 'siteBytes'>;
  return { ...run, bytes: bytesUnder(out), siteBytes: bytesUnder(join(out, 'site')) };
}

const s = (ms: number): string => `${(ms / 1000).toFixed(1)} s`;
const mib = (bytes: number): string => `${(bytes / 1024 ** 2).toFixed(1)} MiB`;

export async function bench(stationCount = 200, workers = 2): Promise<void> {
  const root = repoRoot();
  const work = mkdtempSync(join(tmpdir(), 'tw-bench-years-'));
  try {
    const stations = join(work, 'stations');
    generateStations(join(root, 'stations-demo'), stations, stationCount);
    console.log(`years: ${stationCount} generated stations, ${workers} workers, ${availableParallelism()} cores, load average ${firstOf(loadavg(), 'load averages').toFixed(1)}`);
    const runs: [string, number, Run][] = [];
    for (const [years, count] of [['2027', 1], ['2027-2029', 3]] as const) {
      const run = buildOnce(root, work, stations, join(work, `out-${count}`), years, workers);
      runs.push([years, count, run]);
      const stationYears = stationCount * count;
      console.log(`  ${years}: ${s(run.ms)}, ${(run.ms / stationYears).toFixed(0)} ms per station-year, peak RSS ${mib(run.maxRssBytes)}, `
        + `output ${mib(run.bytes)} (${(run.bytes / stationYears / 1024).toFixed(0)} KiB per station-year; site with its downloads `
        + `${(run.siteBytes / stationYears / 1024).toFixed(0)} KiB)`);
      rmSync(join(work, `out-${count}`), { recursive: true, force: true });
    }
    const [, , one] = firstOf(runs, 'runs');
    const [, , three] = itemAt(runs, 1, 'runs');
    const ratio = three.ms / (3 * one.ms);
    console.log(`  three years take ${(three.ms / one.ms).toFixed(2)}× one year: ${ratio.toFixed(2)} of linear `
      + `(load average now ${firstOf(loadavg(), 'load averages').toFixed(1)}); target linear in station-years (within 10 %): ${Math.abs(ratio - 1) <= 0.1 || ratio < 1 ? 'met' : 'MISSED'}`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const [count, workers] = process.argv.slice(2).map(Number);
  await bench(count || 200, workers || 2);
}
