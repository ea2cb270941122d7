// Shared by the website tests: real demo station-years from the engine (built once per test file),
// the rarer marks edited into a copy where the demo year has none, and helpers to read built pages.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { buildStationYear, loadStationSet } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';

export const HOSTILE_NAME = '<script>alert("x")</script> Quay & "Pier" <b>';
export const DEMO_DIR = join(import.meta.dirname, '..', '..', 'stations-demo');

/** Station-years of the demo set, straight from the engine. */
export function demoModels<const Ids extends readonly string[]>(ids: Ids, year = 2027): { -readonly [K in keyof Ids]: StationYear } {
  const set = loadStationSet(DEMO_DIR);
  const models = ids.map((id) => {
    const station = set.byId.get(id);
    if (!station) throw new Error(`demo station ${id} is missing from ${DEMO_DIR}`);
    return buildStationYear(station, set, year);
  });
  return models as { -readonly [K in keyof Ids]: StationYear }; // map keeps the length: one model per id, in order
}

/**
 * A copy of a model with one low water below chart datum on the given date: the demo year has none,
 * and the page must show the mark. Only the height changes; everything else is the engine's.
 */
export function withLowWaterBelowDatum(model: StationYear, date: string, height = -0.123): StationYear {
  const copy = structuredClone(model);
  const day = copy.days.find((d) => d.date === date)!;
  const low = day.events.find((e) => e.type === 'low')!;
  const inList = copy.events.find((e) => e.time === low.time)!;
  for (const e of [low, inList]) Object.assign(e, { height, belowDatum: true });
  return copy;
}

/** A copy of a model renamed: another id, and a name and provenance full of markup. */
export function withHostileText(model: StationYear, id = 'odd-name'): StationYear {
  const copy = structuredClone(model);
  copy.station = { ...copy.station, id, name: HOSTILE_NAME, provenance: 'Invented <i>provenance</i>' };
  return copy;
}

export function htmlFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile() && entry.name.endsWith('.html')) out.push(join(entry.parentPath, entry.name));
  }
  return out.sort();
}

export function read(dir: string, path: string): string {
  return readFileSync(join(dir, path), 'utf8');
}

export function rel(dir: string, file: string): string {
  return relative(dir, file);
}

/** The markup of one table row by its id, e.g. `day-14`. */
export function rowById(html: string, id: string): string {
  const start = html.indexOf(`<tr id="${id}"`);
  if (start < 0) throw new Error(`no row ${id}`);
  return html.slice(start, html.indexOf('</tr>', start));
}

/** Visible text of a fragment: tags dropped (visually-hidden spans kept), entities decoded, spaces collapsed. */
/** The text of an HTML fragment (none: empty, so that the expectation on it fails). */
export function textOf(fragment: string | undefined): string {
  return (fragment ?? '')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ')
    .trim();
}
