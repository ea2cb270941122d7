// Drawing one combined volume from the models kept in the build cache: only this volume's models are
// read (and a compact secondary port's reference, for its worked example), then dropped. A volume
// whose stations, place and choices are unchanged is copied from the cache instead.
import { writeFile } from 'node:fs/promises';
import { differenceExample, itemAt } from '../../engine/index.js';
import type { ReferenceStation, SecondaryStation, StationYear } from '../../engine/index.js';
import type { VolumeEntry, VolumeStation, VolumeText } from '../../templates/pdf/volume.js';
import { resultEvent, type WorkedExample } from '../../templates/pdf/worked-example.js';
import { worstPerFile, type ImageWarning, type ImageWarningSink } from '../../templates/pdf/image-resolution.js';
import { readEntry, writeEntry } from './cache.js';
import type { RenderChoices } from './options.js';
import { cachedModel } from './station-years.js';

export interface VolumeJob {
  index: number; // 0-based
  text: VolumeText;
  stations: { id: string; key: string; compact: boolean; reference?: { id: string; key: string } }[];
  file: string; // where the PDF goes (in the build's temporary folder)
  key: string; // the volume's own cache key
}

export interface VolumeResult {
  index: number;
  entries: VolumeEntry[];
  pages: number;
  cached: boolean;
  imageWarnings?: ImageWarning[]; // the publisher's pictures that print blurry (or in greys), one per picture
}

export interface VolumeJobDeps {
  renderVolume(stations: VolumeStation[], options: RenderChoices & { warn?: ImageWarningSink }, text: VolumeText): Promise<{ pdf: Buffer; entries: VolumeEntry[] }>;
  countPages(pdf: Buffer): number;
}

/** The first high water at the reference port from its first spring tide of the year, worked through. */
function workedExample(model: StationYear, reference: StationYear): WorkedExample | null {
  if (model.station.kind !== 'secondary' || reference.station.kind !== 'reference') return null;
  const spring = reference.springNeap.find((m) => m.kind === 'spring');
  const from = spring ? `${spring.date}T00:00:00Z` : reference.events[0]?.time;
  if (from === undefined) return null;
  const example = differenceExample(reference.events, reference.station as ReferenceStation, model.station as SecondaryStation, from);
  if (example === null) return null;
  return { example, highWater: itemAt(reference.events, example.referenceIndex, 'reference events'), lowWater: itemAt(reference.events, example.lowIndex, 'reference events'),
    result: resultEvent(model, example.time) };
}

export async function runVolumeJob(job: VolumeJob, cacheDir: string, render: RenderChoices, deps: VolumeJobDeps): Promise<VolumeResult> {
  const hit = readEntry(cacheDir, job.key, ['volume.pdf']);
  const meta = hit?.meta as { entries?: VolumeEntry[]; pages?: number; imageWarnings?: ImageWarning[] } | undefined;
  if (hit && Array.isArray(meta?.entries) && typeof meta.pages === 'number') {
    await writeFile(job.file, hit.files['volume.pdf']);
    return { index: job.index, entries: meta.entries, pages: meta.pages, cached: true, ...(meta.imageWarnings && { imageWarnings: meta.imageWarnings }) };
  }
  const models = new Map(job.stations.map((s) => [s.id, cachedModel(cacheDir, s.id, s.key)]));
  const stations: VolumeStation[] = job.stations.map((s) => {
    const model = models.get(s.id)!;
    if (!s.compact || s.reference === undefined) return { model, compact: s.compact, worked: null };
    const reference = models.get(s.reference.id) ?? cachedModel(cacheDir, s.reference.id, s.reference.key);
    return { model, compact: true, worked: workedExample(model, reference) };
  });
  const warnings: ImageWarning[] = [];
  const { pdf, entries } = await deps.renderVolume(stations, { ...render, warn: (w) => warnings.push(w) }, job.text);
  models.clear();
  await writeFile(job.file, pdf);
  const pages = deps.countPages(pdf);
  const imageWarnings = worstPerFile(warnings);
  writeEntry(cacheDir, job.key, { 'volume.pdf': pdf }, { entries, pages, imageWarnings });
  return { index: job.index, entries, pages, cached: false, imageWarnings };
}
