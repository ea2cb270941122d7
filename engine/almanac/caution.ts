// The safety caution every almanac, page and book carries (our own wording).

export const CAUTION =
  'Astronomical predictions only. Wind, atmospheric pressure and river flow change the real heights and '
  + 'times of the tide, sometimes by a great deal. This is not a substitute for the official tide tables '
  + 'or for local notices; where they differ, defer to the harbour authority and licensed local practice.';

/** True when a station says of itself that it is invented (demo data), in its name or provenance. */
export function isInvented(station: { name: string; provenance: string }): boolean {
  return /invented/i.test(station.name) || /invented/i.test(station.provenance);
}
