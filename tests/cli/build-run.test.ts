// The build's orchestration with stand-in pieces (the synthetic model and toy renderers, here only):
// order of results, what lands where, and that a failure anywhere leaves the previous output alone.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { StationFileError } from '../../engine/index.js';
import type { AnyStreamStation, Station, StationYear, StreamYear } from '../../engine/index.js';
import { BuildStepError, StationSetInvalid } from '../../cli/build/failure.js';
import { poolSize, workUnits } from '../../cli/build/groups.js';
import type { BuildPlan } from '../../cli/build/options.js';
import { clock, createProgress, progressLine } from '../../cli/build/progress.js';
import { BESIDE_MAX_STATIONS, buildAlmanac, type BuildDeps, type BuildEvents } from '../../cli/build/run.js';
import { sampleStation, sampleYear } from '../fixtures/sample-year.js';

const root = mkdtempSync(join(tmpdir(), 'tw-build-run-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const base = sampleYear(2027);
const station = (id: string, kind: 'reference' | 'secondary' = 'reference', reference = 'a'): Station =>
  kind === 'reference'
    ? { ...sampleStation, id, name: `Station ${id.toUpperCase()} (invented)` }
    : { id, name: `Station ${id.toUpperCase()} (invented)`, kind, reference, position: sampleStation.position,
      timezone: sampleStation.timezone, datum: sampleStation.datum, provenance: 'Invented',
      differences: { high_water: { springs: { time: 10, height: 0 }, neaps: { time: 5, height: 0 } },
        low_water: { springs: { time: 10, height: 0 }, neaps: { time: 5, height: 0 } } } };
const modelOf = (s: Station, year: number): StationYear => ({ ...structuredClone(base), station: s, year });
const fakePdf = (pages: number, text: string): Buffer =>
  Buffer.from(`%PDF-1.3\n${'<< /Type /Page /Parent 1 0 R >>\n'.repeat(pages)}<< /Type /Pages >>\n% ${text}\n%%EOF\n`);

interface Stubs extends BuildDeps {
  siteOrder: string[];
  bookOrder: string[];
  units: string[][];
}

/** Toy pieces: results come back in reverse order, each after a delay, to shake out order bugs. */
function stubs(stations: Station[], overrides: Partial<BuildDeps> = {}): Stubs {
  const deps: Stubs = {
    siteOrder: [], bookOrder: [], units: [],
    checkSet: () => ({ stations, problems: [] }),
    async computeStations(request, onStation) {
      deps.units = request.units;
      const ids = request.units.flat().reverse();
      for (const [i, id] of ids.entries()) {
        await new Promise((r) => setTimeout(r, 5 * (ids.length - i)));
        const s = stations.find((x) => x.id === id)!;
        await mkdir(join(request.tempDir, 'pdf'), { recursive: true });
        await writeFile(join(request.tempDir, 'pdf', `${id}-${request.year}.pdf`), fakePdf(3, s.name));
        { const model = modelOf(s, request.year); onStation({ id, summary: model, model, pdfPages: 3 }); }
      }
    },
    async renderSite(source, siteDir) {
      const models = source.stationYears;
      deps.siteOrder = models.map((m) => m.station.id);
      const dataDir = join(siteDir, 'data');
      await mkdir(dataDir, { recursive: true });
      await writeFile(join(siteDir, 'index.html'), `<ul>${deps.siteOrder.map((id) => `<li>${id}</li>`).join('')}</ul>`);
      for (const m of models) await writeFile(join(dataDir, `${m.station.id}-${m.year}.ics`), 'BEGIN:VCALENDAR');
    },
    async renderCombinedBook(models) {
      deps.bookOrder = models.map((m) => m.station.id);
      return fakePdf(models.length * 3 + 1, deps.bookOrder.join(','));
    },
    cores: () => 2,
    ...overrides,
  };
  return deps;
}

let n = 0;
function plan(extra: Partial<BuildPlan> = {}): BuildPlan & { dir: string } {
  const dir = join(root, `case-${n++}`);
  mkdirSync(join(dir, 'stations'), { recursive: true });
  return { dir, stationsDir: join(dir, 'stations'), outDir: join(dir, 'out'), year: 2027,
    render: { units: 'm', page: 'a5', imposition: 'none' }, quiet: true, workers: null, projectFile: null, ...extra };
}

function quietEvents(log: string[] = []): BuildEvents {
  return { progress: { stage() {}, tick() {}, clear() {} }, note: (t) => log.push(t), tempCreated() {}, committed() {} };
}

function treeHash(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else out[relative(dir, p)] = createHash('sha256').update(readFileSync(p)).digest('hex');
    }
  };
  walk(dir);
  return out;
}

