// `tidewright differences`: a short gauge record at a secondary port, taken while the reference port's
// constants are known, in; a secondary-port station file with fitted time and height differences out.

import {
  UsageError, analyseDifferences, secondaryStationYaml, loadStationFile, parseStation,
} from '../engine/index.js';
import { outputTargets, readRecordFile, stationMeta, withNegativeNumbers, writeOutputs } from './analyse.js';
import { checkOutputFiles } from './output-files.js';
import { parseCommandLine, positionalArguments } from './args.js';

export const DIFFERENCES_HELP = `Usage: tidewright differences SECONDARY.csv --reference STATION.yaml
                          [--id ID] [--name NAME] [--latitude DEG] [--longitude DEG]
                          [--timezone ZONE] [--datum LABEL] [--output FILE.yaml] [--force]

Time and height differences of a secondary port from a gauge record taken there, printed as a
secondary-port station file. The record's high and low waters are matched to the reference port's
predicted ones, and each difference is fitted for springs and neaps against the reference port's
range. A record of two weeks or more (a spring-neap cycle) gives separate spring and neap values.

SECONDARY.csv holds time,height rows as for tidewright analyse (ISO 8601 times with Z or an offset,
heights in metres on the secondary port's datum).

  --reference FILE   the reference port's station file (kind: reference)
  --id ID            station id (default: from the record's file name)
  --name NAME        station name (default: the record's file name)
  --latitude DEG     position of the secondary port (default: the reference port's, with a note)
  --longitude DEG
  --timezone ZONE    IANA time zone (default: the reference port's)
  --datum LABEL      what the record's heights are measured from (default: the reference port's datum)
  --output FILE      write the station file there instead of printing it
  --force            replace --output if the file exists (never an input of this run)

Example: tidewright differences cove-gauge.csv --reference stations-demo/brinewold-head.yaml --latitude 47.7 --longitude -15.95
`;

export async function runDifferences(argv: string[]): Promise<number> {
  const { values, positionals } = parseCommandLine('differences', withNegativeNumbers(argv), {
    reference: { type: 'string' },
    id: { type: 'string' },
    name: { type: 'string' },
    latitude: { type: 'string' },
    longitude: { type: 'string' },
    timezone: { type: 'string' },
    datum: { type: 'string' },
    output: { type: 'string' },
    force: { type: 'boolean' },
    help: { type: 'boolean', short: 'h' },
  });
  if (values.help) {
    process.stdout.write(DIFFERENCES_HELP);
    return 0;
  }
  const [file] = positionalArguments('differences', positionals, ['SECONDARY.csv']) as [string];
  if (values.reference === undefined) {
    throw new UsageError('--reference', 'is missing', 'add --reference with the reference port\'s station file, e.g. --reference stations-demo/brinewold-head.yaml');
  }
  const targets = outputTargets({ output: values.output });
  const inputs = [file, values.reference];
  checkOutputFiles(targets, inputs, values.force === true);
  const reference = loadStationFile(values.reference);
  if (reference.kind !== 'reference') {
    throw new UsageError('--reference', `${values.reference} is a secondary port (kind: secondary)`,
      `give the station file of its reference port${reference.reference ? ` (${reference.reference})` : ''}, which holds harmonic constants`);
  }
  const meta = stationMeta('differences', file, values, {
    datum: reference.datum,
    latitude: reference.position.latitude,
    longitude: reference.position.longitude,
    timezone: reference.timezone,
  });
  const notes: string[] = [];
  if (values.latitude === undefined || values.longitude === undefined) {
    notes.push(`The position is the reference port's (${meta.latitude}, ${meta.longitude}); replace it with this port's own.`);
  }
  if (values.datum === undefined) {
    notes.push(`The record's heights are taken to be above this port's ${meta.datum}; if the gauge's zero is ` +
      'elsewhere, add the offset to every height difference.');
  }
  const analysis = analyseDifferences(readRecordFile(file), reference);
  const yaml = secondaryStationYaml(analysis, meta, notes);
  parseStation(yaml, values.output ?? 'the fitted station file'); // the loader must accept what we print
  writeOutputs(yaml, targets.map((t) => ({ ...t, text: yaml })), inputs, values.force === true);
  const f = analysis.fits;
  process.stderr.write(`tidewright: ${f.highTime.count} high and ${f.lowTime.count} low waters matched to ${reference.id}; ` +
    `RMS of the fit: high water ${f.highTime.rms.toFixed(1)} min / ${f.highHeight.rms.toFixed(3)} m, ` +
    `low water ${f.lowTime.rms.toFixed(1)} min / ${f.lowHeight.rms.toFixed(3)} m\n`);
  return 0;
}
