// The build, step by step: check the output target, validate the whole station set, compute every
// station (workers), render the site and the combined book, then swap the finished folder into place.
import { mkdir, readdir, stat, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { firstOf } from '../../engine/index.js';
import type {
  StationFileError, Station, StationYear, AnyStreamStation, StreamYear,
} from '../../engine/index.js';
import { BuildStepError, messageOf, StationSetInvalid } from './failure.js';
import { poolSize, workUnits } from './groups.js';
import type { BuildPlan, RenderChoices } from './options.js';
import { commitOutput, createTemp, discardTemp, planOutput, recoverStale, type OutputTarget } from './output.js';
import { combinedBookName, stationYearFile } from './paths.js';
import type { Progress } from './progress.js';
import { cacheDirFor } from './cache.js';
import { pruneCache, useCache } from './cache-prune.js';
import { stationYearKeys } from './cache-keys.js';
import { siteFilesFolder } from './site-files.js';
import { combinedStations, type CombinedPlan } from './volumes-step.js';
import { siteThemeFolder } from './site-theme.js';
import { countPdfPages, type StationCache, type StationOutcome } from './station-job.js';
import { stationYears, type StationYears } from './station-years.js';
import { sitePageStore } from './site-cache.js';
import type { SiteSource } from '../../templates/site/render.js';
import { worstPerFile, type ImageWarning, type ImageWarningSink } from '../../templates/pdf/image-resolution.js';

export interface ComputeRequest {
  stationsDir: string;
  year: number;
  tempDir: string;
  render: RenderChoices;
  units: string[][];
  workers: number;
  cache?: StationCache; // the build cache and each station-year's key
}

/** The pieces a build is made of; the CLI passes the real ones, tests may pass their own. */
export interface BuildDeps {
  checkSet(dir: string): { stations: Station[]; streams?: AnyStreamStation[]; problems: StationFileError[]; notes?: string[] };
  /** The stream-years of the set's tidal stream stations (few and quick: computed in this thread). */
  computeStreams?(stations: Station[], streams: AnyStreamStation[], year: number): StreamYear[];
  computeStations(request: ComputeRequest, onStation: (outcome: StationOutcome) => void, signal?: AbortSignal): Promise<void>;
  /** The site into siteDir, with every station-year's downloads (CSV, JSON, iCalendar) inside it, in siteDir/data. */
  renderSite(source: SiteSource, siteDir: string, options: RenderChoices, siteFiles?: string, streams?: StreamYear[]): Promise<unknown>;
  /** `beside`: the caller is rendering the website at the same time (use another thread if there is one). */
  /** `warn` hears of each publisher's picture that would print blurry (or, for the press, in greys). */
  renderCombinedBook(models: StationYear[], options: RenderChoices, beside: boolean, signal?: AbortSignal, streams?: StreamYear[],
    warn?: ImageWarningSink): Promise<Buffer>;
  /** The PDF book of one stream-year. */
  renderStreamBook?(model: StreamYear, options: RenderChoices, warn?: ImageWarningSink): Promise<Buffer>;
  cores(): number;
}

export interface BuildEvents {
  progress: Progress;
  note(text: string): void; // something worth a line on stderr (stale folders cleaned…)
  tempCreated(target: OutputTarget): void; // from here until `committed`, the temp folder is ours to remove
  committed(target: OutputTarget): void;
  signal?: AbortSignal;
}

export interface BuildSummary {
  out: string;
  year: number; // the first year
  years: number[];
  stations: number;
  workers: number;
  pdfPages: number;
  webPages: number;
  files: number;
  bytes: number;
  ms: number;
  stepMs: Record<string, number>;
}

/** Above this many stations the combined book waits for the website, to keep the peak memory down. */
export const BESIDE_MAX_STATIONS = 100;

async function treeStats(dir: string): Promise<{ files: number; bytes: number; html: number }> {
  const total = { files: 0, bytes: 0, html: 0 };
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) {
      const sub = await treeStats(path);
      total.files += sub.files;
      total.bytes += sub.bytes;
      total.html += sub.html;
    } else {
      total.files++;
      total.bytes += (await stat(path)).size;
      if (entry.name.endsWith('.html')) total.html++;
    }
  }
  return total;
}

