// One station file: YAML text → a validated Station, or every problem found in it.

import { parseDocument, type YAMLError } from 'yaml';
import { StationFileError } from '../errors.js';
import type { ConstituentConstant, ReferenceStation, SecondaryStation, Station } from '../types.js';
import type { AnyStreamStation } from '../streams/types.js';
import { describeValue, issuesToErrors } from './issues.js';
import {
  CANONICAL_CONSTITUENT, FIELD_HELP, STATION_KINDS, referencePortSchema, secondaryPortSchema, type StationKind,
} from './schema.js';
import { nearestName } from './suggest.js';
import { streamStationSchema, streamSecondarySchema } from './stream-schema.js';

export interface StationFileCheck {
  station?: Station; // present only when the file has no problem (a tide station)
  stream?: AnyStreamStation; // present only when the file has no problem (a stream station)
  declaredId?: string; // the id the file gives, even when it has problems (for set-wide messages)
  problems: StationFileError[];
}

const YAML_FIXES: Readonly<Record<string, string>> = {
  DUPLICATE_KEY: 'write each key only once',
  TAB_AS_INDENT: 'indent with spaces, not tabs',
  BAD_INDENT: 'indent nested keys by the same number of spaces and close every [ or {',
  MISSING_CHAR: 'close every [ { and quote you open',
  MULTILINE_IMPLICIT_KEY: 'write key: value on one line, with a space after the colon',
  BLOCK_AS_IMPLICIT_KEY: 'put a nested map on the lines below its key, indented',
};

function yamlProblem(file: string, error: YAMLError): StationFileError {
  const where = error.linePos?.[0];
  const field = where ? `line ${where.line}, column ${where.col}` : '(file)';
  if (error.code === 'MULTIPLE_DOCS') {
    return new StationFileError(file, field, 'a second YAML document starts here (a --- line)', 'keep one station per file and remove the --- line');
  }
  const firstLine = error.message.split('\n')[0] ?? error.message;
  const what = firstLine.replace(/ at line \d+, column \d+:?$/, '');
  const advice = YAML_FIXES[error.code] ?? 'check the indentation, colons and quotes (each field is written key: value)';
  const fix = error.code === 'DUPLICATE_KEY' ? `${advice} (keep this line or the earlier one)` : `${advice}, on that line or just above it`;
  return new StationFileError(file, field, `YAML syntax error: ${what}`, fix);
}

