// `tidewright almanac` on a tidal stream station: the StreamYear model as JSON, or a short summary.

import { dirname } from 'node:path';
import {
  loadStationSet, buildStreamYear, type AnyStreamStation, type StreamYear, type StreamYearLookup,
} from '../engine/index.js';
import { wordsFor, type Words } from '../templates/locale/index.js';
import { row } from './locale.js';

/** The set a stream station draws on: its reference stream station and its tide_reference. */
export function streamAlmanacSet(file: string, station: AnyStreamStation, stationsDir: string | null): StreamYearLookup {
  if (stationsDir === null && station.kind === 'stream' && station.tide_reference === undefined) return { streams: [station] };
  const set = loadStationSet(stationsDir ?? dirname(file));
  return { ...set, streams: [station, ...(set.streams ?? []).filter((s) => s.id !== station.id)] };
}

export function streamYearFor(file: string, station: AnyStreamStation, stationsDir: string | null, year: number): StreamYear {
  return buildStreamYear(station, streamAlmanacSet(file, station, stationsDir), year);
}

const deg = (x: number | null): string => (x === null ? '—' : `${String(Math.round(x) % 360).padStart(3, '0')}°`);

/** A short human summary of a stream model: station facts, each month's strongest streams, cautions. */
export function streamSummary(model: StreamYear, words: Words = wordsFor()): string {
  const s = model.station;
  const kn = (x: number | null): string => (x === null ? '   —   ' : `${words.number(x, 1).padStart(4)} kn`);
  const heads = [words.t('cli.colMonth'), words.t('cli.colSlacks'), words.t('cli.colStrongestFlood'), words.t('cli.colStrongestEbb')] as const;
  const monthWidth = Math.max(...model.months.map((mo) => words.monthName(mo.month).length));
  const widths = [Math.max(monthWidth, heads[0].length), heads[1].length, Math.max(25, heads[2].length), 0] as const;
  const kind = model.reference
    ? words.t('cli.streamSecondaryOf', { station: model.reference.name, id: model.reference.id })
    : `${words.t('stream.kind')}${model.rotary ? ` (${words.t('cli.rotary')})` : ''}`;
  const lines = [
    `${words.t('cli.almanacHead', { station: s.name, id: s.id, year: String(model.year), zone: model.timezone })}${model.invented ? ` — ${words.t('cli.invented')}` : ''}`,
    kind,
    words.t('cli.streamSets', {
      flood: deg(model.floodDirection), ebb: deg(model.ebbDirection),
      from: model.tideReference ? `${model.tideReference.name} (${model.tideReference.id})` : words.t('cli.ownRates'),
    }),
    '',
    row(heads, widths),
  ];
  for (const month of model.months) {
    const events = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount).flatMap((d) => d.events);
    const best = (type: 'flood' | 'ebb') => events.filter((e) => e.type === type).reduce<(typeof events)[number] | null>((a, e) => (!a || e.speed > a.speed ? e : a), null);
    const at = (e: (typeof events)[number] | null) => (e === null ? '—' : `${kn(e.speed)} ${deg(e.direction)} ${e.date.slice(5, 10)} ${e.clock}`);
    lines.push(row([words.monthName(month.month), String(events.filter((e) => e.type === 'slack').length).padStart(widths[1]), at(best('flood')), at(best('ebb'))], widths));
  }
  lines.push('');
  for (const c of model.offsetChanges) lines.push(words.t('cli.clockChange', { change: words.offsetChange(c) }));
  for (const w of model.warnings) lines.push(words.t('cli.warning', { warning: words.warning(w, '') }));
  lines.push(`${words.t('caution.heading')}: ${words.caution}`, `${words.t('cli.streamsLabel')}: ${words.t('caution.streams')}`, '');
  return lines.join('\n');
}
