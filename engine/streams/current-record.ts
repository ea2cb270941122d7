// Reading a current-meter record: a header line naming the columns, then one reading per line, either
// time,speed,direction (the direction in degrees true toward which the water sets) or time,east,north.
// Times are ISO 8601 with Z or a UTC offset; speeds and components in the unit given to the analysis.
// Rows are sorted by time; an exact repeat is dropped; two different readings for one instant are an error.

import { RecordFileError } from '../errors.js';
import { parseInstant } from '../analysis/record.js';
import { firstOf, itemAt } from '../item.js';

export interface CurrentRecord {
  file: string;
  times: Float64Array; // UTC epoch ms, strictly increasing
  east: Float64Array;
  north: Float64Array;
  columns: 'speed-direction' | 'east-north';
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const HEADER_FIX = 'start the file with a header line naming the columns: time,speed,direction or time,east,north';

const fields = (text: string): string[] => text.split(/[,;\t]/).map((f) => f.trim().replace(/^"|"$/g, '').trim());

/** True when the first content line of a record names current columns (speed/direction or east/north). */
export function isCurrentRecord(text: string): boolean {
  const first = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/).map((l) => l.trim()).find((l) => l !== '' && !l.startsWith('#'));
  return first !== undefined && columnsOf(first) !== undefined;
}

function columnsOf(header: string): CurrentRecord['columns'] | undefined {
  const names = fields(header).map((f) => f.toLowerCase());
  if (names.length !== 3) return undefined;
  if (/^(speed|rate)/.test(itemAt(names, 1, 'names')) && /^dir/.test(itemAt(names, 2, 'names'))) return 'speed-direction';
  if (/^(east|u\b)/.test(itemAt(names, 1, 'names')) && /^(north|v\b)/.test(itemAt(names, 2, 'names'))) return 'east-north';
  return undefined;
}

export function parseCurrentRecord(text: string, file: string): CurrentRecord {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  let columns: CurrentRecord['columns'] | undefined;
  const rows: { line: number; time: number; east: number; north: number }[] = [];
  const DEG = Math.PI / 180;
  for (let i = 0; i < lines.length; i++) {
    const body = itemAt(lines, i, 'lines').trim();
    if (body === '' || body.startsWith('#')) continue;
    if (columns === undefined) {
      columns = columnsOf(body);
      if (columns === undefined) throw new RecordFileError(file, `line ${i + 1}`, `"${body}" is not a header of a current-meter record`, HEADER_FIX);
      continue;
    }
    const f = fields(body);
    if (f.length !== 3) {
      throw new RecordFileError(file, `line ${i + 1}`, `the row has ${f.length} fields ("${body}")`, `write exactly three fields, e.g. 2027-01-01T00:00:00Z,1.25,${columns === 'east-north' ? '0.40' : '70'}`);
    }
    const time = parseInstant(firstOf(f, 'f'));
    if (time === undefined || time === 'no-offset') {
      throw new RecordFileError(file, `line ${i + 1}, time`, `"${f[0]}" is not an ISO 8601 time with Z or a UTC offset`, 'write the time like 2027-01-01T00:00:00Z');
    }
    for (const k of [1, 2]) {
      if (!DECIMAL.test(itemAt(f, k, 'f'))) {
        throw new RecordFileError(file, `line ${i + 1}, ${k === 1 ? (columns === 'east-north' ? 'east' : 'speed') : (columns === 'east-north' ? 'north' : 'direction')}`,
          `"${f[k]}" is not a number`, 'write a number with a decimal point, or delete the row: gaps are allowed');
      }
    }
    const a = Number(f[1]);
    const b = Number(f[2]);
    if (columns === 'speed-direction') {
      if (a < 0) throw new RecordFileError(file, `line ${i + 1}, speed`, `${a} is negative`, 'write the speed as a positive number and the direction the water sets toward');
      if (!(b >= 0 && b <= 360)) throw new RecordFileError(file, `line ${i + 1}, direction`, `${b} is not a direction from 0 to 360 degrees`, 'write degrees true toward which the water sets, e.g. 70');
      rows.push({ line: i + 1, time, east: a * Math.sin(b * DEG), north: a * Math.cos(b * DEG) });
    } else {
      rows.push({ line: i + 1, time, east: a, north: b });
    }
  }
  if (columns === undefined || rows.length === 0) throw new RecordFileError(file, 'rows', 'the record holds no readings', HEADER_FIX);
  rows.sort((p, q) => p.time - q.time || p.line - q.line);
  const out = { times: [] as number[], east: [] as number[], north: [] as number[], line: [] as number[] };
  for (const r of rows) {
    const last = out.times.length - 1;
    if (last >= 0 && out.times[last] === r.time) {
      if (out.east[last] === r.east && out.north[last] === r.north) continue;
      throw new RecordFileError(file, `lines ${out.line[last]} and ${r.line}`, `two different readings for ${new Date(r.time).toISOString()}`, 'keep the right one of the two rows and delete the other');
    }
    out.times.push(r.time);
    out.east.push(r.east);
    out.north.push(r.north);
    out.line.push(r.line);
  }
  return { file, times: Float64Array.from(out.times), east: Float64Array.from(out.east), north: Float64Array.from(out.north), columns };
}
