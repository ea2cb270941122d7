// Writes the three downloads of a station-year into a folder; the site links to the same names.
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { StationYear } from '../../engine/types.js';
import type { Units } from '../site/format.js';
import { eventsCsv } from './csv.js';
import { eventsICalendar } from './icalendar.js';
import { eventsJson } from './json.js';

export interface ExportFileNames {
  csv: string;
  json: string;
  ics: string;
}

const SAFE_ID = /^[a-z0-9-]+$/;

/** File names of a station-year's downloads; the id is checked so no name can leave the folder. */
export function exportFileNames(model: StationYear): ExportFileNames {
  const id = model.station.id;
  if (!SAFE_ID.test(id) || !Number.isInteger(model.year)) {
    throw new Error(`station id "${id}" / year ${model.year}: ids may hold only a-z, 0-9 and "-"`);
  }
  return { csv: `${id}-${model.year}-events.csv`, json: `${id}-${model.year}-events.json`, ics: `${id}-${model.year}.ics` };
}

export async function writeExports(
  model: StationYear, dataDir: string, options: { units?: Units } = {},
): Promise<ExportFileNames> {
  const names = exportFileNames(model);
  const units = options.units ?? 'm';
  await mkdir(dataDir, { recursive: true });
  await Promise.all([
    writeFile(join(dataDir, names.csv), eventsCsv(model, units)),
    writeFile(join(dataDir, names.json), eventsJson(model)),
    writeFile(join(dataDir, names.ics), eventsICalendar(model, units)),
  ]);
  return names;
}
