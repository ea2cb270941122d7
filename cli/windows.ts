// `tidewright windows`: when the tide stands at or above (or at or below) a level, for any span, without
// a station-file entry: the question "when can I get over the sill" asked ad hoc.

import { DateTime } from 'luxon';
import {
  UsageError, isoLocal, isoUtc, loadStationFile, openIntervals,
  type OpenInterval, type WindowSide,
} from '../engine/index.js';
import type { Station } from '../engine/index.js';
import { dirname } from 'node:path';
import type { Words } from '../templates/locale/index.js';
import { oneOf, parseCommandLine, parseWhen, positionalArguments } from './args.js';
import { commandWords, LOCALE_HELP, LOCALE_OPTION, row, tableHeader, tableStamp } from './locale.js';
import { csvTable, csvText, type ExportRecord } from '../templates/exports/fields.js';
import { stationSetFor } from './predict.js';

const FORMATS = ['table', 'json', 'csv'] as const;
type Format = (typeof FORMATS)[number];

const MINUTE = 60_000;
const MAX_SPAN_MS = 400 * 366 * 86_400_000; // four centuries: far beyond any book, short enough to finish

export const WINDOWS_HELP = `Usage: tidewright windows STATION.yaml (--above METRES | --below METRES)
                          [--from DATE] [--to DATE] [--format table|json|csv] [--stations DIR]

Every interval when the predicted tide stands at or above (--above) or at or below (--below) a level,
e.g. over a sill or a bar (--above) or under a bridge (--below). Heights are metres above the station's
datum. Intervals are clipped to the span: one already open at --from starts there.

  --above METRES    open while the tide is at or above this height
  --below METRES    open while the tide is at or below this height (give one of the two)
  --from DATE       start: YYYY-MM-DD (midnight in the station's time zone) or an ISO 8601 instant;
                    default: today at the station
  --to DATE         end, not included; same forms; default: 7 days after --from
  --format FORMAT   table (default: local times to the minute), json
                    ([{"station_id":…,"start":"…Z","start_local":"…","end":"…Z","end_local":"…",
                    "duration_min":…}], UTC to the second) or csv with the same fields
  --stations DIR    the station set a secondary port's reference port is found in
                    (default: the folder of STATION.yaml)
${LOCALE_HELP}
Reference ports: each crossing of the level is found on the harmonic prediction itself, between two
consecutive high and low waters (where the curve is monotone). Secondary ports: on the half-cosine curve
between the port's own high and low waters, an approximation; leave a margin.

Example: tidewright windows stations-demo/brinewold-head.yaml --above 2.4 --from 2027-06-01 --to 2027-06-08
`;

interface WindowsRequest {
  station: Station;
  side: WindowSide;
  level: number;
  from: number;
  to: number;
  format: Format;
  intervals: OpenInterval[];
  words: Words;
}

/** A level in metres: a plain decimal number. */
export function parseLevel(option: string, text: string): number {
  const value = /^[-+]?\d+(\.\d+)?$/.test(text.trim()) ? Number(text) : Number.NaN;
  if (!Number.isFinite(value) || Math.abs(value) > 100) {
    throw new UsageError(option, `"${text}" is not a height in metres`, `write metres above the datum, e.g. ${option} 2.40`);
  }
  return value;
}

