// The build cache: an entry is trusted only when it is whole and is this key's; a station-year whose
// entry is good is copied (its model, books and pocket table), byte for byte what a fresh run writes;
// a corrupt or foreign entry is ignored and written again.
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { cacheKey, entryFile, readEntry, writeEntry } from '../../cli/build/cache.js';
import { stationYearKeys } from '../../cli/build/cache-keys.js';
import { runStationJob, type StationJobDeps } from '../../cli/build/station-job.js';
import { createEngineContext, loadStationSet } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';
import { DEMO_DIR } from '../templates/site-build.js';

let dir: string;
beforeEach(() => { dir = mkdtempSync(join(tmpdir(), 'tw-cache-')); });
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const KEY = cacheKey({ what: 'test' });

describe('cache entries', () => {
  it('read back as written', () => {
    expect(writeEntry(dir, KEY, { 'a.pdf': Buffer.from('%PDF one') }, { pages: 1 })).toBe(true);
    expect(readEntry(dir, KEY, ['a.pdf'])).toEqual({ files: { 'a.pdf': Buffer.from('%PDF one') }, meta: { pages: 1 } });
  });

  it.each([
    ['a file changed in place', () => writeFileSync(entryFile(dir, KEY, 'a.pdf'), '%PDF 0ne')],
    ['a file cut short', () => writeFileSync(entryFile(dir, KEY, 'a.pdf'), '%PDF')],
    ['entry.json not JSON', () => writeFileSync(entryFile(dir, KEY, 'entry.json'), '{"format":')],
    ['entry.json of another key', () => {
      const record = JSON.parse(readFileSync(entryFile(dir, KEY, 'entry.json'), 'utf8')) as { key: string };
      writeFileSync(entryFile(dir, KEY, 'entry.json'), JSON.stringify({ ...record, key: cacheKey({ what: 'other' }) }));
    }],
    ['a file missing', () => rmSync(entryFile(dir, KEY, 'a.pdf'))],
  ])('are ignored when %s', (_what, spoil) => {
    writeEntry(dir, KEY, { 'a.pdf': Buffer.from('%PDF one') }, null);
    spoil();
    expect(readEntry(dir, KEY, ['a.pdf'])).toBeNull();
    // and written again whole
    expect(writeEntry(dir, KEY, { 'a.pdf': Buffer.from('%PDF one') }, null)).toBe(true);
    expect(readEntry(dir, KEY, ['a.pdf'])?.files['a.pdf']?.toString()).toBe('%PDF one');
  });

  it('leave no temporary folders behind', () => {
    writeEntry(dir, KEY, { 'a.pdf': Buffer.from('x') }, null);
    expect(readdirSync(dir).filter((n) => n.startsWith('tmp-'))).toEqual([]);
  });
});

describe('keys', () => {
  const set = loadStationSet(DEMO_DIR);
  const render = { units: 'm' as const, page: 'a5' as const, imposition: 'none' as const };
  const keys = stationYearKeys(set.stations, 2027, render, 'code-1');
  const secondary = set.stations.find((s) => s.kind === 'secondary')!;
  it('change with the year, the choices, the program and (for a secondary port) its reference port', () => {
    expect(stationYearKeys(set.stations, 2028, render, 'code-1').get(secondary.id)).not.toBe(keys.get(secondary.id));
    expect(stationYearKeys(set.stations, 2027, { ...render, units: 'ft' }, 'code-1').get(secondary.id)).not.toBe(keys.get(secondary.id));
    expect(stationYearKeys(set.stations, 2027, render, 'code-2').get(secondary.id)).not.toBe(keys.get(secondary.id));
    const edited = set.stations.map((s) => (s.kind === 'secondary' && s.id === secondary.id ? s : s.id === secondary.reference ? { ...s, sourceFile: undefined, mean_level: 9 } : s));
    const after = stationYearKeys(edited, 2027, render, 'code-1');
    expect(after.get(secondary.id)).not.toBe(keys.get(secondary.id));
    expect(after.get(set.stations.find((s) => s.kind === 'reference' && s.id !== secondary.reference)!.id))
      .toBe(keys.get(set.stations.find((s) => s.kind === 'reference' && s.id !== secondary.reference)!.id));
  });
});

describe('a station job with the cache', () => {
  const set = loadStationSet(DEMO_DIR);
  const station = set.stations.find((s) => s.kind === 'secondary')!;
  let calls = 0;
  const deps: StationJobDeps = {
    buildStationYear: () => {
      calls++;
      return { station, year: 2027, invented: true, tideType: { kind: 'semidiurnal' }, datums: { epoch: { from: 2008, to: 2026 } }, heights: [-0, 1.5] } as unknown as StationYear;
    },
    renderStationBook: async (model) => Buffer.from(`%PDF book of ${model.station.id} /Type /Page`),
    renderPocketTable: async () => Buffer.from('%PDF pocket /Type /Page'),
    sectionPages: () => ({ full: [20, 21], compact: [2, 2] }),
  };
  const job = (temp: string, key: string) => runStationJob(station.id, {
    set, year: 2027, tempDir: temp, render: { units: 'm', page: 'a5', imposition: 'none' }, engine: createEngineContext(),
    cache: { dir: join(dir, 'cache'), keys: { [station.id]: key } },
  }, deps);
  const files = (temp: string) => Object.fromEntries(readdirSync(join(temp, 'pdf')).map((n) => [n, readFileSync(join(temp, 'pdf', n))]));

  it('reuses a good entry byte for byte, and rebuilds after a corrupt one', async () => {
    calls = 0;
    const first = await job(join(dir, 'a'), KEY);
    const second = await job(join(dir, 'b'), KEY);
    expect(calls).toBe(1);
    expect(second.cached).toBe(true);
    expect(first.model).toBeUndefined(); // the model stays in the cache, only its summary travels
    expect(second.summary).toEqual(first.summary);
    expect(second.summary.station.id).toBe(station.id);
    expect(second.sections).toEqual(first.sections);
    expect(files(join(dir, 'b'))).toEqual(files(join(dir, 'a')));
    writeFileSync(entryFile(join(dir, 'cache'), KEY, 'book.pdf'), 'garbage');
    const third = await job(join(dir, 'c'), KEY);
    expect(calls).toBe(2);
    expect(third.cached).toBeUndefined();
    expect(files(join(dir, 'c'))).toEqual(files(join(dir, 'a')));
  });
});
