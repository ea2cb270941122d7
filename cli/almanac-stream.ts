// `tidewright almanac` on a tidal stream station: the StreamYear model as JSON, or a short summary.

import { dirname } from 'node:path';
import {
  loadStationSet, buildStreamYear, type AnyStreamStation, type StreamYear, type StreamYearLookup,
} from '../engine/index.js';
import { wordsFor } from '../templates/locale/index.js';

/** The set a stream station draws on: its reference stream station and its tide_reference. */
export function streamAlmanacSet(file: string, station: AnyStreamStation, stationsDir: string | null): StreamYearLookup {
  if (stationsDir === null && station.kind === 'stream' && station.tide_reference === undefined) return { streams: [station] };
  const set = loadStationSet(stationsDir ?? dirname(file));
  return { ...set, streams: [station, ...(set.streams ?? []).filter((s) => s.id !== station.id)] };
}

export function streamYearFor(file: string, station: AnyStreamStation, stationsDir: string | null, year: number): StreamYear {
  return buildStreamYear(station, streamAlmanacSet(file, station, stationsDir), year);
}

const kn = (x: number | null): string => (x === null ? '   —   ' : `${x.toFixed(1).padStart(4)} kn`);
const deg = (x: number | null): string => (x === null ? '—' : `${String(Math.round(x) % 360).padStart(3, '0')}°`);

/** A short human summary of a stream model: station facts, each month's strongest streams, cautions. */
export function streamSummary(model: StreamYear): string {
  const s = model.station;
  const lines = [
    `${s.name} (${s.id}) — ${model.year}, times in ${model.timezone}${model.invented ? ' — INVENTED DEMO DATA' : ''}`,
    model.reference ? `Secondary stream station of ${model.reference.name} (${model.reference.id})` : `Tidal stream station${model.rotary ? ' (rotary: slack is the least speed)' : ''}`,
    `Flood sets toward ${deg(model.floodDirection)} true, ebb toward ${deg(model.ebbDirection)} true; springs and neaps from ${model.tideReference ? `${model.tideReference.name} (${model.tideReference.id})` : 'the stream\'s own rates'}`,
    '',
    'Month      slacks  strongest flood            strongest ebb',
  ];
  for (const month of model.months) {
    const events = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount).flatMap((d) => d.events);
    const best = (type: 'flood' | 'ebb') => events.filter((e) => e.type === type).reduce<(typeof events)[number] | null>((a, e) => (!a || e.speed > a.speed ? e : a), null);
    const at = (e: (typeof events)[number] | null) => (e === null ? '—'.padEnd(25) : `${kn(e.speed)} ${deg(e.direction)} ${e.date.slice(5, 10)} ${e.clock}`.padEnd(25));
    lines.push(`${wordsFor().monthName(month.month).padEnd(10)} ${String(events.filter((e) => e.type === 'slack').length).padStart(6)}  ${at(best('flood'))}  ${at(best('ebb'))}`);
  }
  lines.push('');
  for (const c of model.offsetChanges) lines.push(`Clock change: ${wordsFor().offsetChange(c)}`);
  for (const w of model.warnings) lines.push(`WARNING: ${wordsFor().warning(w, '')}`);
  lines.push(`Caution: ${wordsFor().caution}`, `Streams: ${wordsFor().t('caution.streams')}`, '');
  return lines.join('\n');
}
