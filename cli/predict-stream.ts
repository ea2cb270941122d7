// `tidewright predict` on a tidal stream station: slack water and the strongest flood and ebb, or with
// --every the velocity at that step, as a table for people or as JSON/CSV for programs.

import { DateTime } from 'luxon';
import {
  isoLocal, isoUtc, bearingOf, streamEventsFor, streamVelocities, type StreamLookup,
} from '../engine/index.js';
import type { AnyStreamStation, StreamEvent } from '../engine/index.js';
import { csvTable, csvText, type ExportRecord } from '../templates/exports/fields.js';
import { wordsFor } from '../templates/locale/index.js';

const MINUTE = 60_000;

export interface StreamPredictRequest {
  station: AnyStreamStation;
  set: StreamLookup & { streams: readonly AnyStreamStation[] };
  from: number;
  to: number;
  stepMinutes: number | undefined;
  format: 'table' | 'json' | 'csv';
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
  return Array.from({ length: count }, (_, i) => {
    const e = east[i]!;
    const n = north[i]!;
    const ok = Number.isFinite(e) && Number.isFinite(n);
    return { t: req.from + i * stepMs, east: e, north: n, speed: ok ? Math.hypot(e, n) : Number.NaN, direction: ok ? bearingOf(e, n) : null };
  });
}

function header(req: StreamPredictRequest, what: string): string[] {
  const { station } = req;
  const zone = station.timezone;
  const span = `${DateTime.fromMillis(req.from, { zone }).toFormat('yyyy-MM-dd HH:mm')} to ${DateTime.fromMillis(req.to, { zone }).toFormat('yyyy-MM-dd HH:mm')}`;
  const reference = station.kind === 'stream-secondary' ? req.set.streams.find((s) => s.id === station.reference) : undefined;
  const kind = station.kind === 'stream'
    ? 'tidal stream station'
    : `secondary stream station of ${reference?.name ?? station.reference}, by time differences and rate ratios`;
  const { latitude, longitude } = station.position;
  const where = `${Math.abs(latitude).toFixed(3)}° ${latitude < 0 ? 'S' : 'N'}, ${Math.abs(longitude).toFixed(3)}° ${longitude < 0 ? 'W' : 'E'}`;
  return [
    `${station.name}: ${kind} (id ${station.id})`,
    `${where}; time zone ${zone}; flood sets toward ${station.flood_direction}° true`,
    `${what}, ${span} local time (end not included)`,
    'Times: local time at the station with its UTC offset. Rates: knots. Directions: degrees true toward which the stream sets.',
    `Constants: ${station.provenance}`,
    `Caution: ${wordsFor().caution}`,
    `Streams: ${wordsFor().t('caution.streams')}`,
    '',
  ];
}

function tableRows(rows: readonly { t: number; type?: string; speed: number; direction: number | null }[], zone: string, withType: boolean): string[] {
  const lines = [withType ? 'Date        Day  Time   UTC±    Stream  Rate      Direction' : 'Date        Day  Time   UTC±    Rate      Direction'];
  let lastDate = '';
  for (const row of rows) {
    const local = DateTime.fromMillis(Math.round(row.t / MINUTE) * MINUTE, { zone });
    const date = local.toFormat('yyyy-MM-dd');
    const dayPart = date === lastDate ? ' '.repeat(15) : `${date}  ${local.toFormat('ccc')}`;
    lastDate = date;
    const rate = Number.isFinite(row.speed) ? `${row.speed.toFixed(1).padStart(4)} kn` : '   — ';
    const dir = row.direction === null ? '   —' : `${String(Math.round(row.direction) % 360).padStart(3, '0')}°`;
    const type = withType ? `  ${(row.type ?? '').padEnd(6)}` : '';
    lines.push(`${dayPart}  ${local.toFormat('HH:mm')}  ${local.toFormat('ZZ')}${type}  ${rate}   ${dir}`);
  }
  if (rows.length === 0) lines.push('(none in this span)');
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
    return [...header(req, 'Slack water and the strongest flood and ebb'), ...tableRows(rows, zone, true)].join('\n') + '\n';
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
  const what = `The stream every ${req.stepMinutes} minutes${req.station.kind === 'stream-secondary' ? ' (between its events a half-cosine curve, a drawing aid)' : ''}`;
  return [...header(req, what), ...tableRows(list.map((s) => ({ ...s })), zone, false)].join('\n') + '\n';
}
