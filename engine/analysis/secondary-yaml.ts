// The station file a differences analysis produces: a secondary port with the fitted time and height
// differences, and comments on how well they fit and what the record covered.

import { basename } from 'node:path';
import { CAUTION } from '../almanac/caution.js';
import type { SecondaryStation } from '../types.js';
import type { DifferenceAnalysis } from './differences.js';
import { commentLines, day, observationsLine, recordObservations, yamlString, type StationMeta } from './station-yaml.js';

const clean = (v: number): number => (Object.is(v, -0) ? 0 : v);
const minutes = (v: number): number => clean(Math.round(v));
const metres = (v: number): number => clean(Number(v.toFixed(3)));

export function differencesProvenance(a: DifferenceAnalysis): string {
  const s = a.summary;
  return `Differences fitted by tidewright from the gauge record ${basename(a.record.file)} (${day(s.start)} to ${day(s.end)}, ` +
    `${(s.spanHours / 24).toFixed(1)} days) against predictions for ${a.reference.id}: ` +
    `${a.fits.highTime.count} high and ${a.fits.lowTime.count} low waters, least squares against the reference range factor`;
}

/** The fitted differences as a secondary station, rounded as the file writes them. */
export function secondaryStationFrom(a: DifferenceAnalysis, meta: StationMeta): SecondaryStation {
  const d = a.differences;
  const pair = (p: { time: number; height: number }) => ({ time: minutes(p.time), height: metres(p.height) });
  return {
    id: meta.id,
    name: meta.name,
    kind: 'secondary',
    reference: a.reference.id,
    position: { latitude: meta.latitude, longitude: meta.longitude },
    timezone: meta.timezone,
    datum: meta.datum,
    differences: {
      high_water: { springs: pair(d.high_water.springs), neaps: pair(d.high_water.neaps) },
      low_water: { springs: pair(d.low_water.springs), neaps: pair(d.low_water.neaps) },
    },
    provenance: differencesProvenance(a),
    observations: recordObservations(a),
  };
}

/** The YAML text of the secondary station file, fit quality as comments. */
export function secondaryStationYaml(a: DifferenceAnalysis, meta: StationMeta, notes: readonly string[] = []): string {
  const st = secondaryStationFrom(a, meta);
  const f = a.fits;
  const constant = Object.values(f).some((x) => x.constant);
  const rejected = Object.values(f).reduce((n, x) => n + x.rejected, 0);
  const pair = (p: { time: number; height: number }) => `{ time: ${p.time}, height: ${p.height} }`;
  const lines = [
    ...commentLines(`Time and height differences of ${meta.name} from ${a.reference.name} (${a.reference.id}), fitted by ` +
      'tidewright from a gauge record at this port against the predictions for the reference port. Times in minutes ' +
      '(+ later), heights in metres.'),
    ...commentLines(`Fit quality (RMS of residuals): high water ${f.highTime.rms.toFixed(1)} min and ${f.highHeight.rms.toFixed(3)} m ` +
      `over ${f.highTime.count} events; low water ${f.lowTime.rms.toFixed(1)} min and ${f.lowHeight.rms.toFixed(3)} m ` +
      `over ${f.lowTime.count} events.`),
    ...commentLines(`Reference range factor k from ${a.kRange[0].toFixed(2)} to ${a.kRange[1].toFixed(2)} over the record ` +
      '(0 = mean neaps, 1 = mean springs).' +
      (a.unmatched.length > 0 ? ` ${a.unmatched.length} events of the record had no reference event within the window.` : '') +
      (rejected > 0 ? ` ${rejected} outlying differences were left out of the fit.` : '')),
    ...(constant
      ? commentLines('The record covers too little of the spring-neap cycle to tell springs from neaps: ' +
        'one value is given for both where so. Record two weeks or more for separate values.')
      : []),
    ...notes.flatMap((n) => commentLines(n)),
    ...commentLines(CAUTION),
    `id: ${st.id}`,
    `name: ${yamlString(st.name)}`,
    'kind: secondary',
    `reference: ${st.reference}`,
    `position: { latitude: ${meta.latitude}, longitude: ${meta.longitude} }`,
    `timezone: ${yamlString(st.timezone)}`,
    `datum: ${yamlString(st.datum)}`,
    'differences:',
    `  high_water: { springs: ${pair(st.differences.high_water.springs)}, neaps: ${pair(st.differences.high_water.neaps)} }`,
    `  low_water: { springs: ${pair(st.differences.low_water.springs)}, neaps: ${pair(st.differences.low_water.neaps)} }`,
    `provenance: ${yamlString(st.provenance)}`,
    observationsLine(st.observations!),
  ];
  return `${lines.join('\n')}\n`;
}
