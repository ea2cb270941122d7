// The demo, every test fixture and every example in the docs and help texts sit on an invented coast:
// positions in open water at least 50 km from any land, each with a time zone that fits its longitude,
// so no station can be read as a real harbour. Land is the Natural Earth 1:10 million outline from
// world-atlas 2.0.2 (`land-10m.json`), see tests/fixtures/land.ts.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { IANAZone } from 'luxon';
import { describe, expect, it } from 'vitest';
import { loadStationSet } from '../../engine/index.js';
import { hasDaylightSaving, kmToLand, standardOffsetHours, zoneMisfitHours } from '../fixtures/land.js';

const ROOT = join(import.meta.dirname, '..', '..');
const MIN_KM = 50;
const MAX_ZONE_MISFIT_H = 1.5;

/**
 * Files whose coordinates are not stations: the Sun and Moon checks observe from named real places
 * (a city's sunrise is open data, compared with astronomy-engine) and carry no tide data.
 */
const NOT_STATIONS = new Set(['tests/engine/sky.test.ts', 'tests/engine/invented-coast.test.ts']);

function filesUnder(dir: string, keep: (path: string) => boolean): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...filesUnder(path, keep));
    else if (keep(path)) out.push(path);
  }
  return out;
}

interface Place { where: string; latitude: number; longitude: number; zone?: string }

const NUM = String.raw`(-?\d+(?:\.\d+)?)`;
const PATTERNS = [
  new RegExp(String.raw`latitude: ${NUM}, longitude: ${NUM}`, 'g'), // YAML and object literals
  new RegExp(String.raw`--latitude[ =]${NUM}\s+--longitude[ =]${NUM}`, 'g'), // command lines in docs and help
  new RegExp(String.raw`'--latitude(?:=|', ')${NUM}', '--longitude', '${NUM}'`, 'g'), // argument arrays in tests
];
const ZONE = /(?:timezone:\s*'?|--timezone[ =]|'--timezone', ')([A-Z][A-Za-z_]+(?:\/[A-Za-z_]+)*|UTC)/;

/** Every coordinate pair written in the file, with the time zone written on the same or a nearby line. */
function placesIn(path: string): Place[] {
  const lines = readFileSync(path, 'utf8').split('\n');
  const places: Place[] = [];
  lines.forEach((line, i) => {
    for (const pattern of PATTERNS) {
      for (const m of line.matchAll(pattern)) {
        const latitude = Number(m[1]);
        const longitude = Number(m[2]);
        // Deliberately invalid positions of the error tests are not places.
        if (Math.abs(latitude) > 90) continue;
        const near = [line, lines[i + 1] ?? '', lines[i + 2] ?? '', lines[i - 1] ?? ''];
        const zone = near.map((l) => ZONE.exec(l)?.[1]).find((z) => z !== undefined);
        places.push({ where: `${relative(ROOT, path)}:${i + 1}`, latitude, longitude: ((longitude + 540) % 360) - 180, ...(zone ? { zone } : {}) });
      }
    }
  });
  return places;
}

const sources = [
  join(ROOT, 'README.md'),
  join(ROOT, 'DEVELOPERS.md'),
  ...filesUnder(join(ROOT, 'stations-demo'), (p) => p.endsWith('.yaml')),
  ...['cli', 'engine', 'templates', 'tests'].flatMap((d) => filesUnder(join(ROOT, d), (p) => /\.(ts|yaml|yml|md|njk|txt)$/.test(p))),
].filter((p) => !NOT_STATIONS.has(relative(ROOT, p)));
const places = sources.flatMap(placesIn);