function isPlainMap(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/** The kind the file says, or (with a problem) the kind its keys suggest, so the rest still gets checked. */
function kindOf(file: string, raw: Record<string, unknown>): { kind: StationKind; problem?: StationFileError } {
  const said = raw.kind;
  if (typeof said === 'string' && (STATION_KINDS as readonly string[]).includes(said)) return { kind: said as StationKind };
  const stream = 'flood_direction' in raw;
  const secondary = 'differences' in raw || 'reference' in raw;
  const guessed: StationKind = stream ? (secondary ? 'stream-secondary' : 'stream') : secondary ? 'secondary' : 'reference';
  const fix = FIELD_HELP.kind ?? '';
  if (said === undefined) return { kind: guessed, problem: new StationFileError(file, 'kind', 'is missing', fix) };
  const nearest = typeof said === 'string' ? STATION_KINDS.find((k) => k === nearestName(said, STATION_KINDS)) : undefined;
  const problem = new StationFileError(
    file,
    'kind',
    `${describeValue(said)} is not a kind of station`,
    nearest ? `did you mean ${nearest}? write kind: ${nearest}` : fix,
  );
  return { kind: nearest ?? guessed, problem };
}

/** Constituents under their canonical names (an alias such as LAM2 becomes LAMBDA2), each listed once. */
function canonicalConstituents<C = ConstituentConstant>(
  file: string,
  listed: Record<string, C>,
): { constituents: Record<string, C>; problems: StationFileError[] } {
  const constituents: Record<string, C> = {};
  const writtenAs = new Map<string, string>();
  const problems: StationFileError[] = [];
  for (const [name, constant] of Object.entries(listed)) {
    const canonical = CANONICAL_CONSTITUENT.get(name) ?? name;
    const earlier = writtenAs.get(canonical);
    if (earlier !== undefined) {
      problems.push(
        new StationFileError(file, `constituents.${name}`, `is another name for ${canonical}, which is already listed as ${earlier}`, 'list each constituent once'),
      );
      continue;
    }
    writtenAs.set(canonical, name);
    constituents[canonical] = constant;
  }
  return { constituents, problems };
}

/** Every problem of one station file's text (and the station when there is none). */
export function checkStationText(text: string, file: string): StationFileCheck {
  const doc = parseDocument(text, { prettyErrors: true, uniqueKeys: true });
  const firstError = doc.errors[0];
  if (firstError) return { problems: [yamlProblem(file, firstError)] };
  let raw: unknown;
  try {
    raw = doc.toJS({ maxAliasCount: 100 });
  } catch (error) {
    const what = error instanceof Error ? error.message.split('\n')[0] : String(error);
    return { problems: [new StationFileError(file, '(file)', `YAML could not be read: ${what}`, 'write plain key: value lines without aliases')] };
  }
  if (!isPlainMap(raw)) {
    const what = raw === null || raw === undefined ? 'is empty' : `holds ${describeValue(raw)}, not a station`;
    return { problems: [new StationFileError(file, '(file)', what, FIELD_HELP[''] ?? '')] };
  }
  const declaredId = typeof raw.id === 'string' ? raw.id : undefined;
  const { kind, problem: kindProblem } = kindOf(file, raw);
  const problems: StationFileError[] = kindProblem ? [kindProblem] : [];
  const input = { ...raw, kind };
  if (kind === 'stream' || kind === 'stream-secondary') {
    const result = (kind === 'stream' ? streamStationSchema : streamSecondarySchema).safeParse(input);
    if (!result.success) problems.push(...issuesToErrors(file, raw, result.error.issues, kind));
    if (problems.length > 0 || !result.success) return { declaredId, problems };
    if (result.data.kind === 'stream') {
      const { constituents, problems: duplicates } = canonicalConstituents(file, result.data.constituents);
      if (duplicates.length > 0) return { declaredId, problems: duplicates };
      return { stream: { ...result.data, constituents, sourceFile: file }, declaredId, problems };
    }
    return { stream: { ...result.data, sourceFile: file }, declaredId, problems };
  }
  if (kind === 'reference') {
    const result = referencePortSchema.safeParse(input);
    if (!result.success) problems.push(...issuesToErrors(file, raw, result.error.issues, kind));
    if (problems.length > 0 || !result.success) return { declaredId, problems };
    const { constituents, problems: duplicates } = canonicalConstituents(file, result.data.constituents);
    if (duplicates.length > 0) return { declaredId, problems: duplicates };
    const station: ReferenceStation = { ...result.data, constituents, sourceFile: file };
    return { station, declaredId, problems };
  }
  const result = secondaryPortSchema.safeParse(input);
  if (!result.success) problems.push(...issuesToErrors(file, raw, result.error.issues, kind));
  if (problems.length > 0 || !result.success) return { declaredId, problems };
  const station: SecondaryStation = { ...result.data, sourceFile: file };
  return { station, declaredId, problems };
}

/** A station from the text of its YAML file; the first problem found is thrown as a StationFileError. */
export function parseStation(text: string, file: string): Station {
  const station = parseAnyStation(text, file);
  if (station.kind === 'stream' || station.kind === 'stream-secondary') {
    throw new StationFileError(file, 'kind', `is ${station.kind}, a tidal stream station, where a tide station is needed`, 'give the file of a reference or secondary port');
  }
  return station;
}

/** A tide or stream station from the text of its YAML file; the first problem is thrown. */
export function parseAnyStation(text: string, file: string): Station | AnyStreamStation {
  const { station, stream, problems } = checkStationText(text, file);
  if (problems[0]) throw problems[0];
  const found = station ?? stream;
  if (!found) throw new StationFileError(file, '(file)', 'could not be read', 'check the file');
  return found;
}
