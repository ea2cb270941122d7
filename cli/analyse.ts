// `tidewright analyse`: a tide gauge record in, a reference-port station file out (and, on request, an
// HTML report of the fit). Nothing is written unless the whole analysis succeeded. The helpers at the
// bottom are shared with `tidewright differences`.

import { basename, extname } from 'node:path';
import { IANAZone } from 'luxon';
import {
  RecordFileError, UsageError, analyseRecord, parseRecord, type GaugeRecord, referenceStationYaml,
  type StationMeta, idFromText, parseStation, STATION_ID_PATTERN, readTextFile,
} from '../engine/index.js';
import { renderAnalysisReport } from '../templates/report/analysis-report.js';
import { localeOption } from './build/args.js';
import { parseCommandLine, positionalArguments } from './args.js';
import { analyseCurrentFile } from './analyse-current.js';
import { checkOutputFiles, writeOutputFiles, type OutputFile } from './output-files.js';

export const ANALYSE_HELP = `Usage: tidewright analyse RECORD.csv --latitude DEG --longitude DEG --timezone ZONE
                          [--id ID] [--name NAME] [--datum LABEL] [--rayleigh R]
                          [--output FILE.yaml] [--report FILE.html] [--force]

Harmonic constants from a tide gauge record, printed as a reference-port station file.

RECORD.csv holds one reading per line, time,height: an ISO 8601 time with Z or a UTC offset
(2027-01-01T00:00:00Z or 2027-01-01T01:00+01:00) and the height in metres. A header line, comment
lines starting with #, gaps, irregular spacing and unsorted rows are fine; a row repeated exactly is
dropped; two different heights for the same time are an error. The record must span at least
14.77 days (to separate M2 from S2) with readings over at least half of its span.

A record too short to separate a constituent from its neighbour (K2 and T2 from S2, P1 from K1, NU2
and 2N2 from N2, L2 from S2: half a year or more) gets it by inference: the amplitude ratio of the
equilibrium tide and the neighbour's phase lag. The file and the report say which were inferred.

  --latitude DEG     the gauge's latitude, degrees north positive
  --longitude DEG    the gauge's longitude, degrees east positive
  --timezone ZONE    IANA time zone of the harbour, e.g. Europe/Lisbon
  --id ID            station id (default: from the record's file name)
  --name NAME        station name (default: the record's file name)
  --datum LABEL      what the record's heights are measured from (default: "Gauge zero")
  --rayleigh R       Rayleigh factor for choosing constituents, 0.5 to 10 (default 1; larger fits fewer)
  --output FILE      write the station file there instead of printing it
  --report FILE      also write an HTML report: the record, the fit, the residual, the constants
                     with 95 % intervals and the constituents the record could not separate
  --locale TAG       language of the report: en, fr, es, pt, de, nl or nb (default en)
  --force            replace --output or --report if the file exists (never an input of this run)

A current-meter record (a header line time,speed,direction or time,east,north; the direction in
degrees true toward which the water sets) gives a tidal stream station file instead: least squares on
the east and north components, each constituent's ellipse from them. It needs:
  --flood-direction DEG   degrees true toward which the flood sets (the output of a run without it
                          names the two directions of the main ellipse's axis)
  --unit kn|m/s           the unit of the record's speeds (default kn)

Example: tidewright analyse quay-gauge.csv --latitude 47.6 --longitude -15.8 --timezone Europe/Lisbon --report fit.html
`;

