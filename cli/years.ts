// The one range of years every command accepts (build --year, tidewright.yaml's year, almanac --year,
// predict --from/--to). From 1970: the time-zone database vouches for its clock changes since then,
// while before it many zones kept local mean time with offsets in odd seconds (Asia/Kathmandu +5:41:16
// until 1920) that the database itself only estimates. To 2100: the span the Moon's phase and ΔT series
// in engine/sky are fitted for; later years would print extrapolated clock rules as facts.
import { DateTime } from 'luxon';
import { UsageError } from '../engine/index.js';

export const FIRST_YEAR = 1970;
export const LAST_YEAR = 2100;

const RANGE = `from ${FIRST_YEAR} to ${LAST_YEAR}`;

/** A year option (`--year 2027`): a whole year in the range, or one UsageError naming the option. */
export function yearOption(option: string, text: string): number {
  const value = /^\d{1,6}$/.test(text.trim()) ? Number(text) : Number.NaN;
  if (!(value >= FIRST_YEAR && value <= LAST_YEAR)) {
    throw new UsageError(option, `"${text}" is not a year ${RANGE} (the years tidewright computes)`, `write a year ${RANGE}, e.g. ${option} 2027`);
  }
  return value;
}

/** The most years one build publishes: each is a full set of books, pages and downloads. */
export const MAX_BUILD_YEARS = 10;

/**
 * The years of a build: `2027`, or a range `2027-2029` (either end in the range above, the earlier
 * first, at most MAX_BUILD_YEARS). A problem comes back as words, so the command line and
 * tidewright.yaml can each say it their own way.
 */
export function yearSpan(text: string): { years: number[] } | { problem: string; fix: string } {
  const single = /^\s*(\d{1,6})\s*$/.exec(text);
  const range = /^\s*(\d{1,6})\s*[-\u2013]\s*(\d{1,6})\s*$/.exec(text);
  const example = `e.g. 2027 or 2027-${2027 + 2}`;
  const ends = single ? [Number(single[1])] : range ? [Number(range[1]), Number(range[2])] : [];
  if (ends.length === 0) return { problem: `"${text}" is not a year or a range of years`, fix: `write a year or two joined by a hyphen, ${example}` };
  const outside = ends.find((y) => !(y >= FIRST_YEAR && y <= LAST_YEAR));
  if (outside !== undefined) return { problem: `${outside} is not a year ${RANGE} (the years tidewright computes)`, fix: `write years ${RANGE}, ${example}` };
  const [first, last = first] = ends as [number, number?];
  if (last < first) return { problem: `"${text}" runs backwards`, fix: `write the earlier year first: ${last}-${first}` };
  if (last - first + 1 > MAX_BUILD_YEARS) {
    return { problem: `"${text}" spans ${last - first + 1} years, more than the ${MAX_BUILD_YEARS} one build publishes`,
      fix: `write at most ${MAX_BUILD_YEARS} years, e.g. ${first}-${first + MAX_BUILD_YEARS - 1}, and build the rest into another folder` };
  }
  return { years: Array.from({ length: last - first + 1 }, (_, i) => first + i) };
}

/** `--year 2027` or `--year 2027-2029`: the years of a build, or one UsageError naming the option. */
export function yearsOption(option: string, text: string): number[] {
  if (/^\s*\d{1,6}\s*$/.test(text) || !/\d\s*[-\u2013]\s*\d/.test(text)) return [yearOption(option, text)];
  const span = yearSpan(text);
  if ('problem' in span) throw new UsageError(option, span.problem, span.fix);
  return span.years;
}

/** An instant of --from or --to must lie within the range, counted in the station's zone. */
export function instantInRange(option: string, text: string, ms: number, zone: string, end = false): void {
  const first = DateTime.fromObject({ year: FIRST_YEAR }, { zone }).toMillis();
  const last = DateTime.fromObject({ year: LAST_YEAR + 1 }, { zone }).toMillis();
  if (ms < first || (end ? ms > last : ms >= last)) {
    throw new UsageError(option, `${text} is outside the years ${RANGE} (the years tidewright computes)`,
      `give a date ${RANGE}, e.g. ${option} 2027-01-01`);
  }
}
