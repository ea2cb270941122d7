// The work done for one station, in a worker thread (or in-process when no compiled worker exists):
// its year model and its PDF book, written straight into the temporary output folder. (The downloads
// are written by the site renderer, which links them from the station pages.)
import { mkdir, writeFile } from 'node:fs/promises';
import type { SectionPages } from '../../templates/pdf/volume.js';
import { summaryOf, type StationYearSummary } from '../../templates/site/summary.js';
import { readEntry, writeEntry } from './cache.js';
import { messageOf } from './failure.js';
import { join } from 'node:path';
import { createEngineContext } from '../../engine/index.js';
import type { EngineContext, SkyEphemeris, StationSet, Station, StationYear } from '../../engine/index.js';
import type { RenderChoices } from './options.js';
import { assertSafeId, stationYearFile } from './paths.js';
import { worstPerFile, type ImageWarning, type ImageWarningSink } from '../../templates/pdf/image-resolution.js';

export interface StationJobDeps {
  buildStationYear(station: Station, set: StationSet, year: number, engine: EngineContext): StationYear | Promise<StationYear>;
  renderStationBook(model: StationYear, options: RenderChoices, warn?: ImageWarningSink): Promise<Buffer>;
  renderPocketTable?(model: StationYear, options: RenderChoices, warn?: ImageWarningSink): Promise<Buffer>;
  /** Pages of the station's section in a combined volume (for filling volumes before drawing them). */
  sectionPages?(model: StationYear, options: RenderChoices): SectionPages;
}

/** Where the build cache is and each station-year's key in it (cli/build/cache-keys.ts). */
export interface StationCache {
  dir: string;
  keys: Readonly<Record<string, string>>;
}

export interface StationJobContext {
  set: StationSet;
  year: number;
  tempDir: string; // the build's temporary output folder
  render: RenderChoices;
  engine: EngineContext; // the engine's caches for this unit of work, dropped with it
  cache?: StationCache; // reuse unchanged station-years, and keep every model on disk for the volumes
}

export interface StationOutcome {
  id: string;
  summary: StationYearSummary; // what the index and the volumes' plan need; the model itself stays in the cache
  model?: StationYear; // only from a job without a cache to keep it in
  pdfPages: number;
  sections?: SectionPages;
  cached?: boolean; // reused from the build cache
  imageWarnings?: ImageWarning[]; // pictures of the book that would print below 300 dpi, one per file
}

/**
 * The engine's caches for one unit of work (predictors, 19 years of a reference port's events for its
 * datums), sharing the Sun's and Moon's positions of the worker: dropped when the unit is done, so
 * they do not grow with every station a worker has computed.
 */
export function unitEngine(sky: SkyEphemeris): EngineContext {
  return createEngineContext({ sky });
}

/** Pages of a PDF written by pdfkit (page objects are plain dictionaries, never in object streams). */
export function countPdfPages(pdf: Buffer): number {
  const text = pdf.toString('latin1');
  return text.match(/\/Type\s*\/Page(?![a-zA-Z])/g)?.length ?? 0;
}

/** The model as every renderer sees it: through JSON, as the cache hands it back, so cached and fresh builds match. */
function throughJson(model: StationYear): { model: StationYear; json: Buffer } {
  const json = Buffer.from(JSON.stringify(model));
  return { model: JSON.parse(json.toString('utf8')) as StationYear, json };
}

interface CachedMeta { pdfPages: number; summary: StationYearSummary; sections?: SectionPages; imageWarnings?: ImageWarning[] }

export async function runStationJob(id: string, ctx: StationJobContext, deps: StationJobDeps): Promise<StationOutcome> {
  const station = ctx.set.byId.get(assertSafeId(id));
  if (!station) throw new Error(`station "${id}" is not in the station set`);
  const pdfDir = join(ctx.tempDir, 'pdf');
  await mkdir(pdfDir, { recursive: true });
  const bookFile = stationYearFile(pdfDir, id, ctx.year, 'pdf');
  const pocketFile = bookFile.replace(/\.pdf$/, '-pocket.pdf');
  const pocket = ctx.render.pocket !== false && deps.renderPocketTable !== undefined;
  const key = ctx.cache?.keys[id];
  const names = ['model.json', 'book.pdf', ...(pocket ? ['pocket.pdf'] as const : [])] as const;
  const hit = ctx.cache && key !== undefined ? readEntry(ctx.cache.dir, key, names) : null;
  if (hit) {
    const meta = hit.meta as CachedMeta | null;
    if (meta?.summary?.station?.id === id && typeof meta.pdfPages === 'number') {
      await writeFile(bookFile, hit.files['book.pdf']);
      if (pocket) await writeFile(pocketFile, hit.files['pocket.pdf']);
      return { id, summary: meta.summary, pdfPages: meta.pdfPages, ...(meta.sections && { sections: meta.sections }),
        ...(meta.imageWarnings && { imageWarnings: meta.imageWarnings }), cached: true };
    }
  }
  const built = await deps.buildStationYear(station, ctx.set, ctx.year, ctx.engine);
  if (built.station.id !== id) throw new Error(`the model built for "${id}" names station "${built.station.id}"`);
  const { model, json } = throughJson(built);
  const warnings: ImageWarning[] = [];
  const pdf = await deps.renderStationBook(model, ctx.render, (w) => warnings.push(w));
  await writeFile(bookFile, pdf);
  let pdfPages = countPdfPages(pdf);
  const files: Record<string, Buffer> = { 'model.json': json, 'book.pdf': pdf };
  if (pocket) {
    const sheet = await deps.renderPocketTable!(model, ctx.render, (w) => warnings.push(w));
    await writeFile(pocketFile, sheet);
    pdfPages += countPdfPages(sheet);
    files['pocket.pdf'] = sheet;
  }
  const sections = deps.sectionPages?.(model, ctx.render);
  const imageWarnings = worstPerFile(warnings);
  const summary = summaryOf(model);
  if (ctx.cache && key !== undefined) {
    const cacheDir = ctx.cache.dir;
    try {
      const meta: CachedMeta = { pdfPages, summary, imageWarnings, ...(sections && { sections }) };
      writeEntry(cacheDir, key, files, meta);
    } catch (error) {
      // the cause (a full disk…) is named in the message itself: errors cross from the worker as text
      throw new Error(`could not write the build cache in ${cacheDir}: ${messageOf(error)}; the combined volumes read the models from it: check the disk has space and the folder is writable`);
    }
  }
  // With a cache the model stays there (the site and the volumes read it back); without one it travels.
  return { id, summary, pdfPages, imageWarnings, ...(sections && { sections }), ...(!(ctx.cache && key !== undefined) && { model }) };
}
