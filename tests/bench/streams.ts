// Benchmark of the stream engine: a year of slack water and strongest flood and ebb of the demo's
// stream station, and its whole StreamYear model, against a year of 1-minute velocities (the kernel on
// both components) for scale. No target yet: figures to watch.
import { join } from 'node:path';
import { buildStreamYear, compileStreamPredictor, itemAt, loadStationSet, streamEvents, type StreamStation } from '../../engine/index.js';

const RUNS = 5;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return itemAt(s, s.length >> 1, 's');
}

export async function bench(): Promise<void> {
  let dir = import.meta.dirname;
  while (!(await import('node:fs')).readdirSync(dir).includes('stations-demo')) dir = join(dir, '..');
  const set = loadStationSet(join(dir, 'stations-demo'));
  const station = set.streams!.find((s) => s.kind === 'stream') as StreamStation;
  const start = Date.UTC(2027, 0, 1);
  const end = Date.UTC(2028, 0, 1);
  const eventsMs: number[] = [];
  const seriesMs: number[] = [];
  const modelMs: number[] = [];
  let count = 0;
  for (let r = 0; r < RUNS; r++) {
    const p = compileStreamPredictor(structuredClone(station));
    let t0 = performance.now();
    count = streamEvents(p, start, end).length;
    eventsMs.push(performance.now() - t0);
    t0 = performance.now();
    p.series(start, 60_000, (end - start) / 60_000);
    seriesMs.push(performance.now() - t0);
    t0 = performance.now();
    buildStreamYear(structuredClone(station), set, 2027);
    modelMs.push(performance.now() - t0);
  }
  console.log(`streams: ${station.id}, ${Object.keys(station.constituents).length} constituents, ${count} events in 2027 (median of ${RUNS})`);
  console.log(`  events of a year        ${median(eventsMs).toFixed(0)} ms`);
  console.log(`  1-minute velocities     ${median(seriesMs).toFixed(0)} ms (525 600 samples, both components)`);
  console.log(`  StreamYear model        ${median(modelMs).toFixed(0)} ms (events, sun, moon, springs and neaps, curves)`);
}
