// `tidewright height`: the predicted height at one instant and whether the tide is rising or falling.

import {
  mm, isoLocal, isoUtc, loadStationFile, heightAndTrend, UsageError,
} from '../engine/index.js';
import { dirname } from 'node:path';
import { oneOf, parseCommandLine, parseWhen, positionalArguments } from './args.js';
import { commandWords, LOCALE_HELP, LOCALE_OPTION, tableStamp } from './locale.js';
import { stationSetFor } from './predict.js';

const FORMATS = ['table', 'json'] as const;

export const HEIGHT_HELP = `Usage: tidewright height STATION.yaml --at INSTANT [--format table|json] [--stations DIR]

The predicted height of the tide at one instant, in metres above the station's datum, and whether the
tide is rising or falling then.

  --at INSTANT      2027-03-14T15:20 (local time at the station), or an ISO 8601 instant with Z or an
                    offset (2027-03-14T15:20Z, 2027-03-14T15:20+01:00), taken as given
  --format FORMAT   table (default) or json ({"time":"…Z","local":"…","height":2.41,"trend":"rising"})
  --stations DIR    the station set a secondary port's reference port is found in
                    (default: the folder of STATION.yaml)
${LOCALE_HELP}
Secondary ports take the height from the half-cosine curve between their own high and low waters.

Example: tidewright height stations-demo/brinewold-head.yaml --at 2027-03-14T15:20
`;

export async function runHeight(argv: string[]): Promise<number> {
  const { values, positionals } = parseCommandLine('height', argv, {
    at: { type: 'string' },
    format: { type: 'string', default: 'table' },
    stations: { type: 'string' },
    ...LOCALE_OPTION,
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    process.stdout.write(HEIGHT_HELP);
    return 0;
  }
  const [file] = positionalArguments('height', positionals, ['STATION.yaml']) as [string];
  const format = oneOf('--format', values.format, FORMATS);
  const words = commandWords(values.locale, values.stations ?? dirname(file));
  if (values.at === undefined) throw new UsageError('--at', 'is missing', 'give the instant, e.g. --at 2027-03-14T15:20 (local time at the station)');
  const station = loadStationFile(file);
  const set = stationSetFor(file, station, values.stations);
  const zone = station.timezone;
  const t = parseWhen('--at', values.at, zone);
  const { height, trend } = heightAndTrend(station, set, t);
  if (format === 'json') {
    process.stdout.write(`${JSON.stringify({ station_id: station.id, time: isoUtc(t), time_local: isoLocal(t, zone), height_m: mm(height), trend })}\n`);
    return 0;
  }
  const at = tableStamp(words, t, zone, true);
  const below = Math.round(height * 100) < 0;
  const lines = [
    words.t('cli.stationLine', { station: station.name, kind: words.t(station.kind === 'reference' ? 'port.referenceLower' : 'port.secondaryLower'), id: station.id }),
    words.t('cli.whereZone', { position: words.position(station.position), zone }),
    `${at.date} ${at.weekday} ${at.clock} ${at.offset}  ${words.t(trend === 'rising' ? 'cli.heightRising' : 'cli.heightFalling', {
      height: words.height(height).replace('\u00a0', ' '), datum: station.datum })}${below ? ` (${words.t('cli.belowDatum')})` : ''}`,
    ...(station.kind === 'secondary' ? [words.t('cli.secondaryNote', { note: words.t('window.secondaryNote') })] : []),
    words.t('cli.constants', { provenance: station.provenance }),
    `${words.t('caution.heading')}: ${words.caution}`,
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
  return 0;
}
