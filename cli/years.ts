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

/** An instant of --from or --to must lie within the range, counted in the station's zone. */
export function instantInRange(option: string, text: string, ms: number, zone: string, end = false): void {
  const first = DateTime.fromObject({ year: FIRST_YEAR }, { zone }).toMillis();
  const last = DateTime.fromObject({ year: LAST_YEAR + 1 }, { zone }).toMillis();
  if (ms < first || (end ? ms > last : ms >= last)) {
    throw new UsageError(option, `${text} is outside the years ${RANGE} (the years tidewright computes)`,
      `give a date ${RANGE}, e.g. ${option} 2027-01-01`);
  }
}
