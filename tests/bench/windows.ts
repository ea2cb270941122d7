// Benchmark of access windows: every opening of a station-year at three levels, found with the year's
// high and low waters in one pass over the kernel (the events are part of the job: the crossings are
// solved between them), against reading the same crossings off 1-minute direct-cosine sampling (which is
// also 60 times coarser than the solver's sub-millisecond roots); target ≥ 20×.
import { createEngineContext, openIntervalsOf } from '../../engine/index.js';
import type { Station } from '../../engine/index.js';
import { sixtyConstituentStation } from '../fixtures/engine-stations.js';
import { directMinuteSeries } from './direct.js';
import { line, ratio, timeSideBySide } from './engine.js';

const DAY = 86_400_000;

function sampledCrossings(h: Float64Array, levels: readonly number[]): number {
  let n = 0;
  for (const level of levels) {
    let above: boolean | null = null;
    for (const height of h) {
      if (above !== null && height >= level !== above) n++;
      above = height >= level;
    }
  }
  return n;
}

export async function bench(): Promise<void> {
  const station = sixtyConstituentStation();
  const set = { byId: new Map<string, Station>([[station.id, station]]) };
  const start = Date.UTC(2027, 0, 1);
  const days = 365;
  const end = start + days * DAY;
  const levels = [station.mean_level - 1.5, station.mean_level, station.mean_level + 1.5];

  const ctx = createEngineContext(); // the station compiled once, as a build's unit of work does
  const solve = (): number => {
    const all = openIntervalsOf(station, set, levels.map((level) => ({ side: 'above' as const, level })), start, end, undefined, ctx);
    return all.reduce((n, list) => n + list.length, 0);
  };
  const intervals = solve();
  const crossings = sampledCrossings(directMinuteSeries(station, start, days), levels);
  console.log(`windows: a station-year (60 constituents), three levels (${levels.map((l) => l.toFixed(2)).join(', ')} m)`);
  const [w, s] = timeSideBySide([solve, () => sampledCrossings(directMinuteSeries(station, start, days), levels)]);
  console.log(line(`extrema + crossings (${intervals} windows)`, w!));
  console.log(line(`1-minute direct sampling (${crossings} crossings)`, s!));
  console.log(ratio(s!, w!, 20));
}
