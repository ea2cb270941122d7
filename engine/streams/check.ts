// Stream constants that pass the schema but are probably wrong. `tidewright check` lists them.

import { StationFileError } from '../errors.js';
import { distanceKm, MAX_PLAUSIBLE_TIME_DIFFERENCE, MAX_REFERENCE_DISTANCE_KM } from '../stations/suspicious.js';
import { KNOTS_PER_METRE_PER_SECOND } from './predict.js';
import type { AnyStreamStation, StreamStation } from './types.js';

/** Faster than any tidal stream constituent on Earth (the strongest races run near 10 kn at springs, all constituents together). */
export const MAX_PLAUSIBLE_MAJOR_KNOTS = 10;

function streamSuspicions(station: StreamStation): StationFileError[] {
  const file = station.sourceFile ?? station.id;
  const problems: StationFileError[] = [];
  const knots = station.unit === 'm/s' ? KNOTS_PER_METRE_PER_SECOND : 1;
  if (!('M2' in station.constituents)) {
    problems.push(new StationFileError(file, 'constituents.M2', 'is missing from a stream station', 'add M2: { major: …, minor: …, inclination: …, phase: … }; every tidal stream has an M2 ellipse and its springs and neaps are built from it'));
  }
  for (const [name, e] of Object.entries(station.constituents)) {
    const major = e.major * knots;
    if (major > MAX_PLAUSIBLE_MAJOR_KNOTS) {
      const hint = station.unit === 'kn' ? 'the axes are in knots (unit: kn): check for metres per second written as centimetres per second, or write unit: m/s' : 'the axes are in metres per second (unit: m/s): write 1.5 rather than 150 (centimetres per second)';
      problems.push(new StationFileError(file, `constituents.${name}.major`, `${e.major} ${station.unit} (${major.toFixed(1)} kn) is faster than any tidal stream`, hint));
    }
    if (Math.abs(e.minor) > e.major) {
      problems.push(new StationFileError(file, `constituents.${name}.minor`, `${e.minor} is longer than the major axis ${e.major}`, `swap them: write the longer axis as major and the shorter as minor (turn the inclination by 90 degrees and check the phase), keeping the sign of minor for the sense of turning`));
    }
  }
  return problems;
}

function secondarySuspicions(station: Extract<AnyStreamStation, { kind: 'stream-secondary' }>, reference: AnyStreamStation | undefined): StationFileError[] {
  const file = station.sourceFile ?? station.id;
  const problems: StationFileError[] = [];
  for (const key of ['slack_to_flood', 'flood', 'slack_to_ebb', 'ebb'] as const) {
    const minutes = station.differences[key].time;
    if (Math.abs(minutes) > MAX_PLAUSIBLE_TIME_DIFFERENCE) {
      problems.push(new StationFileError(file, `differences.${key}.time`, `${minutes} minutes is more than ${MAX_PLAUSIBLE_TIME_DIFFERENCE / 60} hours`, 'time differences are in minutes (write 25 for 25 minutes); check the sign too, + means later'));
    }
  }
  for (const key of ['flood', 'ebb'] as const) {
    const rate = station.differences[key].rate;
    if (rate > 3) {
      problems.push(new StationFileError(file, `differences.${key}.rate`, `${rate} makes the stream ${rate} times as strong as at the reference station`, 'a rate ratio compares rates at two stations of one channel: write e.g. 0.8 for four fifths of the reference rate'));
    }
  }
  if (reference) {
    const km = distanceKm(station.position, reference.position);
    if (km > MAX_REFERENCE_DISTANCE_KM) {
      problems.push(new StationFileError(file, 'reference', `${reference.id} lies ${Math.round(km)} km away`, 'choose a reference stream station in the same channel, or check both positions (east longitude positive)'));
    }
  }
  return problems;
}

/** Suspicious constants of one stream station (its reference stream station, if given, for a secondary). */
export function suspiciousStream(station: AnyStreamStation, reference?: AnyStreamStation): StationFileError[] {
  return station.kind === 'stream' ? streamSuspicions(station) : secondarySuspicions(station, reference);
}
