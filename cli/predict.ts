// `tidewright predict`: high and low waters, or heights every few minutes, for one station over any
// span, as a table for people or as JSON/CSV for programs. Secondary ports work as reference ports do.

import { dirname } from 'node:path';
import { DateTime } from 'luxon';
import type { Words } from '../templates/locale/index.js';
import {
  UsageError, isoLocal, isoUtc, localDate, loadAnyStationFile, loadStationSet, type StationSet, tideEvents, tideHeights,
} from '../engine/index.js';
import type { AnyStreamStation, Station, TideEvent } from '../engine/index.js';
import { csvTable, csvText, eventFields, eventRecord, HEIGHT_DIGITS, heightFields, heightRecord, type ExportRecord } from '../templates/exports/fields.js';
import { oneOf, parseCommandLine, parseMinutes, parseWhen, positionalArguments } from './args.js';
import { columnWidths, commandWords, LOCALE_HELP, LOCALE_OPTION, row, tableHeader, tableStamp, weekdayWidth } from './locale.js';
import { renderStreamPrediction, type StreamPredictRequest } from './predict-stream.js';
import { FIRST_YEAR, instantInRange, LAST_YEAR } from './years.js';

const FORMATS = ['table', 'json', 'csv'] as const;
type Format = (typeof FORMATS)[number];

const MINUTE = 60_000;
const MAX_ROWS = 5_000_000;

export const PREDICT_HELP = `Usage: tidewright predict STATION.yaml [--from DATE] [--to DATE] [--every MINUTES]
                          [--format table|json|csv] [--stations DIR]

High and low waters of one station between two instants, or with --every its heights at that step.
For a tidal stream station (kind: stream or stream-secondary): slack water and the strongest flood and
ebb (rates in knots, directions in degrees true), or with --every the stream's velocity.

  --from DATE       start: YYYY-MM-DD (midnight in the station's time zone) or an ISO 8601 instant
                    such as 2027-01-01T06:00Z; a time without Z or an offset (2027-01-01T06:00)
                    is the station's local time; default: today at the station
  --to DATE         end, not included; same forms; default: 7 days after --from
                    (both from ${FIRST_YEAR} to ${LAST_YEAR}, the years every command accepts)
  --every MINUTES   heights every MINUTES instead of high and low waters (e.g. 10, or 0.5 for 30 s)
  --format FORMAT   table (default, for people: local time with its UTC offset, heights to cm),
                    json or csv (for programs: station_id, time (UTC), time_local, type,
                    height_m to the mm, below_chart_datum; see the README's table of fields)
  --stations DIR    the station set a secondary port's reference port is found in
                    (default: the folder of STATION.yaml)
${LOCALE_HELP}
Example: tidewright predict stations-demo/brinewold-head.yaml --from 2027-01-01 --to 2027-02-01 --format json
`;

interface PredictRequest {
  station: Station;
  set: StationSet;
  from: number;
  to: number;
  stepMinutes: number | undefined;
  format: Format;
  words: Words;
}

/** The station set a prediction draws on: the named folder, or the station file's own folder for a secondary port. */
export function stationSetFor(file: string, station: Station, stationsDir: string | undefined): StationSet {
  if (stationsDir === undefined && station.kind === 'reference') {
    return { dir: dirname(file), stations: [station], byId: new Map([[station.id, station]]) };
  }
  const set = loadStationSet(stationsDir ?? dirname(file));
  // The file given on the command line wins over a station of the same id in the set.
  const byId = new Map(set.byId);
  byId.set(station.id, station);
  return { ...set, byId };
}

/** A stream station and the stream stations of its folder (a stream-secondary station's reference). */
function streamSetFor(file: string, station: AnyStreamStation, stationsDir: string | undefined): StreamPredictRequest['set'] {
  if (stationsDir === undefined && station.kind === 'stream') return { streams: [station] };
  const set = loadStationSet(stationsDir ?? dirname(file));
  return { streams: [station, ...(set.streams ?? []).filter((s) => s.id !== station.id)] };
}

