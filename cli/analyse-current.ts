// `tidewright analyse` on a current-meter record: a tidal stream station file out. Recognised by its
// header line (time,speed,direction or time,east,north); nothing is written unless the analysis succeeded.

import {
  UsageError, analyseCurrentRecord, readTextFile, isCurrentRecord, majorAxisBearings, parseAnyStation, parseCurrentRecord, streamStationYaml,
} from '../engine/index.js';
import { oneOf } from './args.js';
import { MAX_RECORD_BYTES, numberOption, outputTargets, readRecordFile, stationMeta, writeOutputs } from './analyse.js';
import { checkOutputFiles } from './output-files.js';

interface CurrentValues {
  latitude?: string | undefined;
  longitude?: string | undefined;
  timezone?: string | undefined;
  id?: string | undefined;
  name?: string | undefined;
  rayleigh?: string | undefined;
  output?: string | undefined;
  report?: string | undefined;
  force?: boolean | undefined;
  'flood-direction'?: string | undefined;
  unit?: string | undefined;
}

/** Exit code when RECORD is a current-meter record (analysed and written), null when it is a tide record. */
export function analyseCurrentFile(file: string, values: CurrentValues): number | null {
  // read with the same checks and size limit as a tide record (never a device or a pipe)
  const read = readTextFile(file, MAX_RECORD_BYTES, 'a CSV file of time,height rows');
  if (!('text' in read)) {
    readRecordFile(file); // the tide path's one-line error for a missing or unreadable file
    return null;
  }
  const text = read.text;
  if (!isCurrentRecord(text)) return null;
  if (values.report !== undefined) {
    throw new UsageError('--report', 'is only for tide gauge records', 'remove --report; the stream station file carries the fit\'s figures as comments');
  }
  const meta = stationMeta('analyse', file, values, { datum: 'none' });
  const unit = oneOf('--unit', values.unit ?? 'kn', ['kn', 'm/s'] as const);
  const rayleigh = values.rayleigh === undefined ? 1 : numberOption('--rayleigh', values.rayleigh, 0.5, 10, 'e.g. --rayleigh 1');
  const targets = outputTargets(values);
  checkOutputFiles(targets, [file], values.force === true);
  const analysis = analyseCurrentRecord(parseCurrentRecord(text, file), { rayleigh });
  if (values['flood-direction'] === undefined) {
    const axis = majorAxisBearings(analysis);
    const hint = axis ? `the main ellipse's axis points toward ${axis[0]}° and ${axis[1]}°: write --flood-direction ${axis[0]} or --flood-direction ${axis[1]}, whichever way the flood runs` : 'write e.g. --flood-direction 70';
    throw new UsageError('--flood-direction', 'is missing (a current record does not say which way is the flood)', hint);
  }
  const flood = numberOption('--flood-direction', values['flood-direction'], 0, 359.99, 'degrees true, e.g. --flood-direction 70');
  const yaml = streamStationYaml(analysis, meta, flood, unit);
  parseAnyStation(yaml, values.output ?? 'the analysed station file'); // the loader must accept what we print
  writeOutputs(yaml, targets.map((t) => ({ ...t, text: yaml })), [file], values.force === true);
  const re = analysis.east.residual;
  const rn = analysis.north.residual;
  process.stderr.write(`tidewright: ${analysis.record.times.length} readings over ${(analysis.east.summary.spanHours / 24).toFixed(1)} days: `
    + `${analysis.ellipses.length} constituent ellipses, residual RMS ${re.rms.toFixed(3)} ${unit} east and ${rn.rms.toFixed(3)} ${unit} north\n`);
  return 0;
}