async function step<T>(name: string, times: Record<string, number>, work: () => Promise<T>): Promise<T> {
  const start = performance.now();
  try {
    return await work();
  } catch (error) {
    throw error instanceof BuildStepError ? error : new BuildStepError(name, error);
  } finally {
    times[name] = (times[name] ?? 0) + performance.now() - start;
  }
}

/** Waits for every one (none may still be writing when the temporary folder goes), then throws the first error. */
async function allSettledOrFirstError(work: Promise<unknown>[]): Promise<void> {
  const results = await Promise.allSettled(work);
  const failed = results.find((r): r is PromiseRejectedResult => r.status === 'rejected');
  if (failed) throw failed.reason;
}

/** One year's station-years, in the set's order (file-name order), whichever worker finished first. */
async function computeYear(
  plan: BuildPlan, deps: BuildDeps, events: BuildEvents, times: Record<string, number>,
  job: { year: number; tempDir: string; units: string[][]; workers: number; cacheDir: string }, stations: readonly Station[],
  found: StationYears): Promise<{ pdfPages: number; imageWarnings: ImageWarning[]; combined: CombinedPlan }> {
  const outcomes = new Map<string, StationOutcome>();
  const imageWarnings: ImageWarning[] = [];
  const several = (plan.years ?? [plan.year]).length > 1;
  events.progress.stage(several ? `computing ${job.year}` : 'computing', stations.length);
  const { cacheDir, ...work } = job;
  const cache = { dir: cacheDir, keys: Object.fromEntries(stationYearKeys(stations, job.year, plan.render)) };
  await step('computing the stations', times, () => deps.computeStations(
    { stationsDir: plan.stationsDir, render: plan.render, ...work, cache },
    (outcome) => {
      outcomes.set(outcome.id, outcome);
      imageWarnings.push(...outcome.imageWarnings ?? []);
      events.progress.tick(outcomes.size);
    },
    events.signal,
  ));
  const missing = stations.filter((s) => !outcomes.has(s.id)).map((s) => s.id);
  if (missing.length > 0) throw new BuildStepError('computing the stations', new Error(`no result for ${missing.join(', ')}`));
  for (const s of stations) found.add(outcomes.get(s.id)!, cache.keys[s.id]); // in the set's order
  const combined = await step('planning the combined volumes', times,
    () => combinedStations(stations, outcomes, { ...plan, year: job.year }, cache, job.tempDir, job.workers, events.signal));
  return {
    combined,
    pdfPages: stations.reduce((n, s) => n + outcomes.get(s.id)!.pdfPages, 0),
    imageWarnings,
  };
}

