// Writes the three downloads of a station-year into a folder; the site links to the same names.
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { eventsCsv } from './csv.js';
import { eventsICalendar } from './icalendar.js';
import { eventsJson } from './json.js';
import { hourlyCsv, windowsCsv, windowsJson } from './windows.js';

export interface ExportFileNames {
  csv: string;
  json: string;
  ics: string;
  hourly: string; // heights on the hour, CSV
  windows: null | { csv: string; json: string }; // only for a station with windows
}

const SAFE_ID = /^[a-z0-9-]+$/;

/** File names of a station-year's downloads; the id is checked so no name can leave the folder. */
export function exportFileNames(model: StationYear): ExportFileNames {
  const id = model.station.id;
  if (!SAFE_ID.test(id) || !Number.isInteger(model.year)) {
    throw new Error(`station id "${id}" / year ${model.year}: ids may hold only a-z, 0-9 and "-"`);
  }
  const base = `${id}-${model.year}`;
  return {
    csv: `${base}-events.csv`, json: `${base}-events.json`, ics: `${base}.ics`, hourly: `${base}-hourly.csv`,
    windows: model.windows.length > 0 ? { csv: `${base}-windows.csv`, json: `${base}-windows.json` } : null,
  };
}

export async function writeExports(
  model: StationYear, dataDir: string, words: Words = wordsFor(), stamp?: number,
): Promise<ExportFileNames> {
  const names = exportFileNames(model);
  await mkdir(dataDir, { recursive: true });
  await Promise.all([
    writeFile(join(dataDir, names.csv), eventsCsv(model, words)),
    writeFile(join(dataDir, names.json), eventsJson(model, words)),
    writeFile(join(dataDir, names.ics), eventsICalendar(model, words, stamp)),
    writeFile(join(dataDir, names.hourly), hourlyCsv(model, words)),
    ...(names.windows
      ? [writeFile(join(dataDir, names.windows.csv), windowsCsv(model, words)),
        writeFile(join(dataDir, names.windows.json), windowsJson(model, words))]
      : []),
  ]);
  return names;
}
