// Benchmark of the PDF tide books: every demo station's year rendered as an A5 book (models built
// first and not timed), then the combined book and one saddle-stitched book: time per book and pages
// per second. The first book of the process also pays for font loading and shaping; it is shown apart.
import { dirname, join } from 'node:path';
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { buildStationYear, firstOf, loadStationSet } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';

const YEAR = 2027;

function repoRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  while (!readdirSync(dir).includes('stations-demo')) dir = dirname(dir);
  return dir;
}

const pageCount = (buf: Buffer) => (buf.toString('latin1').match(/\/Type \/Page\n/g) ?? []).length;

/** Wall-clock time, and this process's CPU time (user + system), which a busy machine inflates less. */
async function timed(fn: () => Promise<Buffer>): Promise<{ ms: number; cpu: number; pages: number; bytes: number }> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const buf = await fn();
  const c = process.cpuUsage(c0);
  return { ms: performance.now() - t0, cpu: (c.user + c.system) / 1000, pages: pageCount(buf), bytes: buf.length };
}

export async function bench(): Promise<void> {
  const set = loadStationSet(join(repoRoot(), 'stations-demo'));
  const models: StationYear[] = set.stations.map((s) => buildStationYear(s, set, YEAR));
  const options = { units: 'm', page: 'a5' } as const;
  const lead = firstOf(models, 'demo station-years');

  const cold = await timed(() => renderStationBook(lead, options));
  console.log(`first book of the process (fonts loaded, words shaped): ${cold.ms.toFixed(0)} ms wall, `
    + `${cold.cpu.toFixed(0)} ms CPU, ${cold.pages} pages`);

  let ms = 0;
  let cpu = 0;
  let pages = 0;
  for (const model of models) {
    const r = await timed(() => renderStationBook(model, options));
    ms += r.ms;
    cpu += r.cpu;
    pages += r.pages;
    console.log(`  ${model.station.id.padEnd(18)} ${r.ms.toFixed(0).padStart(6)} ms wall ${r.cpu.toFixed(0).padStart(6)} ms CPU  `
      + `${r.pages} pages  ${(r.bytes / 1024).toFixed(0)} KiB`);
  }
  console.log(`station books (A5): ${models.length} in ${ms.toFixed(0)} ms wall (${cpu.toFixed(0)} ms CPU) = `
    + `${(ms / models.length).toFixed(0)} ms per station-year, ${((pages * 1000) / ms).toFixed(1)} pages/s `
    + `(${((pages * 1000) / cpu).toFixed(1)} pages per CPU second)`);

  const combined = await timed(() => renderCombinedBook(models, options));
  console.log(`combined book: ${combined.pages} pages in ${combined.ms.toFixed(0)} ms wall (${combined.cpu.toFixed(0)} ms CPU), `
    + `${((combined.pages * 1000) / combined.ms).toFixed(1)} pages/s, ${(combined.bytes / 1024 / 1024).toFixed(1)} MiB`);

  // the cost of the structure tree: the same books tagged (the default) and untagged, alternating
  let tagged = { ms: 0, cpu: 0, pages: 0, bytes: 0 };
  let untagged = { ms: 0, cpu: 0, pages: 0, bytes: 0 };
  const add = (a: typeof tagged, r: typeof tagged) => ({ ms: a.ms + r.ms, cpu: a.cpu + r.cpu, pages: a.pages + r.pages, bytes: a.bytes + r.bytes });
  for (let round = 0; round < 2; round++) {
    for (const model of models) {
      untagged = add(untagged, await timed(() => renderStationBook(model, { ...options, tagged: false })));
      tagged = add(tagged, await timed(() => renderStationBook(model, options)));
    }
  }
  const rate = (r: typeof tagged) => (r.pages * 1000) / r.cpu;
  console.log(`tagged books: ${rate(tagged).toFixed(1)} pages per CPU second, untagged ${rate(untagged).toFixed(1)}: `
    + `tagging costs ${((rate(untagged) / rate(tagged) - 1) * 100).toFixed(0)} % more CPU time per page and `
    + `${((tagged.bytes / untagged.bytes - 1) * 100).toFixed(0)} % more bytes (${(tagged.bytes / tagged.pages / 1024).toFixed(1)} KiB `
    + `against ${(untagged.bytes / untagged.pages / 1024).toFixed(1)} KiB a page)`);

  const imposed = await timed(() => renderStationBook(lead, { ...options, imposition: 'saddle-stitch' }));
  console.log(`saddle-stitched book: ${imposed.pages} sheet sides in ${imposed.ms.toFixed(0)} ms wall (${imposed.cpu.toFixed(0)} ms CPU)`);
}