export async function buildAlmanac(plan: BuildPlan, deps: BuildDeps, events: BuildEvents): Promise<BuildSummary> {
  const started = performance.now();
  const times: Record<string, number> = {};
  const target = planOutput(plan.outDir, plan.stationsDir);
  for (const note of recoverStale(target)) events.note(note);

  events.progress.stage('checking the station files');
  const checked = deps.checkSet(plan.stationsDir);
  for (const note of checked.notes ?? []) events.note(note);
  if (checked.problems.length > 0) throw new StationSetInvalid(checked.problems);
  const stations = checked.stations;
  const years = plan.years ?? [plan.year];
  const streamStations = checked.streams ?? [];
  const siteFiles = siteFilesFolder(plan.stationsDir, [...stations, ...streamStations].map((s) => s.id));
  const siteTheme = siteThemeFolder(plan.stationsDir);

  createTemp(target);
  events.tempCreated(target);
  const cacheDir = cacheDirFor(target.out);
  const cacheUse = useCache(cacheDir);
  try {
    const units = workUnits(stations, plan.workers ?? deps.cores());
    const workers = poolSize(plan.workers, deps.cores(), units.length);
    // Year after year: each year's station-years, then its stream-years and their books.
    const found = stationYears(cacheDir); // summaries in memory, models read from the cache when drawn
    const streamModels: StreamYear[] = [];
    // every book places the publisher's pictures (station books, pocket tables, stream books, the combined
    // book or its volumes): one line per picture, said once the last book is drawn
    const imageWarnings: ImageWarning[] = [];
    const warn: ImageWarningSink = (w) => imageWarnings.push(w);
    let pdfPages = 0;
    const combinedByYear = new Map<number, CombinedPlan>(); // each year's combined book, or volumes drawn from the cache
    for (const year of years) {
      const computed = await computeYear(plan, deps, events, times,
        { year, tempDir: target.temp, units, workers, cacheDir }, stations, found);
      combinedByYear.set(year, computed.combined);
      imageWarnings.push(...computed.imageWarnings);
      pdfPages += computed.pdfPages;
      const yearStreams = streamStations.length > 0 && deps.computeStreams
        ? await step('computing the stream stations', times, async () => deps.computeStreams!(stations, streamStations, year))
        : [];
      streamModels.push(...yearStreams);
      if (yearStreams.length > 0 && deps.renderStreamBook) {
        await step('rendering the stream books', times, async () => {
          const pdfDir = join(target.temp, 'pdf');
          await mkdir(pdfDir, { recursive: true });
          for (const model of yearStreams) {
            const pdf = await deps.renderStreamBook!(model, plan.render, warn);
            await writeFile(stationYearFile(pdfDir, model.station.id, year, 'pdf'), pdf);
            pdfPages += countPdfPages(pdf);
          }
        });
      }
    }

    // With more than one worker the combined book is drawn beside the website, else after it. The
    // combined book's worker holds its own copy of every model (about 0.85 MiB each) and the whole PDF,
    // so large sets draw them one after the other (measured when the site still rendered in one
    // Eleventy run, 200 stations: 2.4 GiB peak beside, 1.9 GiB after; the threshold wants re-measuring).
    // One combined book per year, each from that year's models.
    const volumes = [...combinedByYear.values()].some((c) => c.volumes);
    const beside = volumes || (workers > 1 && stations.length <= BESIDE_MAX_STATIONS);
    const name = combinedBookName(plan.render.title, stations.map((s) => s.id));
    const pages = sitePageStore(cacheDir, found.keyOf, siteTheme ?? undefined);
    const source: SiteSource = { stationYears: found.summaries, model: found.model, pages };
    const site = (): Promise<unknown> => step('rendering the website and downloads', times,
      () => deps.renderSite(source, join(target.temp, 'site'),
        siteTheme === null ? plan.render : { ...plan.render, siteTheme }, siteFiles ?? undefined, streamModels));
    const book = (): Promise<void> => step('rendering the combined book', times, async () => {
      for (const year of years) {
        const combined = combinedByYear.get(year);
        if (combined?.plan.mode === 'none') continue;
        if (combined?.volumes) {
          pdfPages += await combined.draw(warn);
          continue;
        }
        // one volume's worth of station-years at most (a larger set is bound in volumes, read one by one)
        const models = found.summaries.filter((m) => m.year === year).map((sy) => found.model(sy));
        const pdf = await deps.renderCombinedBook(models, plan.render, beside, events.signal,
          streamModels.filter((m) => m.year === year), warn);
        await mkdir(join(target.temp, 'pdf'), { recursive: true });
        await writeFile(stationYearFile(join(target.temp, 'pdf'), name, year, 'pdf'), pdf);
        pdfPages += countPdfPages(pdf);
      }
    });
    if (beside) {
      events.progress.stage('website, downloads and combined book');
      await allSettledOrFirstError([book(), site()]);
    } else {
      events.progress.stage('website and downloads');
      await site();
      events.signal?.throwIfAborted();
      events.progress.stage('combined book');
      await book();
    }
    events.signal?.throwIfAborted();
    for (const w of worstPerFile(imageWarnings)) events.note(w.text);

    const tree = await step('counting the output', times, () => treeStats(target.temp));
    events.progress.clear();
    commitOutput(target);
    events.committed(target);
    // What this build did not use goes (unless another build is using the cache right now).
    if (cacheUse.alone()) {
      try {
        await step('pruning the build cache', times, async () => pruneCache(cacheDir, cacheUse.since));
      } catch (error) {
        events.note(`could not remove unused entries of the build cache ${cacheDir} (${messageOf(error)}); the build itself is complete`);
      }
    }
    return {
      out: target.out, year: firstOf(years, 'years of the build'), years, stations: stations.length, workers, pdfPages, webPages: tree.html,
      files: tree.files, bytes: tree.bytes, ms: performance.now() - started, stepMs: times,
    };
  } catch (error) {
    events.progress.clear();
    discardTemp(target);
    throw error;
  } finally {
    cacheUse.release();
  }
}
