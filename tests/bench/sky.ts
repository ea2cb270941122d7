// Benchmark of the sun and moon rise/set search for one station-year (every rise and set of both
// bodies, cut into local days): with the Sun's and Moon's positions already on the shared grid
// (every station of a build after the first), and cold (the first station, which fills the grid);
// beside it, the same events found one after another by astronomy-engine's SearchRiseSet.
import { Body, Observer, SearchRiseSet } from 'astronomy-engine';
import { createSkyEphemeris, firstOf, itemAt, lastOf, localDays, skyForDays } from '../../engine/index.js';

const DAY = 86_400_000;
const RUNS = 5;

function medianMs(job: () => unknown): number {
  job(); // warm
  const times: number[] = [];
  for (let r = 0; r < RUNS; r++) {
    const t0 = performance.now();
    job();
    times.push(performance.now() - t0);
  }
  return itemAt(times.sort((a, b) => a - b), RUNS >> 1, 'times');
}

export async function bench(): Promise<void> {
  const zone = 'Europe/Oslo';
  const days = localDays(2027, zone);
  for (const position of [{ latitude: 50, longitude: -20 }, { latitude: 69.7, longitude: 5 }]) {
    const eph = createSkyEphemeris();
    const events = skyForDays(days, position, zone, eph).reduce((n, d) => n + d.events.length, 0);
    const warm = medianMs(() => skyForDays(days, position, zone, eph));
    const cold = medianMs(() => skyForDays(days, position, zone, createSkyEphemeris()));
    const observer = new Observer(position.latitude, position.longitude, 0);
    const from = firstOf(days, 'days').start;
    const to = lastOf(days, 'days').end;
    const reference = medianMs(() => {
      for (const body of [Body.Sun, Body.Moon]) {
        for (const direction of [1, -1]) {
          for (let t = from; ;) {
            const r = SearchRiseSet(body, observer, direction, new Date(t), (to - t) / DAY);
            if (r === null) break;
            t = r.date.getTime() + 1000;
          }
        }
      }
    });
    console.log(`sky: a station-year at ${position.latitude}°, ${events} rises and sets (medians of ${RUNS})`);
    console.log(`  shared grid already filled        ${warm.toFixed(1).padStart(8)} ms`);
    console.log(`  fresh grid (first station)        ${cold.toFixed(1).padStart(8)} ms`);
    console.log(`  astronomy-engine, event by event  ${reference.toFixed(1).padStart(8)} ms`);
  }
}
