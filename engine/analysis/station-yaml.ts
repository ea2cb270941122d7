// The station file an analysis produces: a reference port with the fitted constants, written as YAML
// with the same keys the loader reads, and comments that carry what YAML keys cannot (uncertainties,
// residual statistics, the constituents the record could not separate, the caution).

import { basename } from 'node:path';
import { CAUTION } from '../almanac/caution.js';
import type { ReferenceStation } from '../types.js';
import type { HarmonicAnalysis } from './harmonic.js';
import { entryOf } from '../item.js';

export interface StationMeta {
  id: string;
  name: string;
  latitude: number;
  longitude: number;
  timezone: string;
  datum: string;
}

const round = (v: number, digits: number): number => {
  const r = Number(v.toFixed(digits));
  return Object.is(r, -0) ? 0 : r;
};
const needs = (days: number | undefined): string =>
  days !== undefined && Number.isFinite(days) ? `needs ${days.toFixed(1)} days` : 'same speed, never separable';
/** The UTC date of an instant, YYYY-MM-DD, as the provenance lines print it. */
export const day = (t: number): string => new Date(t).toISOString().slice(0, 10);

/** A phase rounded for the file, kept in [0, 360) (359.999 must not become 360). */
export function roundedPhase(phase: number, digits = 2): number {
  const r = round(phase, digits);
  return r >= 360 ? 0 : r;
}

/** YAML scalar: plain when unambiguous, else double-quoted (JSON strings are valid YAML). */
export function yamlString(text: string): string {
  return /^[A-Za-z][A-Za-z0-9_/+.-]*$/.test(text) && !/^(true|false|null|yes|no|on|off|y|n)$/i.test(text)
    ? text
    : JSON.stringify(text);
}

/** Wraps comment text at about 100 columns, each line starting with "# ". */
export function commentLines(text: string, width = 100): string[] {
  const lines: string[] = [];
  let line = '#';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (line.length + 1 + word.length > width && line !== '#') {
      lines.push(line);
      line = '#';
    }
    line += ` ${word}`;
  }
  if (line !== '#') lines.push(line);
  return lines;
}

export function analysisProvenance(a: HarmonicAnalysis): string {
  const s = a.summary;
  return `Derived by tidewright from the gauge record ${basename(a.record.file)} (${day(s.start)} to ${day(s.end)}, ` +
    `${(s.spanHours / 24).toFixed(1)} days, ${s.count} readings) by least-squares harmonic analysis with ` +
    `Schureman nodal corrections; ${a.constituents.length} constituents chosen by the Rayleigh criterion (R = ${a.rayleigh})`;
}

/** The span of the record analysed, as the station file's observations: key. */
export function recordObservations(a: Pick<HarmonicAnalysis, 'record' | 'summary'>): { from: string; to: string; source: string } {
  return { from: day(a.summary.start), to: day(a.summary.end), source: `Gauge record ${basename(a.record.file)}` };
}

export function observationsLine(o: { from: string; to: string; source: string }): string {
  return `observations: { from: ${o.from}, to: ${o.to}, source: ${JSON.stringify(o.source)} }`;
}

/** The fitted constants as a reference station, rounded as the file writes them. */
export function referenceStationFrom(a: HarmonicAnalysis, meta: StationMeta): ReferenceStation {
  const constituents: ReferenceStation['constituents'] = {};
  for (const c of a.constituents) {
    constituents[c.name] = { amplitude: round(c.amplitude, 4), phase: roundedPhase(c.phase) };
  }
  return {
    id: meta.id,
    name: meta.name,
    kind: 'reference',
    position: { latitude: meta.latitude, longitude: meta.longitude },
    timezone: meta.timezone,
    datum: meta.datum,
    mean_level: round(a.meanLevel, 4),
    constituents,
    provenance: analysisProvenance(a),
    observations: recordObservations(a),
  };
}

/** The YAML text of the station file, with the analysis' notes as comments. */
export function referenceStationYaml(a: HarmonicAnalysis, meta: StationMeta): string {
  const station = referenceStationFrom(a, meta);
  const r = a.residual;
  const unresolved = a.excluded.filter((e) => e.reason === 'rayleigh')
    .map((e) => `${e.name} (from ${e.conflictsWith === 'Z0' ? 'the mean level' : e.conflictsWith}: ${needs(e.daysNeeded)})`);
  const tooFast = a.excluded.filter((e) => e.reason === 'nyquist').map((e) => e.name);
  const inferred = a.constituents.filter((c) => c.inferred !== undefined)
    .map((c) => `${c.name} from ${c.inferred!.from} (ratio ${c.inferred!.ratio.toFixed(4)})`);
  const lines = [
    ...commentLines(`Harmonic constants of ${meta.name}, derived by tidewright from a gauge record. Amplitudes in metres, ` +
      'phases are Greenwich phase lags in degrees (UTC); the comment beside each gives its 95 % confidence half-widths, ' +
      'which are optimistic because the residual of a real record is not independent from reading to reading.'),
    ...commentLines(`Residual of the fit: RMS ${r.rms.toFixed(3)} m, largest ${r.maxAbs.toFixed(3)} m; the constants ` +
      `explain ${(r.explained * 100).toFixed(2)} % of the variance of the record.`),
    ...(unresolved.length > 0
      ? commentLines(`Not separable with a record of ${(a.summary.spanHours / 24).toFixed(1)} days, so left out: ${unresolved.join(', ')}.`)
      : []),
    ...(inferred.length > 0
      ? commentLines('Inferred, not fitted (the record cannot separate them): each takes its separated neighbour\'s phase ' +
        'lag and the amplitude ratio of the equilibrium tide (Foreman 1977; Pugh 1987): ' + `${inferred.join(', ')}.`)
      : []),
    ...(a.trend !== undefined
      ? commentLines(`The mean level changed by ${a.trend.change.toFixed(3)} m (± ${a.trend.error.toFixed(3)}) over the record ` +
        '(seasons and weather, fitted as a straight line beside the mean level and not part of the constants).')
      : []),
    ...(tooFast.length > 0 ? commentLines(`Too fast for the sampling interval, so left out: ${tooFast.join(', ')}.`) : []),
    ...commentLines('Constants from a short record are less reliable than those from a year or more. ' + CAUTION),
    `id: ${station.id}`,
    `name: ${yamlString(station.name)}`,
    'kind: reference',
    `position: { latitude: ${meta.latitude}, longitude: ${meta.longitude} }`,
    `timezone: ${yamlString(station.timezone)}`,
    `datum: ${yamlString(station.datum)}`,
    `mean_level: ${station.mean_level}  # ± ${a.meanLevelError.toFixed(4)} m`,
    'constituents:',
  ];
  const width = Math.max(...a.constituents.map((c) => c.name.length));
  for (const c of a.constituents) {
    const k = entryOf(station.constituents, c.name, 'constituents');
    const body = `  ${`${c.name}:`.padEnd(width + 1)} { amplitude: ${k.amplitude.toFixed(4)}, phase: ${k.phase.toFixed(2).padStart(6)} }`;
    lines.push(c.inferred === undefined
      ? `${body}  # ± ${c.amplitudeError.toFixed(4)} m, ± ${c.phaseError.toFixed(1)}°`
      : `${body}  # inferred from ${c.inferred.from}`);
  }
  lines.push(`provenance: ${yamlString(station.provenance)}`);
  lines.push(observationsLine(station.observations!));
  return `${lines.join('\n')}\n`;
}
