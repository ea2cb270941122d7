// The date every output of a build carries (PDF creation date, iCalendar DTSTAMP, the site's edition
// line): the edition date of tidewright.yaml, or SOURCE_DATE_EPOCH when set (the reproducible-builds
// convention, https://reproducible-builds.org/specs/source-date-epoch/), but never later than the
// edition; with neither, 1 January of the almanac year. Never the clock, so rebuilds are identical.

import { UsageError } from '../../engine/index.js';

/** UTC ms of the stamp. `edition` is YYYY-MM-DD (already checked); `sourceDateEpoch` the variable's text. */
export function outputStamp(year: number, edition: string | undefined, sourceDateEpoch: string | undefined): number {
  const editionMs = edition === undefined ? undefined : Date.parse(`${edition}T00:00:00Z`);
  if (sourceDateEpoch !== undefined && sourceDateEpoch !== '') {
    if (!/^\d{1,12}$/.test(sourceDateEpoch.trim())) {
      throw new UsageError('SOURCE_DATE_EPOCH', `"${sourceDateEpoch}" is not a whole number of seconds since 1970-01-01 UTC`,
        'set it to the output of date +%s for the moment to stamp, or unset it');
    }
    const epochMs = Number(sourceDateEpoch.trim()) * 1000;
    return editionMs === undefined ? epochMs : Math.min(epochMs, editionMs);
  }
  return editionMs ?? Date.UTC(year, 0, 1);
}