export async function runAnalyse(argv: string[]): Promise<number> {
  const { values, positionals } = parseCommandLine('analyse', withNegativeNumbers(argv), {
    latitude: { type: 'string' },
    longitude: { type: 'string' },
    timezone: { type: 'string' },
    id: { type: 'string' },
    name: { type: 'string' },
    datum: { type: 'string' },
    rayleigh: { type: 'string' },
    output: { type: 'string' },
    report: { type: 'string' },
    force: { type: 'boolean' },
    'flood-direction': { type: 'string' },
    unit: { type: 'string' },
    locale: { type: 'string' },
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    process.stdout.write(ANALYSE_HELP);
    return 0;
  }
  const [file] = positionalArguments('analyse', positionals, ['RECORD.csv']) as [string];
  const current = analyseCurrentFile(file, values);
  if (current !== null) return current;
  for (const option of ['flood-direction', 'unit'] as const) {
    if (values[option] !== undefined) throw new UsageError(`--${option}`, 'is only for current-meter records', `remove --${option}, or give a record whose header is time,speed,direction or time,east,north`);
  }
  const meta = stationMeta('analyse', file, values, { datum: 'Gauge zero' });
  const rayleigh = values.rayleigh === undefined ? 1 : numberOption('--rayleigh', values.rayleigh, 0.5, 10, 'e.g. --rayleigh 1');
  const locale = values.locale === undefined ? undefined : localeOption('--locale', values.locale);
  const targets = outputTargets(values);
  checkOutputFiles(targets, [file], values.force === true);
  const analysis = analyseRecord(readRecordFile(file), { rayleigh });
  const yaml = referenceStationYaml(analysis, meta);
  parseStation(yaml, values.output ?? 'the analysed station file'); // the loader must accept what we print
  const texts: Record<string, string> = { '--output': yaml };
  if (values.report !== undefined) texts['--report'] = renderAnalysisReport(analysis, meta, locale);
  writeOutputs(yaml, targets.map((t) => ({ ...t, text: texts[t.option] ?? '' })), [file], values.force === true);
  const r = analysis.residual;
  const unresolved = analysis.excluded.filter((e) => e.reason === 'rayleigh').length;
  const inferred = analysis.constituents.filter((c) => c.inferred !== undefined).map((c) => c.name);
  process.stderr.write(`tidewright: ${r.count} readings over ${(analysis.summary.spanHours / 24).toFixed(1)} days: ` +
    `${analysis.constituents.length} constituents, residual RMS ${r.rms.toFixed(3)} m, ` +
    `${(r.explained * 100).toFixed(1)} % of the variance explained` +
    (inferred.length > 0 ? `; inferred from a neighbour by the equilibrium ratio: ${inferred.join(', ')}` : '') +
    (unresolved > 0 ? `; ${unresolved} ${unresolved === 1 ? 'constituent' : 'constituents'} could not be separated (listed in the file)` : '') + '\n');
  return 0;
}

// ---- shared with cli/differences.ts ------------------------------------------------------------

/** `--longitude -15.8` as `--longitude=-15.8`, so a negative number is read as the value, not an option. */
export function withNegativeNumbers(argv: readonly string[]): string[] {
  const out: string[] = [];
  let joined = -1; // the index of a value already joined to its option
  for (const [i, arg] of argv.entries()) {
    if (i === joined) continue;
    const next = argv[i + 1];
    if (/^--(latitude|longitude)$/.test(arg) && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(`${arg}=${next}`);
      joined = i + 1;
    } else out.push(arg);
  }
  return out;
}

/** A number option within [min, max]; a UsageError naming the option otherwise. */
export function numberOption(option: string, text: string, min: number, max: number, example: string): number {
  const value = /^[+-]?(\d+\.?\d*|\.\d+)$/.test(text.trim()) ? Number(text) : Number.NaN;
  if (!(value >= min && value <= max)) {
    throw new UsageError(option, `"${text}" is not a number from ${min} to ${max}`, `write a number, ${example}`);
  }
  return value;
}

interface MetaValues {
  latitude?: string | undefined;
  longitude?: string | undefined;
  timezone?: string | undefined;
  id?: string | undefined;
  name?: string | undefined;
  datum?: string | undefined;
}

/** Id, name, position, time zone and datum label of the station to write, from the options and defaults. */
export function stationMeta(
  command: string, file: string, values: MetaValues,
  defaults: { datum: string; latitude?: number; longitude?: number; timezone?: string },
): StationMeta {
  const required = (option: string, value: string | undefined, fallback: string | number | undefined, example: string): string => {
    if (value !== undefined) return value;
    if (fallback !== undefined) return String(fallback);
    throw new UsageError(`--${option}`, `is missing (tidewright ${command} needs it for the station file)`, `add --${option} ${example}`);
  };
  const latitude = numberOption('--latitude', required('latitude', values.latitude, defaults.latitude, '47.6'), -90, 90, 'degrees north positive, e.g. --latitude 47.6');
  const longitude = numberOption('--longitude', required('longitude', values.longitude, defaults.longitude, '-15.8'), -180, 180, 'degrees east positive, e.g. --longitude -15.8');
  const timezone = required('timezone', values.timezone, defaults.timezone, 'Europe/Lisbon');
  if (!IANAZone.isValidZone(timezone)) {
    throw new UsageError('--timezone', `"${timezone}" is not a known IANA time zone`, 'write a name such as Europe/Lisbon or Pacific/Auckland');
  }
  const stem = basename(file, extname(file));
  const id = values.id ?? idFromText(stem);
  if (!STATION_ID_PATTERN.test(id) || id.length > 64) {
    throw new UsageError('--id', `"${id}" may only hold lower-case letters a-z, digits and hyphens`, `write --id ${idFromText(id)}`);
  }
  const name = values.name ?? stem;
  const datum = values.datum ?? defaults.datum;
  for (const [option, text] of [['--name', name], ['--datum', datum]] as const) {
    if (text.trim() === '') throw new UsageError(option, 'is empty', `write some text, e.g. ${option} "Brinewold Head"`);
  }
  return { id, name, latitude, longitude, timezone, datum };
}

/** The most a gauge record may hold: ten years of readings every minute is about 150 MiB. */
export const MAX_RECORD_BYTES = 256 * 1024 * 1024;

/** Reads and parses a gauge record; an unreadable file is a RecordFileError naming it. */
export function readRecordFile(file: string): GaugeRecord {
  const result = readTextFile(file, MAX_RECORD_BYTES, 'a CSV file of time,height rows');
  if (!('text' in result)) throw new RecordFileError(file, 'file', result.problem === 'does not exist' ? 'no such file' : result.problem, result.fix);
  const record = parseRecord(result.text, file);
  let low = Infinity, high = -Infinity;
  for (const h of record.heights) {
    low = Math.min(low, h);
    high = Math.max(high, h);
  }
  if (record.heights.length > 0 && high - low < 0.001) {
    throw new RecordFileError(file, 'height', `every reading is ${low.toFixed(3)} m: the record shows no tide to analyse`,
      'give a record of a gauge that was working (its heights rise and fall with the tide)');
  }
  return record;
}

/** The files --output and --report name, text still to come (checked before the work starts). */
export function outputTargets(values: { output?: string | undefined; report?: string | undefined }): OutputFile[] {
  const targets: OutputFile[] = [];
  if (values.output !== undefined) targets.push({ option: '--output', path: values.output, text: '' });
  if (values.report !== undefined) targets.push({ option: '--report', path: values.report, text: '' });
  return targets;
}

/** The files (checked again: time has passed since the first check), or the station file on stdout without --output. */
export function writeOutputs(yaml: string, files: readonly OutputFile[], inputs: readonly string[], force: boolean): void {
  checkOutputFiles(files, inputs, force);
  writeOutputFiles(files);
  if (!files.some((f) => f.option === '--output')) process.stdout.write(yaml);
}
