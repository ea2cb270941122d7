// Benchmark of the prediction engine, measured side by side with the plain way of doing the same job:
// (a) a year of heights at 1-minute steps, 60 constituents: the phasor kernel against a direct Math.cos
//     loop (f, u and V₀ evaluated once a day, one cosine per constituent per step); target ≥ 3×;
// (b) all high and low waters of that station-year: findExtrema against 1-minute sampling with direct
//     cosines (which is also 60 times coarser in time); target ≥ 30×.
import { compilePredictor, findExtrema, itemAt, numberAt } from '../../engine/index.js';
import { sixtyConstituentStation } from '../fixtures/engine-stations.js';
import { directMinuteSeries } from './direct.js';

const MINUTE = 60_000;
const DAY = 86_400_000;
const RUNS = 15;

/** High and low waters read off a sampled series (the sample nearest each turn). */
function sampledExtrema(h: Float64Array): number {
  let events = 0;
  let before = h[0] ?? Number.NaN, here = h[1] ?? Number.NaN; // NaN compares false: fewer than 3 samples have no turn
  for (let j = 2; j < h.length; j++) {
    const after = numberAt(h, j, 'sampled heights');
    if ((here > before && here >= after) || (here < before && here <= after)) events++;
    before = here;
    here = after;
  }
  return events;
}

interface Timing {
  wall: number; // median wall-clock ms
  cpu: number; // median CPU ms of this process (steadier when other work shares the machine)
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return itemAt(sorted, sorted.length >> 1, 'timings');
}

// `npm run bench` starts node with --expose-gc
const collectGarbage = (globalThis as { gc?: () => void }).gc ?? (() => {});

/**
 * Runs each job RUNS times, interleaved so both see the same machine load. Garbage is collected once
 * before each round, the jobs then run from the last to the first: the first job, the one measured against
 * the others, pays for any garbage they left. (Collecting before every job as well made the first job's
 * timings swing by 3× on a loaded machine: two full collections in a row with nothing run between them
 * throw away more of the optimised code than a build ever does.)
 */
export function timeSideBySide(jobs: (() => unknown)[]): Timing[] {
  // warm up until the optimising compiler has settled: at least 10 runs and 1 s of each job
  for (const job of jobs) {
    const t0 = performance.now();
    for (let r = 0; r < 10 || performance.now() - t0 < 1000; r++) job();
  }
  const runs = jobs.map((job) => ({ job, wall: [] as number[], cpu: [] as number[] }));
  for (let r = 0; r < RUNS; r++) {
    collectGarbage();
    for (const { job, wall, cpu } of [...runs].reverse()) {
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      job();
      wall.push(performance.now() - t0);
      const c = process.cpuUsage(c0);
      cpu.push((c.user + c.system) / 1000);
    }
  }
  return runs.map(({ wall, cpu }) => ({ wall: median(wall), cpu: median(cpu) }));
}

export function line(label: string, t: Timing): string {
  return `  ${label.padEnd(40)} ${t.wall.toFixed(1).padStart(8)} ms wall ${t.cpu.toFixed(1).padStart(8)} ms CPU`;
}

export function ratio(slow: Timing, fast: Timing, target: number): string {
  return `  ratio ${(slow.wall / fast.wall).toFixed(1)}× wall, ${(slow.cpu / fast.cpu).toFixed(1)}× CPU (medians of ${RUNS}; target ≥ ${target}×)`;
}

export async function bench(): Promise<void> {
  const station = sixtyConstituentStation();
  const predictor = compilePredictor(station);
  const start = Date.UTC(2027, 0, 1);
  const days = 365;
  const n = Object.keys(station.constituents).length;

  console.log(`engine (a): one year of heights at 1-minute steps, ${n} constituents, ${days * 1440} samples (${RUNS} runs each)`);
  const kernel = predictor.heights(start, MINUTE, days * 1440);
  const direct = directMinuteSeries(station, start, days);
  let worst = 0;
  for (let j = 0; j < kernel.length; j++) worst = Math.max(worst, Math.abs(numberAt(kernel, j, 'kernel heights') - numberAt(direct, j, 'direct heights')));
  const [k, d] = timeSideBySide([
    () => predictor.heights(start, MINUTE, days * 1440),
    () => directMinuteSeries(station, start, days),
  ]);
  console.log(line('phasor kernel', k!));
  console.log(line('direct Math.cos loop (f, u, V₀ daily)', d!));
  console.log(ratio(d!, k!, 3));
  console.log(`  largest difference ${worst.toExponential(1)} m (the daily loop holds u and f for 24 h; the kernel does not)`);

  console.log(`engine (b): all high and low waters of the station-year`);
  const events = findExtrema(predictor, start, start + days * DAY);
  const sampled = sampledExtrema(direct);
  const [e, s] = timeSideBySide([
    () => findExtrema(predictor, start, start + days * DAY),
    () => sampledExtrema(directMinuteSeries(station, start, days)),
  ]);
  console.log(line(`findExtrema (${events.length} events, to 36 µs)`, e!));
  console.log(line(`1-minute direct sampling (${sampled} events)`, s!));
  console.log(ratio(s!, e!, 30));
}
