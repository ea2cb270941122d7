// A station set: every station file of one folder, ids unique, each secondary port's reference
// resolved to a reference port of the same set.

import { readdirSync, statSync } from 'node:fs';
import { readTextFile } from '../read-text.js';
import { join } from 'node:path';
import { StationFileError } from '../errors.js';
import type { Station } from '../types.js';
import type { AnyStreamStation } from '../streams/types.js';
import { checkStationText, parseAnyStation, parseStation } from './parse.js';
import { streamSetProblems } from './stream-set.js';
import { STATION_ID_PATTERN } from './schema.js';
import { nearestName } from './suggest.js';

export interface StationSet {
  dir: string;
  stations: Station[]; // tide stations (reference and secondary ports)
  byId: Map<string, Station>;
  streams?: AnyStreamStation[]; // tidal stream stations of the same folder
}

/** The optional project file that lives beside the stations (title, publisher…): not a station. */
export const PROJECT_FILE_NAME = 'tidewright.yaml';

/** The most a station file may hold: a file with every constituent and long comments is about 10 KiB. */
export const MAX_STATION_FILE_BYTES = 256 * 1024;

function readStationText(path: string): string {
  const result = readTextFile(path, MAX_STATION_FILE_BYTES, 'a station .yaml file');
  if ('text' in result) return result.text;
  throw new StationFileError(path, '(file)', result.problem, result.fix);
}

/** One station file from disk; the first problem is thrown as a StationFileError. */
export function loadStationFile(path: string): Station {
  return parseStation(readStationText(path), path);
}

/** One tide or stream station file from disk; the first problem is thrown as a StationFileError. */
export function loadAnyStationFile(path: string): Station | AnyStreamStation {
  return parseAnyStation(readStationText(path), path);
}

/** The station files of a folder, in name order (hidden files and the project file left out). */
export function stationFilesIn(dir: string): string[] {
  let names: string[];
  try {
    if (!statSync(dir).isDirectory()) {
      throw new StationFileError(dir, '(folder)', 'is a file, not a folder', 'give the folder that holds the station .yaml files');
    }
    names = readdirSync(dir);
  } catch (error) {
    if (error instanceof StationFileError) throw error;
    throw new StationFileError(dir, '(folder)', 'does not exist or cannot be read', 'give the folder that holds the station .yaml files, e.g. --stations stations-demo');
  }
  const files = names
    .filter((name) => /\.ya?ml$/i.test(name) && !name.startsWith('.') && name !== PROJECT_FILE_NAME)
    .sort()
    .map((name) => join(dir, name));
  if (files.length === 0) {
    throw new StationFileError(dir, '(folder)', 'holds no station files (*.yaml)', 'put one .yaml file per station in this folder');
  }
  return files;
}

/**
 * Duplicate ids and unresolvable references among stations that each passed on their own.
 * `failedIds` maps the ids of files that have problems of their own to those files: a reference to
 * one of them is not reported again (its file's problems already are), and typos are matched against them.
 */
export function setProblems(
  dir: string,
  stations: readonly Station[],
  failedIds: ReadonlyMap<string, string> = new Map(),
): StationFileError[] {
  const problems: StationFileError[] = [];
  const byId = new Map<string, Station>();
  for (const station of stations) {
    const first = byId.get(station.id);
    if (first) {
      problems.push(
        new StationFileError(
          station.sourceFile ?? dir,
          'id',
          `"${station.id}" is also the id of ${first.sourceFile ?? 'another station'}`,
          'give each station its own id (file names and web addresses are made from it)',
        ),
      );
    } else {
      byId.set(station.id, station);
    }
  }
  // Ids a reference may be corrected to: each once, and only well-formed ones (a file with problems
  // of its own may declare an id that is not one).
  const referenceIds = [...new Set([...stations.filter((s) => s.kind === 'reference').map((s) => s.id), ...failedIds.keys()])]
    .filter((id) => STATION_ID_PATTERN.test(id) && id.length <= 64);
  for (const station of stations) {
    if (station.kind !== 'secondary' || byId.get(station.id) !== station) continue;
    if (!byId.has(station.reference) && failedIds.has(station.reference)) continue;
    const problem = referenceProblem(dir, station, byId, referenceIds);
    if (problem) problems.push(problem);
  }
  return problems;
}