function request(argv: readonly string[]): PredictRequest | StreamPredictRequest | undefined {
  const { values, positionals } = parseCommandLine('predict', argv, {
    from: { type: 'string' },
    to: { type: 'string' },
    every: { type: 'string' },
    format: { type: 'string', default: 'table' },
    stations: { type: 'string' },
    ...LOCALE_OPTION,
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) return undefined;
  const [file] = positionalArguments('predict', positionals, ['STATION.yaml']) as [string];
  const format = oneOf('--format', values.format, FORMATS);
  const words = commandWords(values.locale, values.stations ?? dirname(file));
  const stepMinutes = values.every === undefined ? undefined : parseMinutes('--every', values.every);
  const station = loadAnyStationFile(file);
  const zone = station.timezone;
  const from = values.from === undefined ? DateTime.now().setZone(zone).startOf('day').toMillis() : parseWhen('--from', values.from, zone);
  const to = values.to === undefined ? DateTime.fromMillis(from, { zone }).plus({ days: 7 }).toMillis() : parseWhen('--to', values.to, zone);
  if (values.from !== undefined) instantInRange('--from', values.from, from, zone);
  instantInRange('--to', values.to ?? '7 days after --from', to, zone, true);
  if (!(to > from)) {
    throw new UsageError('--to', `${values.to ?? ''} is not later than --from ${values.from ?? ''}`.replace(/\s+/g, ' ').trim(), 'give an end after the start, e.g. --from 2027-01-01 --to 2027-02-01');
  }
  if (stepMinutes !== undefined && (to - from) / (stepMinutes * MINUTE) > MAX_ROWS) {
    throw new UsageError('--every', `${stepMinutes} minutes over this span gives more than ${MAX_ROWS} heights`, 'choose a shorter span or a larger step');
  }
  if (station.kind === 'stream' || station.kind === 'stream-secondary') {
    return { station, set: streamSetFor(file, station, values.stations), from, to, stepMinutes, format, words };
  }
  return { station, set: stationSetFor(file, station, values.stations), from, to, stepMinutes, format, words };
}

// --- formatting --------------------------------------------------------------------------------

const toMinute = (t: number): number => Math.round(t / MINUTE) * MINUTE;

// JSON and CSV use the exports' one vocabulary (templates/exports/fields.ts, README "Fields of the exports").
function eventRecords(events: readonly TideEvent[], station: Station): ExportRecord[] {
  const zone = station.timezone;
  return events.map((e) => eventRecord(station.id, isoUtc(e.time), isoLocal(e.time, zone), localDate(e.time, zone), e.type, e.height, 'm'));
}

function heightRecords(from: number, stepMs: number, heights: Float64Array, station: Station): ExportRecord[] {
  return Array.from(heights, (height, i) => {
    const t = from + i * stepMs;
    return heightRecord(station.id, isoUtc(t), isoLocal(t, station.timezone), height, 'm');
  });
}

function jsonRecords(records: readonly ExportRecord[]): string {
  return records.length === 0 ? '[]\n' : `[\n${records.map((r) => JSON.stringify(r)).join(',\n')}\n]\n`;
}

function tideHeader(req: PredictRequest, what: string): string[] {
  const { station, set, words } = req;
  const reference = station.kind === 'secondary' ? set.byId.get(station.reference) : undefined;
  const kind = station.kind === 'reference'
    ? words.t('port.referenceLower')
    : words.t('cli.secondaryKind', { station: reference?.name ?? station.reference });
  return [...tableHeader(words, {
    station: words.t('cli.stationLine', { station: station.name, kind, id: station.id }),
    where: words.t('cli.whereZone', { position: words.position(station.position), zone: station.timezone }),
    what, from: req.from, to: req.to, zone: station.timezone,
    reading: words.t('cli.timesHeights', { unit: words.unitName(), datum: station.datum, below: words.t('cli.belowDatum') }),
    provenance: station.provenance,
  }), ''];
}

interface TableRow {
  t: number;
  type?: 'high' | 'low';
  height: number;
}

function tableRows(rows: readonly TableRow[], zone: string, words: Words): string[] {
  const withType = rows.some((r) => r.type !== undefined);
  const heads = [words.t('cli.colDate'), words.t('cli.colDay'), words.t('cli.colTime'), 'UTC±',
    ...(withType ? [words.t('cli.colTide')] : []), words.t('cli.colHeight')];
  const [high, low] = [words.t('cli.tideHigh'), words.t('cli.tideLow')];
  const heightWidth = Math.max(6, words.t('cli.colHeight').length);
  const widths = columnWidths(heads, [10, weekdayWidth(words), 5, 6, ...(withType ? [Math.max(high.length, low.length)] : []), heightWidth]);
  const lines = [row(heads, widths)];
  let lastDate = '';
  for (const r of rows) {
    const at = tableStamp(words, toMinute(r.t), zone);
    const first = at.date !== lastDate;
    lastDate = at.date;
    const height = Number.isFinite(r.height)
      ? `${words.heightNumber(r.height, Math.round(r.height * 100) < 0).padStart(heightWidth)} m${Math.round(r.height * 100) < 0 ? `  ${words.t('cli.belowDatum')}` : ''}`
      : words.t('cli.noValue');
    const type = withType ? [r.type === 'high' ? high : low] : [];
    lines.push(row([first ? at.date : '', first ? at.weekday : '', at.clock, at.offset, ...type, height], widths));
  }
  if (rows.length === 0) lines.push(words.t('cli.none'));
  return lines;
}

function render(req: PredictRequest): string {
  const zone = req.station.timezone;
  if (req.stepMinutes === undefined) {
    const events = tideEvents(req.station, req.set, req.from, req.to);
    if (req.format === 'json') return jsonRecords(eventRecords(events, req.station));
    if (req.format === 'csv') return csvText(csvTable(eventFields('m'), eventRecords(events, req.station), HEIGHT_DIGITS));
    const header = tideHeader(req, req.words.t('site.colTides'));
    const rows = events.map((e) => ({ t: e.time, type: e.type, height: e.height }));
    return [...header, ...tableRows(rows, zone, req.words)].join('\n') + '\n';
  }
  const stepMs = Math.round(req.stepMinutes * MINUTE);
  const count = Math.ceil((req.to - req.from) / stepMs);
  const heights = tideHeights(req.station, req.set, req.from, stepMs, count);
  if (req.format === 'json') return jsonRecords(heightRecords(req.from, stepMs, heights, req.station));
  if (req.format === 'csv') return csvText(csvTable(heightFields('m'), heightRecords(req.from, stepMs, heights, req.station), HEIGHT_DIGITS));
  const step = req.words.t('unit.minutes', { count: req.stepMinutes });
  const what = req.words.t(req.station.kind === 'secondary' ? 'cli.heightsEverySecondary' : 'cli.heightsEvery', { step });
  const rows = Array.from(heights, (height, i) => ({ t: req.from + i * stepMs, height }));
  return [...tideHeader(req, what), ...tableRows(rows, zone, req.words)].join('\n') + '\n';
}

export async function runPredict(argv: string[]): Promise<number> {
  const req = request(argv);
  if (!req) {
    process.stdout.write(PREDICT_HELP);
    return 0;
  }
  const station = req.station;
  process.stdout.write(station.kind === 'stream' || station.kind === 'stream-secondary' ? renderStreamPrediction(req as StreamPredictRequest) : render(req as PredictRequest));
  return 0;
}