describe('the invented coast', () => {
  it('finds the positions of the demo, the fixtures, the docs and the help texts', () => {
    const files = new Set(places.map((p) => p.where.split(':')[0]));
    for (const f of ['README.md', 'cli/analyse.ts', 'cli/differences.ts', 'stations-demo/brinewold-head.yaml',
      'tests/fixtures/stations-good/brinewold-head.yaml', 'tests/cli/analyse.test.ts', 'tests/fixtures/sample-year.ts']) {
      expect(files, f).toContain(f);
    }
    expect(places.length).toBeGreaterThan(60);
  });

  it(`puts every position at sea, at least ${MIN_KM} km from any land (Natural Earth 1:10 m)`, () => {
    const distance = new Map<string, number>();
    const tooNear: string[] = [];
    for (const p of places) {
      const key = `${p.latitude},${p.longitude}`;
      if (!distance.has(key)) distance.set(key, kmToLand(p.latitude, p.longitude));
      const km = distance.get(key)!;
      if (km < MIN_KM) tooNear.push(`${p.where}: ${p.latitude}, ${p.longitude} is ${km.toFixed(1)} km from land`);
    }
    expect(tooNear).toEqual([]);
  });

  it(`gives every position a time zone within ±${MAX_ZONE_MISFIT_H} h of longitude / 15°`, () => {
    // Misspelt zones of the error tests are not zones.
    const zoned = places.filter((p) => p.zone !== undefined && IANAZone.isValidZone(p.zone));
    expect(zoned.length).toBeGreaterThan(40);
    const misfits = zoned
      .filter((p) => zoneMisfitHours(p.zone!, p.longitude) > MAX_ZONE_MISFIT_H)
      .map((p) => `${p.where}: ${p.zone} (UTC${standardOffsetHours(p.zone!)}) at longitude ${p.longitude}`);
    expect(misfits).toEqual([]);
  });

  it('checks distances correctly: real harbours fail, open ocean passes (Natural Earth 1:10 m)', () => {
    // A quay in a real harbour and a point 20 km off a coast are near land; mid-ocean is far.
    expect(kmToLand(51.9, 4.5)).toBe(0); // inland of a North Sea coast
    expect(kmToLand(43.0, -9.6)).toBeLessThan(MIN_KM); // about 20 km off the Iberian Atlantic coast
    expect(kmToLand(0, -140)).toBeGreaterThan(500); // the open equatorial Pacific
    expect(kmToLand(-60, -40)).toBeGreaterThan(MIN_KM); // Southern Ocean between South Georgia and the South Orkneys
  });

  it('keeps the demo mix: Arctic, southern hemisphere, macro-tidal semidiurnal with overtides, mixed, DST and no DST', () => {
    const set = loadStationSet(join(ROOT, 'stations-demo'));
    const references = set.stations.flatMap((s) => (s.kind === 'reference' ? [s] : []));
    const amp = (s: (typeof references)[number], name: string): number => s.constituents[name]?.amplitude ?? 0;
    const form = (s: (typeof references)[number]): number => (amp(s, 'K1') + amp(s, 'O1')) / (amp(s, 'M2') + amp(s, 'S2'));
    expect(references.some((s) => s.position.latitude > 66.56)).toBe(true);
    expect(references.some((s) => s.position.latitude < 0)).toBe(true);
    // Macro-tidal: mean spring range 2(M2 + S2) above 4 m, with quarter- and sixth-diurnal overtides.
    expect(references.some((s) => form(s) < 0.25 && 2 * (amp(s, 'M2') + amp(s, 'S2')) > 4 && amp(s, 'M4') > 0.1 && amp(s, 'M6') > 0.02)).toBe(true);
    // Mixed: form number (K1 + O1)/(M2 + S2) between 0.25 and 3.
    expect(references.some((s) => form(s) > 0.25 && form(s) < 3)).toBe(true);
    expect(set.stations.some((s) => hasDaylightSaving(s.timezone))).toBe(true);
    expect(set.stations.some((s) => !hasDaylightSaving(s.timezone))).toBe(true);
    for (const s of set.stations) {
      expect(s.name).toMatch(/\(invented\)$/);
      expect(s.provenance).toMatch(/^Invented/);
    }
  });
});