const SET = [station('a'), station('b', 'secondary', 'a'), station('c'), station('d', 'secondary', 'c')];

describe('buildAlmanac', () => {
  it('builds each station for each year of a range: one site of every station-year, books per year', async () => {
    const p = plan({ years: [2027, 2028, 2029] });
    const books: number[][] = [];
    const deps = stubs(SET, {
      async renderCombinedBook(models) {
        books.push([...new Set(models.map((m) => m.year))]);
        return fakePdf(models.length * 3 + 1, models.map((m) => m.station.id).join(','));
      },
    });
    const site: string[] = [];
    const inner = deps.renderSite.bind(deps);
    deps.renderSite = async (source, ...rest) => {
      site.push(...source.stationYears.map((m) => `${m.station.id}-${m.year}`));
      return inner(source, ...rest);
    };
    const summary = await buildAlmanac(p, deps, quietEvents());
    expect(site).toEqual(['2027', '2028', '2029'].flatMap((y) => ['a', 'b', 'c', 'd'].map((id) => `${id}-${y}`)));
    expect(books).toEqual([[2027], [2028], [2029]]);
    const files = Object.keys(treeHash(p.outDir));
    for (const y of [2027, 2028, 2029]) {
      for (const id of ['a', 'b', 'c', 'd', 'almanac']) expect(files).toContain(`pdf/${id}-${y}.pdf`);
      expect(files).toContain(`site/data/a-${y}.ics`);
    }
    expect(summary).toMatchObject({ year: 2027, years: [2027, 2028, 2029], stations: 4, pdfPages: 3 * (4 * 3 + 13) });
  });

  it('writes every piece into place, in the set order whatever order the results came in', async () => {
    const p = plan();
    const deps = stubs(SET);
    const summary = await buildAlmanac(p, deps, quietEvents());
    expect(deps.siteOrder).toEqual(['a', 'b', 'c', 'd']);
    expect(deps.bookOrder).toEqual(['a', 'b', 'c', 'd']);
    expect(deps.units).toEqual([['a', 'b'], ['c', 'd']]);
    expect(Object.keys(treeHash(p.outDir))).toEqual([
      '.tidewright-output',
      'pdf/a-2027.pdf', 'pdf/almanac-2027.pdf', 'pdf/b-2027.pdf', 'pdf/c-2027.pdf', 'pdf/d-2027.pdf',
      'site/data/a-2027.ics', 'site/data/b-2027.ics', 'site/data/c-2027.ics', 'site/data/d-2027.ics',
      'site/index.html',
    ]);
    expect(summary).toMatchObject({ out: p.outDir, year: 2027, stations: 4, workers: 2, pdfPages: 4 * 3 + 13,
      webPages: 1, files: 11 });
    expect(readdirSync(p.dir).sort()).toEqual(['out', 'stations']);
  });

  it('says once per picture what every kind of book found about the publisher\u2019s pictures, after the last book', async () => {
    const line = (file: string, dpi: number) => ({ file, kind: 'resolution' as const, dpi, text: `${file}: ${dpi} dpi` });
    const log: string[] = [];
    const stream = { id: 'sx', kind: 'stream' } as unknown as AnyStreamStation; // the stubs read nothing else of it
    const deps = stubs(SET, {
      checkSet: () => ({ stations: SET, streams: [stream], problems: [] }),
      computeStreams: (_stations, _streams, year) => [{ station: { id: 'sx' }, year } as unknown as StreamYear],
      async computeStations(request, onStation) {
        for (const id of request.units.flat()) {
          const s = SET.find((x) => x.id === id) ?? sampleStation;
          // every station book and pocket table places the logo; one book's cached outcome says so too
          const model = modelOf(s, request.year);
          onStation({ id, summary: model, model, pdfPages: 3, imageWarnings: [line('logo.png', 200)] });
        }
      },
      async renderStreamBook(_model, _options, warn) {
        warn?.(line('pages/plan.png', 240)); // only the stream book places this one
        return fakePdf(14, 'stream');
      },
      async renderCombinedBook(models, _options, _beside, _signal, _streams, warn) {
        warn?.(line('logo.png', 150)); // printed larger on the combined book's cover
        warn?.(line('cover.jpg', 120));
        warn?.({ file: 'cover.jpg', kind: 'colour', text: 'cover.jpg: in colour' });
        return fakePdf(models.length * 3 + 1, 'combined');
      },
    });
    await buildAlmanac(plan(), deps, quietEvents(log));
    expect(log).toEqual(['logo.png: 150 dpi', 'pages/plan.png: 240 dpi', 'cover.jpg: 120 dpi', 'cover.jpg: in colour']);
  });

  it('with one worker, draws the combined book after the website; with more, beside it', async () => {
    for (const workers of [1, 2]) {
      const order: string[] = [];
      const deps = stubs(SET);
      const site = deps.renderSite;
      await buildAlmanac(plan({ workers }), {
        ...deps,
        async renderSite(...args) {
          order.push('site start');
          await new Promise((r) => setTimeout(r, 30));
          await site(...args);
          order.push('site end');
        },
        async renderCombinedBook(models, _options, beside) {
          order.push(`book start ${beside}`);
          return fakePdf(models.length, 'x');
        },
      }, quietEvents());
      expect(order).toEqual(workers === 1
        ? ['site start', 'site end', 'book start false']
        : ['book start true', 'site start', 'site end']);
    }
  });

  it(`draws them one after the other above ${BESIDE_MAX_STATIONS} stations, to keep the peak memory down`, async () => {
    const many = Array.from({ length: BESIDE_MAX_STATIONS + 1 }, (_, i) => station(`s${i}`));
    let beside: boolean | undefined;
    await buildAlmanac(plan({ workers: 2 }), {
      ...stubs(many),
      async computeStations(request, onStation) {
        for (const id of request.units.flat()) onStation({ id, summary: base, model: base, pdfPages: 1 });
      },
      async renderSite() {},
      async renderCombinedBook(_models, _options, b) {
        beside = b;
        return fakePdf(1, 'x');
      },
    }, quietEvents());
    expect(beside).toBe(false);
  });

  it('names the combined book after the project title', async () => {
    const p = plan({ render: { units: 'm', page: 'a5', imposition: 'none', title: 'Brinewold Bay Almanac' } });
    await buildAlmanac(p, stubs(SET), quietEvents());
    expect(existsSync(join(p.outDir, 'pdf', 'brinewold-bay-almanac-2027.pdf'))).toBe(true);
  });

  it('lists every station problem and writes nothing', async () => {
    const p = plan();
    const problems = [
      new StationFileError('x.yaml', 'timezone', '"Mars/Base" is not a known IANA time zone', 'write Europe/Lisbon'),
      new StationFileError('y.yaml', 'reference', 'no station has the id "q"', 'write reference: a'),
    ];
    const deps = stubs(SET, { checkSet: () => ({ stations: [], problems }) });
    const error = await buildAlmanac(p, deps, quietEvents()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(StationSetInvalid);
    expect((error as StationSetInvalid).problems).toEqual(problems);
    expect(readdirSync(p.dir)).toEqual(['stations']);
  });

  it.each([
    ['a station', { async computeStations() { throw new BuildStepError('station b', new Error('no tide')); } }, 'station b'],
    ['the website', { async renderSite(_source: unknown, siteDir: string) {
      await mkdir(siteDir, { recursive: true });
      await writeFile(join(siteDir, 'half.html'), '<p>half');
      throw Object.assign(new Error('write failed'), { code: 'ENOSPC' });
    } }, 'rendering the website and downloads'],
    ['the combined book', { async renderCombinedBook(): Promise<Buffer> { throw new TypeError('bad glyph'); } },
      'rendering the combined book'],
  ] as [string, Partial<BuildDeps>, string][])('a failure in %s leaves the previous output exactly as it was', async (_what, override, step) => {
    const p = plan();
    await buildAlmanac(p, stubs(SET.slice(0, 1)), quietEvents());
    const before = treeHash(p.outDir);
    const error = await buildAlmanac(p, stubs(SET, override), quietEvents()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(BuildStepError);
    expect((error as BuildStepError).step).toBe(step);
    expect(treeHash(p.outDir)).toEqual(before);
    expect(readdirSync(p.dir).sort()).toEqual(['out', 'stations']);
  });

  it('stops when aborted and removes its temporary folder', async () => {
    const p = plan();
    const abort = new AbortController();
    const deps = stubs(SET, {
      async renderSite() { abort.abort(new Error('interrupted by SIGINT')); },
    });
    const error = await buildAlmanac(p, deps, { ...quietEvents(), signal: abort.signal }).catch((e: unknown) => e);
    expect(String((error as Error).message)).toMatch(/SIGINT/);
    expect(readdirSync(p.dir)).toEqual(['stations']);
  });

  it('reports the temporary folder and the swap to the caller', async () => {
    const p = plan();
    const seen: string[] = [];
    await buildAlmanac(p, stubs(SET), {
      ...quietEvents(),
      tempCreated: (t) => seen.push(`temp ${existsSync(t.temp)} ${relative(p.dir, t.temp).startsWith('.tidewright-tmp-out-')}`),
      committed: (t) => seen.push(`committed ${existsSync(t.temp)} ${existsSync(t.out)}`),
    });
    expect(seen).toEqual(['temp true true', 'committed false true']);
  });

  it('cleans a stale temporary folder first and says so', async () => {
    const p = plan();
    mkdirSync(join(p.dir, '.tidewright-tmp-out-999999999'));
    const log: string[] = [];
    await buildAlmanac(p, stubs(SET), quietEvents(log));
    expect(log).toEqual(['removed .tidewright-tmp-out-999999999, left by an interrupted build']);
    expect(readdirSync(p.dir).sort()).toEqual(['out', 'stations']);
  });

  it('does not touch a previous output when the target is refused', async () => {
    const p = plan({ outDir: '/' });
    await expect(buildAlmanac(p, stubs(SET), quietEvents())).rejects.toThrow(/root of the file system/);
    writeFileSync(join(p.dir, 'file'), 'x');
    await expect(buildAlmanac({ ...p, outDir: join(p.dir, 'file') }, stubs(SET), quietEvents())).rejects.toThrow(/is a file/);
  });
});

describe('work units', () => {
  it('keep a secondary port with its reference port, biggest group first', () => {
    const set = [station('a'), station('b', 'secondary', 'c'), station('c'), station('d', 'secondary', 'c'),
      station('e'), station('f', 'secondary', 'a')];
    expect(workUnits(set, 2)).toEqual([['c', 'b', 'd'], ['a', 'f'], ['e']]);
    expect(workUnits(set, 1)).toEqual([['c', 'b', 'd'], ['a', 'f'], ['e']]);
  });

  it('split a group bigger than an even share', () => {
    const set = [station('a'), ...['b', 'c', 'd', 'e', 'f'].map((id) => station(id, 'secondary', 'a'))];
    expect(workUnits(set, 2)).toEqual([['a', 'b', 'c'], ['d', 'e', 'f']]);
  });

  it('size the pool by cores, capped by the work', () => {
    expect(poolSize(null, 2, 100)).toBe(2);
    expect(poolSize(null, 8, 3)).toBe(3);
    expect(poolSize(4, 2, 100)).toBe(4);
    expect(poolSize(null, 0, 0)).toBe(1);
  });
});

describe('progress', () => {
  it('shows done/total, elapsed and an estimate on one line of a terminal', () => {
    expect(progressLine('stations', 50, 200, 65_000, 60_000)).toBe('stations · 50/200 stations · 1:05 elapsed · about 3:00 left');
    expect(progressLine('website and downloads', 0, undefined, 3_723_000, 0)).toBe('website and downloads · 1:02:03 elapsed');
    expect(clock(59_499)).toBe('0:59');
  });

  it('rewrites one line on a terminal, and prints nothing elsewhere or when quiet', () => {
    let t = 0;
    const written: string[] = [];
    const tty = { isTTY: true, columns: 80, write: (s: string) => written.push(s) };
    const p = createProgress(tty, false, () => t);
    p.stage('stations', 4);
    t = 1000;
    p.tick(1);
    t = 1100;
    p.tick(2); // too soon after the last draw: skipped
    t = 2000;
    p.tick(4);
    p.clear();
    expect(written).toEqual([
      '\r\x1b[Kstations · 0/4 stations · 0:00 elapsed',
      '\r\x1b[Kstations · 1/4 stations · 0:01 elapsed · about 0:03 left',
      '\r\x1b[Kstations · 4/4 stations · 0:02 elapsed',
      '\r\x1b[K',
    ]);
    const other: string[] = [];
    for (const p2 of [createProgress({ isTTY: false, write: (s: string) => other.push(s) }, false),
      createProgress({ isTTY: true, write: (s: string) => other.push(s) }, true)]) {
      p2.stage('stations', 1);
      p2.tick(1);
      p2.clear();
    }
    expect(other).toEqual([]);
  });
});
