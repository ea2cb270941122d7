// The website from the build cache (real engine and site, the books stubbed to keep it short): a
// rebuild draws only the station-years whose inputs changed (one secondary port edited, one station
// added), copies the others' pages and downloads, and writes the same bytes as a clean build of the
// same set; a corrupt page entry is drawn again, never trusted; entries the build did not use are pruned.
import { cpSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { computeInProcess } from '../../cli/build/compute.js';
import { realBuildDeps } from '../../cli/build/deps.js';
import { stationJobDeps } from '../../cli/build/engine-deps.js';
import { makePlan } from '../../cli/build/plan.js';
import { buildAlmanac, type BuildDeps } from '../../cli/build/run.js';
import { DEMO_DIR } from '../templates/site-build.js';

const root = mkdtempSync(join(tmpdir(), 'tw-site-cache-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const stations = join(root, 'stations');
const out = join(root, 'out');
const cache = join(root, '.tidewright-cache');
cpSync(DEMO_DIR, stations, { recursive: true, filter: (src) => !/\.ya?ml$/.test(src) || /brinewold-head|kelpmoor-harbour|saltgrist-cove/.test(src) });
writeFileSync(join(stations, 'tidewright.yaml'), 'title: Site Cache Almanac\ncombined: none\npocket: false\n');

let drawn: string[] = [];
const deps: BuildDeps = {
  ...realBuildDeps,
  computeStations: (request, onStation, signal) => computeInProcess(request, onStation,
    { ...stationJobDeps, renderStationBook: async (model) => Buffer.from(`%PDF-1.3\n% ${model.station.id}\n/Type /Page\n%%EOF\n`) }, signal),
  renderSite: (source, ...rest) => realBuildDeps.renderSite({
    ...source,
    model: (sy) => { drawn.push(sy.station.id); return source.model(sy); },
  }, ...rest),
};
const quiet = { progress: { stage() {}, tick() {}, clear() {} }, note() {}, tempCreated() {}, committed() {} };
async function build(): Promise<string[]> {
  drawn = [];
  await buildAlmanac(makePlan({ stations, out, years: [2027], quiet: true, press: false, help: false }, root), deps, quiet);
  return drawn.sort();
}

function site(): Map<string, string> {
  const dir = join(out, 'site');
  const files = new Map<string, string>();
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) files.set(relative(dir, join(entry.parentPath, entry.name)), readFileSync(join(entry.parentPath, entry.name)).toString('base64'));
  }
  return files;
}

function expectSame(a: Map<string, string>, b: Map<string, string>): void {
  expect([...a.keys()].sort()).toEqual([...b.keys()].sort());
  for (const [path, bytes] of a) expect(b.get(path) === bytes, path).toBe(true);
}

describe('the website with the build cache', () => {
  it('draws only what changed and writes the bytes of a clean build; a corrupt entry is drawn again', async () => {
    expect(await build()).toEqual(['brinewold-head', 'kelpmoor-harbour', 'saltgrist-cove']);
    const first = site();
    expect(await build()).toEqual([]); // every station-year's pages and downloads copied
    expectSame(site(), first);

    // One secondary port edited, one station added: the index changes, the untouched pages do not.
    const file = join(stations, 'saltgrist-cove.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('springs: { time: 20, height: -0.35 }', 'springs: { time: 24, height: -0.35 }'));
    cpSync(join(DEMO_DIR, 'palmsward-reach.yaml'), join(stations, 'palmsward-reach.yaml'));
    expect(await build()).toEqual(['palmsward-reach', 'saltgrist-cove']);
    const cached = site();
    expect(cached.get('saltgrist-cove/2027/index.html')).not.toBe(first.get('saltgrist-cove/2027/index.html'));
    expect(cached.get('index.html')).not.toBe(first.get('index.html'));
    // the edited port's old entries (its station-year and its pages) were pruned: one of each per station-year
    expect(readdirSync(cache).filter((d) => d.length === 2).flatMap((d) => readdirSync(join(cache, d)))).toHaveLength(2 * 4);

    rmSync(cache, { recursive: true, force: true });
    expect(await build()).toHaveLength(4);
    expectSame(cached, site());

    // Every page entry spoilt (its pack cut short): drawn again, same bytes.
    let spoilt = 0;
    for (const dir of readdirSync(cache).filter((d) => d.length === 2)) {
      for (const key of readdirSync(join(cache, dir))) {
        const pack = join(cache, dir, key, 'pages.pack');
        try {
          writeFileSync(pack, readFileSync(pack).subarray(0, 100));
          spoilt++;
        } catch { /* a station-year's own entry */ }
      }
    }
    expect(spoilt).toBe(4);
    expect(await build()).toHaveLength(4);
    expectSame(cached, site());
  }, 900_000);
});
