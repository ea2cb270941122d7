// `tidewright almanac STATION.yaml --year 2027 [--stations DIR] [--format table|json]`:
// build one station-year model and print it (json: the whole model; table: a short summary).
// User errors are thrown as UserErrors; cli/main.ts prints them as one line, exit code 1.
import { dirname, resolve } from 'node:path';
import { buildStationYear, UsageError, loadAnyStationFile, loadStationSet } from '../engine/index.js';
import type { Station, StationYear } from '../engine/index.js';
import { wordsFor, type Words } from '../templates/locale/index.js';
import { oneOf, parseCommandLine, positionalArguments } from './args.js';
import { commandWords, LOCALE_HELP, LOCALE_OPTION, row } from './locale.js';
import { streamSummary, streamYearFor } from './almanac-stream.js';
import { FIRST_YEAR, LAST_YEAR, yearOption } from './years.js';

const HELP = `Usage: tidewright almanac STATION.yaml [--year YYYY] [--stations DIR] [--format table|json]

Builds one station-year: every high and low water in the station's local time, the daily curves,
sun and moon, springs and neaps, datums and warnings, as the model the website and books print.
For a tidal stream station: every slack and strongest flood and ebb, the daily stream curves, sun and
moon, springs and neaps (from its tide_reference, else from its own rates).
  --year YYYY      the calendar year, ${FIRST_YEAR} to ${LAST_YEAR} (default: next year)
  --stations DIR   folder of the station set, to find a secondary port's reference port
                   (default: the station file's own folder)
  --format json    print the whole model as JSON; table (default) prints a short summary
${LOCALE_HELP}`;

interface AlmanacArgs {
  file: string;
  year: number;
  stations: string | null;
  format: 'table' | 'json';
  locale: string | undefined;
}

function parseAlmanacArgs(argv: readonly string[]): AlmanacArgs | 'help' {
  const { values, positionals } = parseCommandLine('almanac', argv, {
    year: { type: 'string' },
    stations: { type: 'string' },
    format: { type: 'string', default: 'table' },
    ...LOCALE_OPTION,
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) return 'help';
  const [file] = positionalArguments('almanac', positionals, ['STATION.yaml']) as [string];
  let year = new Date().getUTCFullYear() + 1;
  if (values.year !== undefined) {
    year = yearOption('--year', values.year);
  }
  const format = oneOf('--format', values.format ?? 'table', ['table', 'json'] as const);
  return { file, year, stations: values.stations ?? null, format, locale: values.locale };
}

// The station and the set its reference port is looked up in: the --stations folder, else the
// station file's own folder for a secondary port, else the station alone.
function loadStation(args: AlmanacArgs, loaded: Station): { station: Station; set: { byId: ReadonlyMap<string, Station> } } {
  if (args.stations === null && loaded.kind === 'reference') {
    return { station: loaded, set: { byId: new Map([[loaded.id, loaded]]) } };
  }
  const set = loadStationSet(args.stations ?? dirname(args.file));
  const same = set.byId.get(loaded.id);
  const station = same && same.sourceFile && resolve(same.sourceFile) === resolve(args.file) ? same : loaded;
  return { station, set };
}

// `tidewright almanac … | head` closes the pipe early: stop quietly instead of an unhandled EPIPE.
let pipeGuarded = false;
function ignoreClosedPipe(): void {
  if (pipeGuarded) return;
  pipeGuarded = true;
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code !== 'EPIPE') throw error;
  });
}

export async function runAlmanac(argv: readonly string[]): Promise<number> {
  const args = parseAlmanacArgs(argv);
  if (args === 'help') {
    process.stdout.write(HELP);
    return 0;
  }
  const words = commandWords(args.locale, args.stations ?? dirname(args.file));
  const loaded = loadAnyStationFile(args.file);
  if (loaded.kind === 'stream' || loaded.kind === 'stream-secondary') {
    const model = streamYearFor(args.file, loaded, args.stations, args.year);
    ignoreClosedPipe();
    process.stdout.write(args.format === 'json' ? `${JSON.stringify(model)}\n` : streamSummary(model, words));
    return 0;
  }
  const { station, set } = loadStation(args, loaded);
  const model = buildStationYear(station, set, args.year);
  ignoreClosedPipe();
  // the model holds facts only; the printed JSON also carries the caution every output carries
  const json = (): string => `${JSON.stringify({ ...model, caution: words.caution })}\n`;
  process.stdout.write(args.format === 'json' ? json() : summary(model, words));
  return 0;
}

/** A short human summary of a model: station facts, datums, each month's extremes, warnings, caution. */
export function summary(model: StationYear, words: Words = wordsFor()): string {
  const m = (x: number): string => words.height(x);
  const s = model.station;
  const d = model.datums;
  const heads = [words.t('cli.colMonth'), words.t('cli.colHighWaters'), words.t('cli.colLowWaters'), words.t('cli.colHighest'), words.t('cli.colLowest')] as const;
  const monthWidth = Math.max(...model.months.map((mo) => words.monthName(mo.month).length));
  const widths = [Math.max(monthWidth, heads[0].length), heads[1].length, heads[2].length, Math.max(18, heads[3].length), 0] as const;
  const lines = [
    `${words.t('cli.almanacHead', { station: s.name, id: s.id, year: String(model.year), zone: model.timezone })}${model.invented ? ` — ${words.t('cli.invented')}` : ''}`,
    model.reference ? words.t('cli.secondaryOf', { station: model.reference.name, id: model.reference.id }) : words.t('port.reference'),
    words.t('cli.almanacTide', {
      type: words.tideType(model.tideType.kind), form: words.number(model.tideType.formNumber, 2),
      springs: m(model.meanSpringRange), neaps: m(model.meanNeapRange), age: words.hours(model.ageOfTideHours),
    }),
    `${words.t('cli.heightsAboveColon', { datum: s.datum })} HAT ${m(d.HAT)}  MHWS ${m(d.MHWS)}  MHWN ${m(d.MHWN)}  MSL ${m(d.MSL)}  `
      + `MLWN ${m(d.MLWN)}  MLWS ${m(d.MLWS)}  LAT ${m(d.LAT)}  (LAT/HAT ${d.epoch.from}–${d.epoch.to})`,
    '',
    row(heads, widths),
  ];
  for (const month of model.months) {
    const days = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
    const events = days.flatMap((day) => day.events);
    const highs = events.filter((e) => e.type === 'high');
    const lows = events.filter((e) => e.type === 'low');
    const top = highs.reduce<(typeof events)[number] | null>((a, b) => (!a || b.height > a.height ? b : a), null);
    const bottom = lows.reduce<(typeof events)[number] | null>((a, b) => (!a || b.height < a.height ? b : a), null);
    const at = (e: typeof top) => (e === null ? '—' : `${m(e.height).padStart(7)} ${e.date.slice(5, 10)} ${e.clock}`);
    lines.push(row([words.monthName(month.month), String(highs.length).padStart(widths[1]), String(lows.length).padStart(widths[2]), at(top), at(bottom)], widths));
  }
  lines.push('');
  for (const c of model.offsetChanges) lines.push(words.t('cli.clockChange', { change: words.offsetChange(c) }));
  for (const w of model.warnings) lines.push(words.t('cli.warning', { warning: words.warning(w, s.datum) }));
  lines.push(`${words.t('caution.heading')}: ${words.caution}`, '');
  return lines.join('\n');
}
