// `tidewright check`: validates a whole station set and lists every problem, not just the first,
// each naming file, field and fix; then suspicious constants that pass the schema.

import {
  checkStationSet, suspiciousConstants, StationFileError, windowLevelProblems, suspiciousStream, oneLine, type Station,
} from '../engine/index.js';
import { checkProjectFile } from './build/project.js';
import { siteFilesFolder } from './build/site-files.js';
import { siteThemeFolder } from './build/site-theme.js';
import { coverageNotes } from '../templates/pdf/coverage.js';
import { parseCommandLine, positionalArguments } from './args.js';
import { commandWords, LOCALE_HELP, LOCALE_OPTION } from './locale.js';

export const DEFAULT_STATIONS_DIR = 'stations-demo';

export const CHECK_HELP = `Usage: tidewright check [--stations DIR] [--locale TAG]

Checks every station file in DIR (default: ${DEFAULT_STATIONS_DIR}) and the set as a whole: the keys and
values of each file, time zones and constituent names, unique ids, each secondary port's reference port,
and constants that are probably wrong (a mean level that puts chart datum far from the lowest tides,
amplitudes too large for a tide, time differences of many hours; for tidal stream stations an ellipse
axis over 10 knots, a minor axis longer than the major, a missing M2), and access windows whose level the
tide never reaches or never leaves over the station's 19-year datum epoch (a warning: the set is still
usable). Every problem is listed on its own line as FILE: FIELD: what is wrong; what to write instead.
Exit code 1 when there is any problem; warnings alone leave it 0.
Notes (FILE: FIELD: note: …) point at things that may be meant, such as a secondary port whose time
zone differs from its reference port's, or characters the book's typeface lacks (the PDF prints a
replacement mark for them); they do not change the exit code. The problems are in English (they quote the
files' own keys); --locale words the closing summary line:
${LOCALE_HELP}`;

export interface SetReport {
  problems: StationFileError[];
  warnings: StationFileError[]; // listed, but no reason to refuse the set (a window that never opens)
  referencePorts: number;
  secondaryPorts: number;
  streamStations: number;
  files: number;
  notes: string[]; // worth a look but not wrong: another time zone than the reference port's, characters the book lacks
}

/** A secondary port keeps its own time zone; one that differs from its reference port's may be a slip. */
function zoneNotes(stations: readonly Station[]): string[] {
  const byId = new Map(stations.map((s) => [s.id, s]));
  return stations.flatMap((s) => {
    const reference = s.kind === 'secondary' ? byId.get(s.reference) : undefined;
    if (!reference || reference.timezone === s.timezone) return [];
    return [`${oneLine(s.sourceFile ?? s.id)}: timezone: note: ${s.timezone} differs from ${reference.timezone} of its reference port ` +
      `${reference.id}; its times are printed in ${s.timezone} (right if the port lies in another zone, else write timezone: ${reference.timezone})`];
  });
}

/** Every problem of the station set in DIR: schema, set-wide, then suspicious constants. */
export function checkStations(dir: string): SetReport {
  const result = checkStationSet(dir);
  const problems = [...result.problems];
  const byId = new Map(result.stations.map((s) => [s.id, s]));
  for (const station of result.stations) {
    const reference = station.kind === 'secondary' ? byId.get(station.reference) : undefined;
    problems.push(...suspiciousConstants(station, reference));
  }
  for (const stream of result.streams) {
    const reference = stream.kind === 'stream-secondary' ? result.streams.find((s) => s.id === stream.reference) : undefined;
    problems.push(...suspiciousStream(stream, reference));
  }
  problems.push(...checkProjectFile(dir).problems);
  try {
    siteFilesFolder(dir, [...result.stations, ...result.streams].map((s) => s.id));
    siteThemeFolder(dir);
  } catch (error) {
    if (!(error instanceof StationFileError)) throw error;
    problems.push(error);
  }
  // Window levels need the station's predicted range, so only a set without other problems gets them.
  const warnings: StationFileError[] = [];
  if (problems.length === 0) {
    const set = { byId };
    for (const station of result.stations) warnings.push(...windowLevelProblems(station, set));
  }
  // Group by file, keeping the order found within each file.
  const order = new Map(result.files.map((f, i) => [f, i]));
  const sorted = problems
    .map((p, i) => ({ p, i }))
    .sort((a, b) => (order.get(a.p.file) ?? -1) - (order.get(b.p.file) ?? -1) || a.i - b.i)
    .map(({ p }) => p);
  return {
    problems: sorted,
    warnings,
    referencePorts: result.stations.filter((s) => s.kind === 'reference').length,
    secondaryPorts: result.stations.filter((s) => s.kind === 'secondary').length,
    streamStations: result.streams.length,
    files: result.files.length,
    notes: [...zoneNotes(result.stations), ...[...result.stations, ...result.streams].flatMap((st) => coverageNotes(st, oneLine(st.sourceFile ?? st.id)))],
  };
}

export async function runCheck(argv: string[]): Promise<number> {
  const { values, positionals } = parseCommandLine('check', argv, {
    stations: { type: 'string' },
    ...LOCALE_OPTION,
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    process.stdout.write(CHECK_HELP);
    return 0;
  }
  positionalArguments('check', positionals, []);
  const dir = values.stations ?? DEFAULT_STATIONS_DIR;
  const words = commandWords(values.locale, dir);
  const report = checkStations(dir);
  if (report.notes.length > 0) process.stdout.write(`${report.notes.join('\n')}\n`);
  const warned = report.warnings.map((w) => `${words.t('check.warning', { message: w.message })}\n`).join('');
  if (report.problems.length === 0) {
    const counts = [
      words.t('check.referencePorts', { count: report.referencePorts }),
      words.t('check.secondaryPorts', { count: report.secondaryPorts }),
      ...(report.streamStations > 0 ? [words.t('check.streamStations', { count: report.streamStations })] : []),
    ].join(', ');
    const line = report.warnings.length > 0
      ? words.t('check.okWarnings', { dir, counts, warnings: words.t('check.warnings', { count: report.warnings.length }) })
      : words.t('check.ok', { dir, counts });
    process.stdout.write(`${warned}${line}\n`);
    return 0;
  }
  const badFiles = new Set(report.problems.map((p) => p.file)).size;
  const lines = report.problems.map((p) => p.message);
  lines.push(words.t('check.failed', {
    dir, problems: words.t('check.problems', { count: report.problems.length }), files: words.t('check.files', { count: badFiles }), total: report.files,
  }));
  process.stdout.write(`${lines.join('\n')}\n`);
  return 1;
}