function referenceProblem(
  dir: string,
  station: Extract<Station, { kind: 'secondary' }>,
  byId: ReadonlyMap<string, Station>,
  referenceIds: readonly string[],
): StationFileError | undefined {
  const file = station.sourceFile ?? dir;
  const target = byId.get(station.reference);
  if (station.reference === station.id) {
    return new StationFileError(file, 'reference', `names the station itself ("${station.id}")`, 'write the id of a reference port in the same folder');
  }
  if (!target) {
    const nearest = nearestName(station.reference, referenceIds);
    const fix = nearest
      ? `did you mean ${nearest}? write reference: ${nearest}`
      : referenceIds.length > 0
        ? `write the id of one of the reference ports here: ${referenceIds.slice(0, 12).join(', ')}${referenceIds.length > 12 ? ', …' : ''}`
        : 'add the reference port\'s station file to this folder';
    return new StationFileError(file, 'reference', `no station in ${dir} has the id "${station.reference}"`, fix);
  }
  if (target.kind === 'reference') return undefined;
  // Follow the chain of secondary ports: it either reaches a reference port or loops.
  const chain = [station.id];
  let current: Station | undefined = target;
  while (current && current.kind === 'secondary' && !chain.includes(current.id)) {
    chain.push(current.id);
    current = byId.get(current.reference);
  }
  if (current && chain.includes(current.id)) {
    return new StationFileError(
      file,
      'reference',
      `the references go round in a loop (${[...chain, current.id].join(' → ')})`,
      'point each secondary port at a reference port (kind: reference)',
    );
  }
  const ultimate = current?.kind === 'reference' ? current.id : undefined;
  return new StationFileError(
    file,
    'reference',
    `"${target.id}" is itself a secondary port; differences are only taken from a reference port`,
    ultimate ? `write reference: ${ultimate} (with differences measured against ${ultimate})` : 'write the id of a reference port',
  );
}

export interface StationSetCheck {
  dir: string;
  stations: Station[]; // the stations that passed on their own
  streams: AnyStreamStation[]; // the stream stations that passed on their own
  files: string[];
  problems: StationFileError[];
}

/** Every problem of a folder of station files: each file, then ids and references across the set. */
export function checkStationSet(dir: string): StationSetCheck {
  const files = stationFilesIn(dir);
  const stations: Station[] = [];
  const streams: AnyStreamStation[] = [];
  const problems: StationFileError[] = [];
  const failedIds = new Map<string, string>();
  for (const file of files) {
    let text: string;
    try {
      text = readStationText(file);
    } catch (error) {
      if (error instanceof StationFileError) {
        problems.push(error);
        continue;
      }
      throw error;
    }
    const result = checkStationText(text, file);
    problems.push(...result.problems);
    if (result.station) stations.push(result.station);
    else if (result.stream) streams.push(result.stream);
    else if (result.declaredId !== undefined && !failedIds.has(result.declaredId)) failedIds.set(result.declaredId, file);
  }
  problems.push(...setProblems(dir, stations, failedIds));
  problems.push(...streamSetProblems(dir, stations, streams, failedIds));
  return { dir, stations, streams, files, problems };
}

/** A whole station set, references resolved; the first problem is thrown as a StationFileError. */
export function loadStationSet(dir: string): StationSet {
  const { stations, streams, problems } = checkStationSet(dir);
  if (problems[0]) throw problems[0];
  return { dir, stations, byId: new Map(stations.map((s) => [s.id, s])), streams };
}
