// Runs every benchmark module in turn and prints its figures: `npm run bench` (after tsc) runs
// dist/tests/bench/run.js. Each module exports `bench(): Promise<void>`; add yours to the list.
// `npm run bench -- --national` runs only the national-scale benchmark (1,000 stations: long;
// `--national --stations 100` builds only that many).
import { bench as datums } from './datums.js';
import { bench as engine } from './engine.js';
import { bench as analysis } from './analysis.js';
import { bench as pdf } from './pdf.js';
import { bench as build } from './build.js';
import { bench as sky } from './sky.js';
import { bench as streams } from './streams.js';
import { bench as windows } from './windows.js';
import { bench as national } from './national.js';

const BENCHMARKS: readonly (readonly [string, () => Promise<void>])[] = [
  ['engine', engine],
  ['windows', windows],
  ['analysis', analysis],
  ['datums', datums],
  ['sky', sky],
  ['streams', streams],
  ['pdf', pdf],
  ['build', build],
];

const chosen = process.argv.includes('--national') ? [['national', national] as const] : BENCHMARKS;
for (const [name, bench] of chosen) {
  console.log(`\n=== ${name} ===`);
  const t0 = performance.now();
  await bench();
  console.log(`(${name}: ${((performance.now() - t0) / 1000).toFixed(1)} s in all)`);
}
