// Constants that pass the schema but are probably wrong: quick checks (one year of heights at a
// coarse step, sums of amplitudes, plain geometry). `tidewright check` lists them beside schema errors.

import { StationFileError } from '../errors.js';
import { compilePredictor } from '../predict.js';
import type { ReferenceStation, SecondaryStation, Station } from '../types.js';
import { DEFAULT_DATUM_EPOCH } from './schema.js';
import { numberAt } from '../item.js';

/** Larger than the largest tidal constituent anywhere (M2 is about 5–6 m in the greatest bays). */
export const MAX_PLAUSIBLE_AMPLITUDE = 10;
/** How far a year's lowest tide may fall below the datum before the datum looks too high, metres. */
export const DATUM_ABOVE_LOWS_TOLERANCE = 0.3;
/** How far above the datum a year's lowest tide may stay before the datum looks too low, metres. */
export const DATUM_BELOW_LOWS_TOLERANCE = 0.5;
/** Step of the quick scan of a year, ms: within 15 min of a low water at most ½·h″·(¼ h)² ≈ 3 cm off. */
const SCAN_STEP_MS = 1_800_000;
/** Time differences beyond this (minutes) are usually a unit or sign slip. */
export const MAX_PLAUSIBLE_TIME_DIFFERENCE = 240;
/** Secondary ports farther than this from their reference port rarely share its tide, km. */
export const MAX_REFERENCE_DISTANCE_KM = 300;

const amp = (station: ReferenceStation, name: string): number => station.constituents[name]?.amplitude ?? 0;
const fmt = (x: number): string => x.toFixed(2);

/**
 * The lowest predicted tide of one year (the first year of the station's datum epoch), sampled every
 * 30 minutes: a quick stand-in for LAT, which lies a little lower (the full 19-year search is the
 * almanac's job). Phases count here, not only amplitudes: overtides can deepen or lift the lows.
 */
export function lowestOfYear(station: ReferenceStation): number {
  const year = station.datum_epoch ?? DEFAULT_DATUM_EPOCH;
  const start = Date.UTC(year, 0, 1);
  const count = Math.round((Date.UTC(year + 1, 0, 1) - start) / SCAN_STEP_MS);
  const heights = compilePredictor(station).heights(start, SCAN_STEP_MS, count);
  let lowest = Infinity;
  for (let i = 0; i < heights.length; i++) if (numberAt(heights, i, 'heights') < lowest) lowest = numberAt(heights, i, 'heights');
  return lowest;
}

function referenceSuspicions(station: ReferenceStation): StationFileError[] {
  const file = station.sourceFile ?? station.id;
  const problems: StationFileError[] = [];
  if (!('M2' in station.constituents)) {
    problems.push(
      new StationFileError(file, 'constituents.M2', 'is missing from a reference port', 'add M2: { amplitude: …, phase: … }; every coast has a measurable M2 and the spring and neap ranges are built from it'),
    );
  }
  for (const [name, c] of Object.entries(station.constituents)) {
    if (c.amplitude > MAX_PLAUSIBLE_AMPLITUDE) {
      problems.push(
        new StationFileError(file, `constituents.${name}.amplitude`, `${c.amplitude} m is larger than any tide on Earth`, 'amplitudes are in metres: write 1.62 rather than 162 (centimetres)'),
      );
    }
  }
  // An amplitude off by a factor of 100 would only echo here as a datum 160 m out: say it once.
  if (problems.some((p) => p.field.endsWith('.amplitude'))) return problems;
  const lowest = lowestOfYear(station);
  // Chart datum is meant to sit at or just below the lowest tide: Z0 that puts it 0.05 m below.
  const suggested = fmt(station.mean_level - lowest + 0.05);
  const year = station.datum_epoch ?? DEFAULT_DATUM_EPOCH;
  if (lowest < -DATUM_ABOVE_LOWS_TOLERANCE) {
    problems.push(
      new StationFileError(
        file,
        'mean_level',
        `with mean_level ${station.mean_level} the lowest tide of ${year} falls ${fmt(-lowest)} m below ${station.datum}, so the datum would lie far above the lowest tides`,
        `raise mean_level to about ${suggested} (chart datum near the lowest tide), or check the datum, the amplitudes and the phases`,
      ),
    );
  } else if (lowest > DATUM_BELOW_LOWS_TOLERANCE) {
    problems.push(
      new StationFileError(
        file,
        'mean_level',
        `with mean_level ${station.mean_level} the lowest tide of ${year} stays ${fmt(lowest)} m above ${station.datum}, so the datum would lie far below the lowest tides`,
        `lower mean_level to about ${suggested} (chart datum near the lowest tide), or check that this datum really lies that far below the lowest tide`,
      ),
    );
  }
  return problems;
}

/** Great-circle distance in km (haversine, mean Earth radius 6371 km). */
export function distanceKm(a: Station['position'], b: Station['position']): number {
  const rad = Math.PI / 180;
  const dLat = (b.latitude - a.latitude) * rad;
  const dLon = (b.longitude - a.longitude) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.latitude * rad) * Math.cos(b.latitude * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * 6371 * Math.asin(Math.min(1, Math.sqrt(h)));
}

function secondarySuspicions(station: SecondaryStation, reference: ReferenceStation | undefined): StationFileError[] {
  const file = station.sourceFile ?? station.id;
  const problems: StationFileError[] = [];
  for (const water of ['high_water', 'low_water'] as const) {
    for (const phase of ['springs', 'neaps'] as const) {
      const minutes = station.differences[water][phase].time;
      if (Math.abs(minutes) > MAX_PLAUSIBLE_TIME_DIFFERENCE) {
        problems.push(
          new StationFileError(file, `differences.${water}.${phase}.time`, `${minutes} minutes is more than ${MAX_PLAUSIBLE_TIME_DIFFERENCE / 60} hours`, 'time differences are in minutes (write 25 for 25 minutes, 90 for an hour and a half); check the sign too, + means later'),
        );
      }
    }
  }
  if (!reference) return problems;
  const km = distanceKm(station.position, reference.position);
  if (km > MAX_REFERENCE_DISTANCE_KM) {
    problems.push(
      new StationFileError(file, 'reference', `${reference.id} lies ${Math.round(km)} km away`, 'choose a reference port on the same stretch of coast, or check both positions (east longitude positive)'),
    );
  }
  // The reference port's mean low water springs, Z0 − (M2 + S2), shifted by the secondary's difference.
  const refSpringLow = reference.mean_level - (amp(reference, 'M2') + amp(reference, 'S2'));
  const springLow = refSpringLow + station.differences.low_water.springs.height;
  // Only when the reference port's own MLWS is above its datum is the difference to blame.
  if (refSpringLow >= 0 && springLow < -DATUM_ABOVE_LOWS_TOLERANCE) {
    problems.push(
      new StationFileError(
        file,
        'differences.low_water.springs.height',
        `puts mean low water springs at ${fmt(springLow)} m, well below ${station.datum}`,
        'check the sign and size of the height difference (metres added to the reference port\'s height)',
      ),
    );
  }
  return problems;
}

/** Suspicious constants of one station (its reference port, if given, for a secondary port). */
export function suspiciousConstants(station: Station, reference?: Station): StationFileError[] {
  if (station.kind === 'reference') return referenceSuspicions(station);
  return secondarySuspicions(station, reference?.kind === 'reference' ? reference : undefined);
}
