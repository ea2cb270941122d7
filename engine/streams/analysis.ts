// Harmonic analysis of a current-meter record into a stream station: least squares on each of the
// two components (the gauge analysis of engine/analysis/harmonic.ts, the same Rayleigh choice and
// nodal corrections for both), then each constituent's ellipse from the components' amplitudes and
// phases by Foreman's conversion (./ellipse.ts).

import { basename } from 'node:path';
import { analyseRecord, type AnalysisOptions, type HarmonicAnalysis } from '../analysis/harmonic.js';
import { commentLines, day, roundedPhase, yamlString, type StationMeta } from '../analysis/station-yaml.js';
import { CAUTION } from '../almanac/caution.js';
import { componentsToEllipse } from './ellipse.js';
import type { CurrentRecord } from './current-record.js';
import type { CurrentEllipse, StreamStation, StreamUnit } from './types.js';

export interface CurrentAnalysis {
  record: CurrentRecord;
  east: HarmonicAnalysis;
  north: HarmonicAnalysis;
  ellipses: { name: string; ellipse: CurrentEllipse; inferred: boolean }[]; // by decreasing major axis
  mean: { east: number; north: number };
}

export function analyseCurrentRecord(record: CurrentRecord, options: AnalysisOptions = {}): CurrentAnalysis {
  const east = analyseRecord({ file: record.file, times: record.times, heights: record.east, duplicatesDropped: 0, wasUnsorted: false }, options);
  // the constituents chosen depend only on the record's span and spacing: the same for both components
  const north = analyseRecord({ file: record.file, times: record.times, heights: record.north, duplicatesDropped: 0, wasUnsorted: false }, options);
  const ellipses = east.constituents.flatMap((e) => {
    const n = north.constituents.find((c) => c.name === e.name);
    if (!n) return [];
    return [{ name: e.name, ellipse: componentsToEllipse(e, n), inferred: e.inferred !== undefined }];
  });
  ellipses.sort((a, b) => b.ellipse.major - a.ellipse.major);
  return { record, east, north, ellipses, mean: { east: east.meanLevel, north: north.meanLevel } };
}

const round = (v: number, digits: number): number => {
  const r = Number(v.toFixed(digits));
  return Object.is(r, -0) ? 0 : r;
};

export function streamStationFrom(a: CurrentAnalysis, meta: Omit<StationMeta, 'datum'>, floodDirection: number, unit: StreamUnit): StreamStation {
  const constituents: StreamStation['constituents'] = {};
  for (const { name, ellipse } of a.ellipses) {
    constituents[name] = { major: round(ellipse.major, 4), minor: round(ellipse.minor, 4), inclination: roundedPhase(ellipse.inclination), phase: roundedPhase(ellipse.phase) };
  }
  const s = a.east.summary;
  return {
    id: meta.id,
    name: meta.name,
    kind: 'stream',
    position: { latitude: meta.latitude, longitude: meta.longitude },
    timezone: meta.timezone,
    flood_direction: roundedPhase(floodDirection, 1),
    unit,
    mean_current: { east: round(a.mean.east, 4), north: round(a.mean.north, 4) },
    constituents,
    provenance: `Derived by tidewright from the current-meter record ${basename(a.record.file)} (${day(s.start)} to ${day(s.end)}, `
      + `${(s.spanHours / 24).toFixed(1)} days, ${s.count} readings) by least squares on the east and north components with `
      + `Schureman nodal corrections, ellipses by Foreman's conversion; ${a.ellipses.length} constituents chosen by the Rayleigh criterion`,
  };
}

/** The stream station file's YAML, with the fit's notes as comments. */
export function streamStationYaml(a: CurrentAnalysis, meta: Omit<StationMeta, 'datum'>, floodDirection: number, unit: StreamUnit): string {
  const st = streamStationFrom(a, meta, floodDirection, unit);
  const re = a.east.residual;
  const rn = a.north.residual;
  const inferred = a.ellipses.filter((e) => e.inferred).map((e) => e.name);
  const lines = [
    ...commentLines(`Tidal current ellipses of ${meta.name}, derived by tidewright from a current-meter record. Axes and the mean current in ${unit}; `
      + 'inclination: direction of the major axis in degrees counter-clockwise from east; phase: Greenwich phase lag of the current along the major axis (UTC); '
      + 'minor > 0 turns counter-clockwise.'),
    ...commentLines(`Residual of the fit: RMS ${re.rms.toFixed(3)} (east) and ${rn.rms.toFixed(3)} (north) ${unit}; the constants explain `
      + `${(re.explained * 100).toFixed(1)} % and ${(rn.explained * 100).toFixed(1)} % of the variance of the two components.`),
    ...(inferred.length > 0 ? commentLines(`Inferred on both components from a separated neighbour (equilibrium ratio): ${inferred.join(', ')}.`) : []),
    ...commentLines(`Caution: ${CAUTION} A current meter measures one point of a channel: streams vary across it and with depth, wind and river flow.`),
    `id: ${st.id}`,
    `name: ${yamlString(st.name)}`,
    'kind: stream',
    `position: { latitude: ${st.position.latitude}, longitude: ${st.position.longitude} }`,
    `timezone: ${st.timezone}`,
    `flood_direction: ${st.flood_direction}`,
    `unit: ${st.unit}`,
    `mean_current: { east: ${st.mean_current.east}, north: ${st.mean_current.north} }`,
    'constituents:',
    ...Object.entries(st.constituents).map(([name, e]) =>
      `  ${`${name}:`.padEnd(6)} { major: ${e.major}, minor: ${e.minor}, inclination: ${e.inclination}, phase: ${e.phase} }`),
    `provenance: ${JSON.stringify(st.provenance)}`,
  ];
  return `${lines.join('\n')}\n`;
}

/** The two bearings (degrees true) along the major axis of the largest ellipse: the flood sets toward one of them. */
export function majorAxisBearings(a: CurrentAnalysis): [number, number] | null {
  const main = a.ellipses[0];
  if (!main) return null;
  const b = (((90 - main.ellipse.inclination) % 360) + 360) % 360;
  return [Math.round(b), Math.round((b + 180) % 360)];
}
