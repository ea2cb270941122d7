// The work done for one station, in a worker thread (or in-process when no compiled worker exists):
// its year model and its PDF book, written straight into the temporary output folder. (The downloads
// are written by the site renderer, which links them from the station pages.)
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { createEngineContext } from '../../engine/index.js';
import type { EngineContext, SkyEphemeris, StationSet, Station, StationYear } from '../../engine/index.js';
import type { RenderChoices } from './options.js';
import { assertSafeId, stationYearFile } from './paths.js';
import { worstPerFile, type ImageWarning, type ImageWarningSink } from '../../templates/pdf/image-resolution.js';

export interface StationJobDeps {
  buildStationYear(station: Station, set: StationSet, year: number, engine: EngineContext): StationYear | Promise<StationYear>;
  renderStationBook(model: StationYear, options: RenderChoices, warn?: ImageWarningSink): Promise<Buffer>;
  renderPocketTable?(model: StationYear, options: RenderChoices): Promise<Buffer>;
}

export interface StationJobContext {
  set: StationSet;
  year: number;
  tempDir: string; // the build's temporary output folder
  render: RenderChoices;
  engine: EngineContext; // the engine's caches for this unit of work, dropped with it
}

export interface StationOutcome {
  id: string;
  model: StationYear;
  pdfPages: number;
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

export async function runStationJob(id: string, ctx: StationJobContext, deps: StationJobDeps): Promise<StationOutcome> {
  const station = ctx.set.byId.get(assertSafeId(id));
  if (!station) throw new Error(`station "${id}" is not in the station set`);
  const model = await deps.buildStationYear(station, ctx.set, ctx.year, ctx.engine);
  if (model.station.id !== id) throw new Error(`the model built for "${id}" names station "${model.station.id}"`);
  const pdfDir = join(ctx.tempDir, 'pdf');
  await mkdir(pdfDir, { recursive: true });
  const warnings: ImageWarning[] = [];
  const pdf = await deps.renderStationBook(model, ctx.render, (w) => warnings.push(w));
  await writeFile(stationYearFile(pdfDir, id, ctx.year, 'pdf'), pdf);
  let pdfPages = countPdfPages(pdf);
  if (ctx.render.pocket !== false && deps.renderPocketTable) {
    const pocket = await deps.renderPocketTable(model, ctx.render);
    await writeFile(stationYearFile(pdfDir, id, ctx.year, 'pdf').replace(/\.pdf$/, '-pocket.pdf'), pocket);
    pdfPages += countPdfPages(pocket);
  }
  return { id, model, pdfPages, imageWarnings: worstPerFile(warnings) };
}
