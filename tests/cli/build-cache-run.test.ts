// A whole build with the cache (real engine and book renderers, the website left out to keep it short):
// a second build reuses every station-year and volume and writes the same bytes as the first; a
// corrupt entry is rebuilt, and the output is still the same bytes. Volumes forced by a small limit.
import { cpSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { entryFile } from '../../cli/build/cache.js';
import { realBuildDeps } from '../../cli/build/deps.js';
import { makePlan } from '../../cli/build/plan.js';
import { buildAlmanac, type BuildDeps } from '../../cli/build/run.js';
import { DEMO_DIR } from '../templates/site-build.js';

const root = mkdtempSync(join(tmpdir(), 'tw-cache-run-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const stations = join(root, 'stations');
const out = join(root, 'out');
const cache = join(root, '.tidewright-cache');
// One reference port and its two secondary ports, in full, in volumes of at most 50 pages (one station each).
cpSync(DEMO_DIR, stations, { recursive: true, filter: (src) => !/\.ya?ml$/.test(src) || /brinewold-head|kelpmoor-harbour|saltgrist-cove/.test(src) });
writeFileSync(join(stations, 'tidewright.yaml'), 'title: Cache Test Almanac\nvolume_pages: 50\ncombined: full\npocket: false\n');
const deps: BuildDeps = { ...realBuildDeps, renderSite: async (_m, site) => { await mkdir(site, { recursive: true }); } };
const quiet = { progress: { stage() {}, tick() {}, clear() {} }, note() {}, tempCreated() {}, committed() {} };
const build = () => buildAlmanac(makePlan({ stations, out, years: [2027], quiet: true, press: false, help: false }, root), deps, quiet);
const pdfs = (): Record<string, Buffer> => Object.fromEntries(readdirSync(join(out, 'pdf')).sort().map((n) => [n, readFileSync(join(out, 'pdf', n))]));
const entries = (): string[] => readdirSync(cache).filter((d) => d.length === 2).flatMap((d) => readdirSync(join(cache, d)));

describe('a build with the cache', () => {
  it('writes the same bytes from the cache as without it, and rebuilds a corrupt entry', async () => {
    await build();
    const clean = pdfs();
    expect(Object.keys(clean)).toEqual(expect.arrayContaining(['cache-test-almanac-2027-vol-01.pdf', 'cache-test-almanac-2027-index.pdf', 'brinewold-head-2027.pdf']));
    const keys = entries();
    expect(keys.length).toBeGreaterThanOrEqual(3 + 2); // three station-years, two volumes or more

    await build();
    expect(pdfs()).toEqual(clean);
    expect(entries().sort()).toEqual(keys.sort());

    for (const key of keys) {
      for (const name of ['book.pdf', 'volume.pdf', 'model.json']) {
        try { writeFileSync(entryFile(cache, key, name), 'spoilt', { flag: 'r+' }); } catch { /* not in this entry */ }
      }
    }
    await build();
    expect(pdfs()).toEqual(clean);
  }, 900_000);
});
