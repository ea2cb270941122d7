// Benchmark of the prediction engine, measured side by side with the plain way of doing the same job:
// (a) a year of heights at 1-minute steps, 60 constituents: the phasor kernel against a direct Math.cos
//     loop (f, u and V₀ evaluated once a day, one cosine per constituent per step); target ≥ 3×;
// (b) all high and low waters of that station-year: findExtrema against 1-minute sampling with direct
//     cosines (which is also 60 times coarser in time); target ≥ 30×.
import { findConstituent } from '../../engine/constituents.js';
import { findExtrema } from '../../engine/extrema.js';
import { compileAstronomicalTerms } from '../../engine/nodal.js';
import { compilePredictor } from '../../engine/predict.js';
import type { ReferenceStation } from '../../engine/types.js';
import { sixtyConstituentStation } from '../fixtures/engine-stations.js';

const MINUTE = 60_000;
const DAY = 86_400_000;
const DEG = Math.PI / 180;
const RUNS = 7;

/** Heights at 1-minute steps by direct cosines, node factors and V₀ refreshed at each UTC midnight. */
function directMinuteSeries(station: ReferenceStation, start: number, days: number): Float64Array {
  const names = Object.keys(station.constituents);
  const n = names.length;
  const terms = compileAstronomicalTerms(names);
  const H = Float64Array.from(names, (k) => station.constituents[k]!.amplitude);
  const g = Float64Array.from(names, (k) => station.constituents[k]!.phase);
  const omegaPerMinute = Float64Array.from(names, (k) => (findConstituent(k)!.speed * DEG) / 60);
  const V = new Float64Array(n);
  const f = new Float64Array(n);
  const u = new Float64Array(n);
  const amplitude = new Float64Array(n);
  const phase = new Float64Array(n);
  const out = new Float64Array(days * 1440);
  for (let d = 0; d < days; d++) {
    terms.evaluate(start + d * DAY, V, f, u);
    for (let k = 0; k < n; k++) {
      amplitude[k] = f[k]! * H[k]!;
      phase[k] = (V[k]! + u[k]! - g[k]!) * DEG;
    }
    for (let m = 0; m < 1440; m++) {
      let h = station.mean_level;
      for (let k = 0; k < n; k++) h += amplitude[k]! * Math.cos(phase[k]! + omegaPerMinute[k]! * m);
      out[d * 1440 + m] = h;
    }
  }
  return out;
}

/** High and low waters read off a sampled series (the sample nearest each turn). */
function sampledExtrema(h: Float64Array): number {
  let events = 0;
  for (let j = 1; j + 1 < h.length; j++) {
    if ((h[j]! > h[j - 1]! && h[j]! >= h[j + 1]!) || (h[j]! < h[j - 1]! && h[j]! <= h[j + 1]!)) events++;
  }
  return events;
}

interface Timing {
  min: number;
  median: number;
}

/** Runs each job RUNS times, interleaved so both see the same machine load; times in ms. */
function timeSideBySide(jobs: (() => unknown)[]): Timing[] {
  for (const job of jobs) job(); // warm up the compiler
  const samples = jobs.map(() => [] as number[]);
  for (let r = 0; r < RUNS; r++) {
    jobs.forEach((job, i) => {
      const t0 = performance.now();
      job();
      samples[i]!.push(performance.now() - t0);
    });
  }
  return samples.map((s) => {
    s.sort((a, b) => a - b);
    return { min: s[0]!, median: s[s.length >> 1]! };
  });
}

function line(label: string, t: Timing): string {
  return `  ${label.padEnd(34)} ${t.median.toFixed(1).padStart(8)} ms median  ${t.min.toFixed(1).padStart(8)} ms best`;
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
  for (let j = 0; j < kernel.length; j++) worst = Math.max(worst, Math.abs(kernel[j]! - direct[j]!));
  const [k, d] = timeSideBySide([
    () => predictor.heights(start, MINUTE, days * 1440),
    () => directMinuteSeries(station, start, days),
  ]);
  console.log(line('phasor kernel', k!));
  console.log(line('direct Math.cos loop', d!));
  console.log(`  ratio ${(d!.median / k!.median).toFixed(1)}× by median, ${(d!.min / k!.min).toFixed(1)}× best (target ≥ 3×); largest difference ${worst.toExponential(1)} m`);

  console.log(`engine (b): all high and low waters of the station-year`);
  const events = findExtrema(predictor, start, start + days * DAY);
  const sampled = sampledExtrema(direct);
  const [e, s] = timeSideBySide([
    () => findExtrema(predictor, start, start + days * DAY),
    () => sampledExtrema(directMinuteSeries(station, start, days)),
  ]);
  console.log(line(`findExtrema (${events.length} events, ≤ 1 s)`, e!));
  console.log(line(`1-minute direct sampling (${sampled} events)`, s!));
  console.log(`  ratio ${(s!.median / e!.median).toFixed(1)}× by median, ${(s!.min / e!.min).toFixed(1)}× best (target ≥ 30×)`);
}
