// Benchmark of the datums: LAT and HAT over the 19-year epoch of a 60-constituent station from the
// high/low water search, against 1-minute sampling with direct cosines over the same span (target
// ≥ 30×). The sampling is timed over one year and scaled by 19 (19 years of it would take minutes).
import { astronomicalExtremes, datumEpoch, epochTideEvents, itemAt, stationDatums } from '../../engine/index.js';
import type { ReferenceStation } from '../../engine/index.js';
import { sixtyConstituentStation } from '../fixtures/engine-stations.js';
import { directMinuteSeries } from './direct.js';

const RUNS = 5;

/** Lowest and highest of 1-minute direct cosine sums (f, u, V₀ refreshed at each UTC midnight). */
function sampledExtremes(station: ReferenceStation, start: number, days: number): { low: number; high: number } {
  const h = directMinuteSeries(station, start, days);
  let low = Infinity;
  let high = -Infinity;
  for (const height of h) {
    if (height < low) low = height;
    if (height > high) high = height;
  }
  return { low, high };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return itemAt(s, s.length >> 1, 's');
}

export async function bench(): Promise<void> {
  const station = sixtyConstituentStation();
  const n = Object.keys(station.constituents).length;
  const epoch = datumEpoch(station);
  const set = { byId: new Map([[station.id, station]]) };
  console.log(`datums: LAT/HAT over ${epoch.from}–${epoch.to} (19 years), ${n} constituents (${RUNS} runs each, interleaved)`);

  // Called without an engine context, so every run computes the 19 years afresh.
  const fresh = (): ReferenceStation => structuredClone(station);
  stationDatums(fresh(), { byId: set.byId });
  sampledExtremes(station, epoch.start, 30); // warm up
  const extremaMs: number[] = [];
  const sampledYearMs: number[] = [];
  let datums = stationDatums(station, set).datums;
  let sampled = { low: 0, high: 0 };
  for (let r = 0; r < RUNS; r++) {
    const copy = fresh();
    let t0 = performance.now();
    datums = stationDatums(copy, { byId: new Map([[copy.id, copy]]) }).datums;
    extremaMs.push(performance.now() - t0);
    t0 = performance.now();
    sampled = sampledExtremes(station, Date.UTC(2034, 0, 1), 365);
    sampledYearMs.push(performance.now() - t0);
  }
  const e = median(extremaMs);
  const s = median(sampledYearMs) * 19;
  console.log(`  high/low water search, 19 years         ${e.toFixed(0).padStart(7)} ms median (best ${Math.min(...extremaMs).toFixed(0)} ms)`);
  console.log(`  1-minute direct sampling, 1 year × 19   ${s.toFixed(0).padStart(7)} ms (one year: ${median(sampledYearMs).toFixed(0)} ms)`);
  console.log(`  ratio ${(s / e).toFixed(1)}× (target ≥ 30×)`);
  const y2034 = astronomicalExtremes(epochTideEvents(station, set)
    .filter((ev) => ev.time >= Date.UTC(2034, 0, 1) && ev.time < Date.UTC(2035, 0, 1)));
  console.log(`  LAT ${datums.LAT.toFixed(3)} m, HAT ${datums.HAT.toFixed(3)} m over the epoch; in 2034 alone the search `
    + `gives ${y2034.LAT.toFixed(4)} / ${y2034.HAT.toFixed(4)} m, 1-minute sampling ${sampled.low.toFixed(4)} / ${sampled.high.toFixed(4)} m`);
}
