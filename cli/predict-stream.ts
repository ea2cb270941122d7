// `tidewright predict` on a tidal stream station: slack water and the strongest flood and ebb, or with
// --every the velocity at that step, as a table for people or as JSON/CSV for programs.

import {
  isoLocal, isoUtc, bearingOf, itemAt, streamEventsFor, streamVelocities, type StreamLookup,
} from '../engine/index.js';
import type { AnyStreamStation, StreamEvent } from '../engine/index.js';
import { csvTable, csvText, type ExportRecord } from '../templates/exports/fields.js';
import type { Words } from '../templates/locale/index.js';
import { columnWidths, row, tableHeader, tableStamp, weekdayWidth } from './locale.js';

const MINUTE = 60_000;

export interface StreamPredictRequest {
  station: AnyStreamStation;
  set: StreamLookup & { streams: readonly AnyStreamStation[] };
  from: number;
  to: number;
  stepMinutes: number | undefined;
  format: 'table' | 'json' | 'csv';
  words: Words;
}

/** Knots to the hundredth, never −0. */
export const knots = (x: number): number => Math.round(x * 100) / 100 + 0;
/** Degrees true to the tenth, [0, 360); null stays null. */
export const degrees = (x: number | null): number | null => (x === null ? null : (Math.round(x * 10) / 10) % 360 + 0);

/** Decimals in CSV: knots to the hundredth, degrees to the tenth. */
const STREAM_DIGITS = { speed_kn: 2, east_kn: 2, north_kn: 2, direction_deg_true: 1 };

function jsonList(rows: readonly object[]): string {
  return rows.length === 0 ? '[]\n' : `[\n${rows.map((r) => JSON.stringify(r)).join(',\n')}\n]\n`;
}

interface Sample { t: number; east: number; north: number; speed: number; direction: number | null }

function samples(req: StreamPredictRequest, stepMs: number): Sample[] {
  const count = Math.ceil((req.to - req.from) / stepMs);
  const { east, north } = streamVelocities(req.station, req.set, req.from, stepMs, count);
  return Array.from(east, (e, i) => {
    const n = itemAt(north, i, 'north component');
    const ok = Number.isFinite(e) && Number.isFinite(n);
    return { t: req.from + i * stepMs, east: e, north: n, speed: ok ? Math.hypot(e, n) : Number.NaN, direction: ok ? bearingOf(e, n) : null };
  });
}

function header(req: StreamPredictRequest, what: string): string[] {
  const { station, words } = req;
  const reference = station.kind === 'stream-secondary' ? req.set.streams.find((s) => s.id === station.reference) : undefined;
  const kind = station.kind === 'stream'
    ? words.t('cli.streamKind')
    : words.t('cli.streamSecondaryKind', { station: reference?.name ?? station.reference });
  return [...tableHeader(words, {
    station: words.t('cli.stationLine', { station: station.name, kind, id: station.id }),
    where: words.t('cli.whereZoneFlood', { position: words.position(station.position), zone: station.timezone, bearing: bearing(station.flood_direction) }),
    what, from: req.from, to: req.to, zone: station.timezone,
    reading: words.t('cli.timesStreams'),
    provenance: station.provenance,
  }), `${words.t('cli.streamsLabel')}: ${words.t('caution.streams')}`, ''];
}

const bearing = (d: number | null): string => (d === null ? '—' : `${String(Math.round(d) % 360).padStart(3, '0')}°`);

function tableRows(rows: readonly { t: number; type?: 'slack' | 'flood' | 'ebb'; speed: number; direction: number | null }[], zone: string, words: Words): string[] {
  const withType = rows.some((r) => r.type !== undefined);
  const names = { slack: words.t('cli.slack'), flood: words.t('cli.flood'), ebb: words.t('cli.ebb') };
  const heads = [words.t('cli.colDate'), words.t('cli.colDay'), words.t('cli.colTime'), 'UTC±',
    ...(withType ? [words.t('cli.colStream')] : []), words.t('cli.colRate'), words.t('cli.colDirection')];
  const widths = columnWidths(heads, [10, weekdayWidth(words), 5, 6, ...(withType ? [Math.max(...Object.values(names).map((x) => x.length))] : []), 7, 4]);
  const lines = [row(heads, widths)];
  let lastDate = '';
  for (const r of rows) {
    const at = tableStamp(words, Math.round(r.t / MINUTE) * MINUTE, zone);
    const first = at.date !== lastDate;
    lastDate = at.date;
    const rate = Number.isFinite(r.speed) ? `${words.number(r.speed, 1).padStart(4)} kn` : '   —';
    const type = withType ? [r.type ? names[r.type] : ''] : [];
    lines.push(row([first ? at.date : '', first ? at.weekday : '', at.clock, at.offset, ...type, rate, bearing(r.direction).padStart(4)], widths));
  }
  if (rows.length === 0) lines.push(words.t('cli.none'));
  return lines;
}

/** The whole output of `predict` for a stream station. */
export function renderStreamPrediction(req: StreamPredictRequest): string {
  const zone = req.station.timezone;
  if (req.stepMinutes === undefined) {
    const events: StreamEvent[] = streamEventsFor(req.station, req.set, req.from, req.to);
    // JSON and CSV use the exports' one vocabulary (templates/exports/fields.ts, README "Fields of the exports").
    const records: ExportRecord[] = events.map((e) => ({
      station_id: req.station.id, time: isoUtc(e.time), time_local: isoLocal(e.time, zone), type: e.type,
      speed_kn: knots(e.speed), direction_deg_true: degrees(e.direction),
    }));
    if (req.format === 'json') return jsonList(records);
    if (req.format === 'csv') return csvText(csvTable(['station_id', 'time', 'time_local', 'type', 'speed_kn', 'direction_deg_true'], records, STREAM_DIGITS));
    const rows = events.map((e) => ({ t: e.time, type: e.type, speed: e.speed, direction: e.direction }));
    return [...header(req, req.words.t('cli.streamEvents')), ...tableRows(rows, zone, req.words)].join('\n') + '\n';
  }
  const list = samples(req, Math.round(req.stepMinutes * MINUTE));
  const num = (x: number): number | null => (Number.isFinite(x) ? knots(x) : null);
  const records: ExportRecord[] = list.map((s) => ({
    station_id: req.station.id, time: isoUtc(s.t), time_local: isoLocal(s.t, zone), speed_kn: num(s.speed),
    direction_deg_true: degrees(s.direction), east_kn: num(s.east), north_kn: num(s.north),
  }));
  if (req.format === 'json') return jsonList(records);
  if (req.format === 'csv') {
    return csvText(csvTable(['station_id', 'time', 'time_local', 'speed_kn', 'direction_deg_true', 'east_kn', 'north_kn'], records, STREAM_DIGITS));
  }
  const step = req.words.t('unit.minutes', { count: req.stepMinutes });
  const what = req.words.t(req.station.kind === 'stream-secondary' ? 'cli.streamEverySecondary' : 'cli.streamEvery', { step });
  return [...header(req, what), ...tableRows(list.map((s) => ({ ...s })), zone, req.words)].join('\n') + '\n';
}