function request(argv: readonly string[]): WindowsRequest | undefined {
  const { values, positionals } = parseCommandLine('windows', argv, {
    above: { type: 'string' },
    below: { type: 'string' },
    from: { type: 'string' },
    to: { type: 'string' },
    format: { type: 'string', default: 'table' },
    stations: { type: 'string' },
    ...LOCALE_OPTION,
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) return undefined;
  const [file] = positionalArguments('windows', positionals, ['STATION.yaml']) as [string];
  if ((values.above === undefined) === (values.below === undefined)) {
    throw new UsageError(values.above === undefined ? '--above' : '--below',
      values.above === undefined ? 'is missing (and so is --below)' : 'cannot go with --above',
      'give one level: --above 2.40 (over a sill) or --below 3.10 (under a bridge)');
  }
  const side: WindowSide = values.above !== undefined ? 'above' : 'below';
  const level = parseLevel(`--${side}`, (values.above ?? values.below)!);
  const format = oneOf('--format', values.format, FORMATS);
  const words = commandWords(values.locale, values.stations ?? dirname(file));
  const station = loadStationFile(file);
  const set = stationSetFor(file, station, values.stations);
  const zone = station.timezone;
  const from = values.from === undefined ? DateTime.now().setZone(zone).startOf('day').toMillis() : parseWhen('--from', values.from, zone);
  const to = values.to === undefined ? DateTime.fromMillis(from, { zone }).plus({ days: 7 }).toMillis() : parseWhen('--to', values.to, zone);
  if (!(to > from)) {
    throw new UsageError('--to', `${values.to ?? ''} is not later than --from ${values.from ?? ''}`.replace(/\s+/g, ' ').trim(), 'give an end after the start, e.g. --from 2027-01-01 --to 2027-02-01');
  }
  if (to - from > MAX_SPAN_MS) {
    throw new UsageError('--to', 'is more than 400 years after --from', 'ask for a shorter span');
  }
  return { station, side, level, from, to, format, words, intervals: openIntervals(station, set, side, level, from, to) };
}

// JSON and CSV use the exports' one vocabulary (templates/exports/fields.ts, README "Fields of the exports").
function records(req: WindowsRequest): ExportRecord[] {
  const zone = req.station.timezone;
  return req.intervals.map((w) => ({
    station_id: req.station.id, start: isoUtc(w.start), start_local: isoLocal(w.start, zone), end: isoUtc(w.end), end_local: isoLocal(w.end, zone),
    duration_min: Math.round((w.end - w.start) / MINUTE),
  }));
}

function json(req: WindowsRequest): string {
  const rows = records(req).map((r) => JSON.stringify(r));
  return rows.length === 0 ? '[]\n' : `[\n${rows.join(',\n')}\n]\n`;
}

function csv(req: WindowsRequest): string {
  return csvText(csvTable(['station_id', 'start', 'start_local', 'end', 'end_local', 'duration_min'], records(req)));
}

function duration(ms: number): string {
  const minutes = Math.round(ms / MINUTE);
  return `${Math.floor(minutes / 60)} h ${String(minutes % 60).padStart(2, '0')} min`;
}

function table(req: WindowsRequest): string {
  const { station, from, to, words } = req;
  const zone = station.timezone;
  const level = words.height(req.level).replace('\u00a0', ' ');
  const stamp = (t: number): string => {
    const at = tableStamp(words, Math.round(t / MINUTE) * MINUTE, zone);
    return `${at.date} ${at.weekday} ${at.clock} ${at.offset}`;
  };
  const rule = words.t(req.side === 'above' ? 'window.ruleAbove' : 'window.ruleBelow', { level });
  const heads = [words.t('cli.opens'), words.t('cli.closes'), words.t('cli.openFor')] as const;
  const width = Math.max(...[from, to].map((t) => stamp(t).length)) + 2;
  const widths = [Math.max(width, heads[0].length), Math.max(width, heads[1].length), 0] as const;
  const lines = [
    ...tableHeader(words, {
      station: words.t('cli.stationLine', { station: station.name, kind: words.t(station.kind === 'reference' ? 'port.referenceLower' : 'port.secondaryLower'), id: station.id }),
      where: words.t('cli.whereZone', { position: words.position(station.position), zone }),
      what: words.t('cli.windowRule', { rule, datum: station.datum }), from, to, zone,
      reading: words.t('cli.windowTimes'),
      provenance: station.provenance,
    }),
    ...(station.kind === 'secondary' ? [words.t('cli.secondaryNote', { note: words.t('window.secondaryNote') })] : []),
    '',
    row(heads, widths),
  ];
  for (const w of req.intervals) {
    const opens = `${stamp(w.start)}${w.start <= from ? ' *' : ''}`;
    const closes = `${stamp(w.end)}${w.end >= to ? ' *' : ''}`;
    lines.push(row([opens, closes, duration(w.end - w.start)], widths));
  }
  if (req.intervals.length === 0) lines.push(words.t(req.side === 'above' ? 'cli.neverAbove' : 'cli.neverBelow', { level }));
  if (req.intervals.some((w) => w.start <= from || w.end >= to)) lines.push(words.t('cli.openAtEdge'));
  return lines.join('\n') + '\n';
}

export async function runWindows(argv: string[]): Promise<number> {
  const req = request(argv);
  if (!req) {
    process.stdout.write(WINDOWS_HELP);
    return 0;
  }
  process.stdout.write(req.format === 'json' ? json(req) : req.format === 'csv' ? csv(req) : table(req));
  return 0;
}
