// Turns zod's validation issues into StationFileErrors that say, in one line, which file, which
// field (dotted path such as constituents.M2.phase), what was wrong and what to write instead.

import type * as z from 'zod';
import { StationFileError } from '../errors.js';
import { allowedKeysAt, fieldHelp, keyOfOtherKind, type StationKind } from './schema.js';
import { nearestName } from './suggest.js';

/** The dotted field name of a path; the whole file is "(file)". */
export function fieldName(path: readonly PropertyKey[]): string {
  return path.length === 0 ? '(file)' : path.map(String).join('.');
}

function numberAt(root: unknown, path: readonly PropertyKey[]): unknown {
  let node = root;
  for (const key of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PropertyKey, unknown>)[key];
  }
  return node;
}

/** How a value the user wrote reads back to them. */
export function describeValue(value: unknown): string {
  if (value === null) return 'empty';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'a map of keys';
  if (typeof value === 'string') return `the text "${value.length > 40 ? `${value.slice(0, 40)}…` : value}"`;
  return String(value);
}

const EXPECTED_WORDS: Readonly<Record<string, string>> = {
  number: 'a number',
  int: 'a whole number',
  string: 'text',
  object: 'a map of keys (key: value lines)',
  record: 'a map of keys (key: value lines)',
};

const round = (x: number, digits: number): number => Math.round(x * 10 ** digits) / 10 ** digits;

function customParams(issue: z.core.$ZodIssue, kind?: StationKind): { problem: string; fix: string } | undefined {
  const params = (issue as { params?: Record<string, unknown> }).params;
  if (params && typeof params.problem === 'string') {
    return { problem: params.problem, fix: typeof params.fix === 'string' ? params.fix : fieldHelp(issue.path, kind) };
  }
  return undefined;
}

/** Words for a value outside its range, with the corrected value where one follows. */
function rangeWords(
  raw: unknown,
  path: readonly PropertyKey[],
  value: number,
  issue: z.core.$ZodIssueTooSmall | z.core.$ZodIssueTooBig,
  kind: StationKind,
): { problem: string; fix: string } {
  const last = String(path[path.length - 1]);
  if (last === 'phase') {
    const reduced = round(((value % 360) + 360) % 360, 6);
    return { problem: `${value} is outside 0 to 360 degrees`, fix: `write ${reduced}, the same angle reduced into [0, 360)` };
  }
  if (last === 'amplitude' && value < 0) {
    const phase = numberAt(raw, [...path.slice(0, -1), 'phase']);
    const turned = typeof phase === 'number' ? `phase: ${round((((phase + 180) % 360) + 360) % 360, 6)}` : 'the phase turned by 180 degrees';
    return {
      problem: `${value} is negative`,
      fix: `write amplitude: ${-value} with ${turned} (the same wave, since amplitudes are never negative)`,
    };
  }
  if (last === 'longitude' && value > 180 && value <= 360) {
    return { problem: `${value} is outside -180 to 180`, fix: `write ${round(value - 360, 6)} (east positive, west negative)` };
  }
  const bound = issue.code === 'too_small' ? issue.minimum : issue.maximum;
  const inclusive = issue.inclusive !== false;
  const side =
    issue.code === 'too_small'
      ? `is below the smallest allowed value ${String(bound)}`
      : `is ${inclusive ? 'above the largest allowed value' : 'not below'} ${String(bound)}`;
  return { problem: `${value} ${side}`, fix: fieldHelp(path, kind) };
}

function unknownKeyWords(path: readonly PropertyKey[], key: string, kind: StationKind): { problem: string; fix: string } {
  const other = keyOfOtherKind(key, kind);
  if (path.length === 0 && other) {
    return {
      problem: `is a key of ${other} ports, but this file says kind: ${kind}`,
      fix: `remove ${key}, or write kind: ${other} if this is a ${other} port`,
    };
  }
  const allowed = allowedKeysAt(path, kind);
  const nearest = nearestName(key, allowed);
  return {
    problem: 'is not a key tidewright knows here',
    fix: nearest ? `did you mean ${nearest}? write ${nearest}` : `remove it; the keys allowed here are ${allowed.join(', ')}`,
  };
}

function oneIssue(file: string, raw: unknown, issue: z.core.$ZodIssue, kind: StationKind): StationFileError[] {
  const path = issue.path;
  const custom = customParams(issue, kind);
  if (custom) return [new StationFileError(file, fieldName(path), custom.problem, custom.fix)];
  switch (issue.code) {
    case 'invalid_key': {
      const inner = issue.issues.map((i) => customParams(i, kind)).find((p) => p !== undefined);
      const problem = inner?.problem ?? 'is not an allowed name here';
      return [new StationFileError(file, fieldName(path), problem, inner?.fix ?? fieldHelp(path.slice(0, -1), kind))];
    }
    case 'unrecognized_keys':
      return issue.keys.map((key) => {
        const words = unknownKeyWords(path, key, kind);
        return new StationFileError(file, fieldName([...path, key]), words.problem, words.fix);
      });
    case 'invalid_type': {
      const value = numberAt(raw, path);
      if (value === undefined) return [new StationFileError(file, fieldName(path), 'is missing', fieldHelp(path, kind))];
      if (value === null) return [new StationFileError(file, fieldName(path), 'is empty', fieldHelp(path, kind))];
      const expected = EXPECTED_WORDS[issue.expected] ?? issue.expected;
      const quote =
        issue.expected === 'string' && (typeof value === 'number' || typeof value === 'boolean')
          ? `write it in quotes, e.g. "${String(value)}"`
          : fieldHelp(path, kind);
      return [new StationFileError(file, fieldName(path), `should be ${expected} but is ${describeValue(value)}`, quote)];
    }
    case 'too_small':
    case 'too_big': {
      const value = numberAt(raw, path);
      if (typeof value !== 'number') break;
      const words = rangeWords(raw, path, value, issue, kind);
      return [new StationFileError(file, fieldName(path), words.problem, words.fix)];
    }
    case 'invalid_value': {
      const value = numberAt(raw, path);
      return [new StationFileError(file, fieldName(path), `${describeValue(value)} is not allowed here`, fieldHelp(path, kind))];
    }
    default:
      break;
  }
  return [new StationFileError(file, fieldName(path), issue.message.toLowerCase(), fieldHelp(path, kind))];
}

/** Every zod issue of one station file as StationFileErrors, in the order of the schema. */
export function issuesToErrors(
  file: string,
  raw: unknown,
  issues: readonly z.core.$ZodIssue[],
  kind: StationKind,
): StationFileError[] {
  const errors = issues.flatMap((issue) => oneIssue(file, raw, issue, kind));
  // A misspelt key also leaves the real key missing: say it once, at the misspelling, first.
  const meant = new Set<string>();
  for (const e of errors) {
    const suggestion = /^did you mean (\S+)\?/.exec(e.fix)?.[1];
    if (suggestion && e.problem === 'is not a key tidewright knows here') {
      meant.add([...e.field.split('.').slice(0, -1), suggestion].join('.'));
    }
  }
  const missing = (e: StationFileError): boolean => e.problem === 'is missing' && meant.has(e.field);
  const unknownKeys = errors.filter((e) => e.problem === 'is not a key tidewright knows here');
  return [...unknownKeys, ...errors.filter((e) => !missing(e) && !unknownKeys.includes(e))];
}
