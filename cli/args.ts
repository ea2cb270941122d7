// Shared command-line helpers: option parsing that fails with one-line UsageErrors, and the
// dates, instants and choices the commands accept.

import { parseArgs } from 'node:util';
import { DateTime } from 'luxon';
import { UsageError, nearestName } from '../engine/index.js';

type OptionSpec = Record<string, { type: 'string' | 'boolean'; short?: string; multiple?: boolean; default?: string | boolean }>;

/** The options and positionals of one command; unknown options and missing values are UsageErrors. */
export function parseCommandLine<const O extends OptionSpec>(command: string, argv: readonly string[], options: O) {
  try {
    return parseArgs({ args: negativeValues(argv, options), options, strict: true, allowPositionals: true });
  } catch (error) {
    throw usageFromParseError(command, Object.keys(options), error);
  }
}

/** `--year -1` as `--year=-1`, so a negative number is the option's (bad) value, not an unknown option. */
function negativeValues(argv: readonly string[], options: OptionSpec): string[] {
  const out: string[] = [];
  let joined = -1; // the index of a value already joined to its option
  for (const [i, arg] of argv.entries()) {
    if (i === joined) continue;
    const next = argv[i + 1];
    const name = arg.startsWith('--') ? arg.slice(2) : null;
    if (name !== null && options[name]?.type === 'string' && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(`${arg}=${next}`);
      joined = i + 1;
    } else out.push(arg);
  }
  return out;
}

function usageFromParseError(command: string, known: readonly string[], error: unknown): UsageError {
  const message = error instanceof Error ? error.message : String(error);
  const code = (error as { code?: string }).code;
  const quoted = /'([^']+)'/.exec(message)?.[1] ?? '';
  const help = `see tidewright ${command} --help`;
  if (code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') {
    const name = quoted.replace(/^-+/, '').replace(/=.*$/, '');
    const nearest = nearestName(name, known);
    return new UsageError(quoted, `is not an option of tidewright ${command}`, nearest ? `did you mean --${nearest}? (${help})` : help);
  }
  if (code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') {
    const option = quoted.split(' ')[0] ?? quoted;
    const problem = /does not take/.test(message) ? 'takes no value' : 'needs a value';
    return new UsageError(option, problem, help);
  }
  return new UsageError(command, message.split('\n')[0] ?? message, help);
}

/** Exactly `count` positional arguments, named for the error message. */
export function positionalArguments(command: string, positionals: readonly string[], names: readonly string[]): string[] {
  if (positionals.length > names.length) {
    const extra = positionals[names.length] ?? '';
    return fail(extra, `is one argument too many for tidewright ${command}`, `see tidewright ${command} --help`);
  }
  if (positionals.length < names.length) {
    const missing = names[positionals.length] ?? 'argument';
    return fail(missing, 'is missing', `see tidewright ${command} --help`);
  }
  return [...positionals];
}

function fail(option: string, problem: string, fix: string): never {
  throw new UsageError(option, problem, fix);
}

/** One of a fixed set of words, e.g. --format table|json|csv. */
export function oneOf<const T extends string>(option: string, value: string, allowed: readonly T[]): T {
  const match = allowed.find((a) => a === value);
  if (match) return match;
  const nearest = nearestName(value, allowed);
  const fix = nearest ? `did you mean ${nearest}? write ${option} ${nearest}` : `write one of ${allowed.join(', ')}`;
  return fail(option, `"${value}" is not one of ${allowed.join(', ')}`, fix);
}

const DATE_ONLY = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * A date or an instant as UTC epoch ms. YYYY-MM-DD means local midnight in `zone`; an ISO 8601
 * instant with Z or an offset means that instant; an ISO time without offset is local to `zone`.
 */
export function parseWhen(option: string, text: string, zone: string): number {
  const dateOnly = DATE_ONLY.exec(text);
  if (dateOnly) {
    const [, y, m, d] = dateOnly.map(Number) as [number, number, number, number];
    const date = DateTime.fromObject({ year: y, month: m, day: d }, { zone });
    if (!date.isValid) {
      const monthStart = DateTime.fromObject({ year: y, month: m }, { zone });
      const why = monthStart.isValid
        ? `${monthStart.toFormat('LLLL yyyy')} has ${monthStart.daysInMonth} days`
        : `there is no month ${m}`;
      return fail(option, `${text} is not a real date (${why})`, 'write a date as YYYY-MM-DD, e.g. 2027-02-28');
    }
    return date.startOf('day').toMillis();
  }
  const instant = DateTime.fromISO(text, { zone });
  if (!instant.isValid) {
    return fail(
      option,
      `"${text}" is neither a date nor an ISO 8601 instant`,
      'write a date as YYYY-MM-DD (midnight at the station) or an instant such as 2027-01-01T06:00Z',
    );
  }
  return instant.toMillis();
}

/** A positive number of minutes, whole seconds at least, at most a day. */
export function parseMinutes(option: string, text: string): number {
  const minutes = /^\d+(\.\d+)?$/.test(text) ? Number(text) : Number.NaN;
  const seconds = minutes * 60;
  if (!(seconds >= 1) || minutes > 1440 || Math.abs(seconds - Math.round(seconds)) > 1e-9) {
    return fail(option, `"${text}" is not a step of whole seconds, from 1 second to 1440 minutes`, `write a number of minutes, e.g. ${option} 10`);
  }
  return minutes;
}
