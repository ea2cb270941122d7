// Reading a gauge record: one `time,height` row per line, ISO 8601 times with a UTC offset, heights in
// metres. Rows are sorted by time; exact duplicates are dropped; two different heights for the same
// instant are an error (we cannot know which one the gauge meant, and averaging would hide a fault).

import { RecordFileError } from '../errors.js';
import { itemAt } from '../item.js';

/** A gauge record as the analysis reads it: times strictly increasing. */
export interface GaugeRecord {
  file: string;
  times: Float64Array; // UTC epoch milliseconds
  heights: Float64Array; // metres above the gauge's zero
  duplicatesDropped: number; // rows that repeated an earlier row exactly
  wasUnsorted: boolean; // rows came out of time order and were sorted
}

interface Row {
  line: number;
  time: number;
  height: number;
}

const ISO_TIME =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?\s*(Z|z|[+-]\d{2}(?::?\d{2})?)$/;
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const DATE_LIKE = /\d{4}-\d{2}-\d{2}|\d{1,2}[/.]\d{1,2}[/.]\d{2,4}/;
// A height this large is a missing-value marker (-999, 9999) or a value in mm/cm, never a tide in metres.
const IMPLAUSIBLE_HEIGHT = 100;
const EXAMPLE_ROW = '2027-01-01T00:00:00Z,2.41';

function unquote(field: string): string {
  const t = field.trim();
  return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1).trim() : t;
}

function splitRow(text: string): string[] {
  for (const sep of [',', ';', '\t']) if (text.includes(sep)) return text.split(sep).map(unquote);
  return text.trim().split(/\s+(?=[^\s]+$)/).map(unquote); // "time height" with one space before the height
}

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** Parses an ISO 8601 instant that carries Z or a UTC offset; undefined when it cannot. */
export function parseInstant(text: string): number | 'no-offset' | undefined {
  const m = ISO_TIME.exec(text);
  if (m === null) {
    return /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?$/.test(text) ? 'no-offset' : undefined;
  }
  const [, y, mo, d, h, mi, s, frac, zone] = m;
  const year = Number(y), month = Number(mo), day = Number(d), hour = Number(h), minute = Number(mi);
  const second = s === undefined ? 0 : Number(s);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return undefined;
  if (hour > 23 || minute > 59 || second > 59) return undefined;
  let offsetMinutes = 0;
  if (zone !== 'Z' && zone !== 'z') {
    const digits = zone!.slice(1).replace(':', '');
    const oh = Number(digits.slice(0, 2)), om = digits.length > 2 ? Number(digits.slice(2)) : 0;
    if (oh > 14 || om > 59) return undefined;
    offsetMinutes = (zone!.startsWith('-') ? -1 : 1) * (oh * 60 + om);
  }
  const ms = frac === undefined ? 0 : Math.round(Number(frac) * 1000);
  return Date.UTC(year, month - 1, day, hour, minute, second, ms) - offsetMinutes * 60_000;
}

function parseRow(file: string, line: number, text: string, mayBeHeader: boolean): Row | 'header' {
  const fields = splitRow(text);
  const timeText = fields[0] ?? '';
  const heightText = fields[1] ?? '';
  const time = parseInstant(timeText);
  if (time === undefined || time === 'no-offset') {
    if (mayBeHeader && !DATE_LIKE.test(timeText) && !DECIMAL.test(heightText)) return 'header';
    if (time === 'no-offset') {
      throw new RecordFileError(file, `line ${line}, time`, `"${timeText}" has no UTC offset`,
        `add Z for UTC or the offset the gauge used, e.g. ${timeText}Z or ${timeText}+01:00`);
    }
    throw new RecordFileError(file, `line ${line}, time`, `"${timeText}" is not an ISO 8601 time`,
      `write the time like 2027-01-01T00:00:00Z (a row reads ${EXAMPLE_ROW})`);
  }
  if (fields.length > 2) {
    throw new RecordFileError(file, `line ${line}`, `the row has ${fields.length} fields ("${text}")`,
      `write exactly time,height with a decimal point in the height (e.g. ${EXAMPLE_ROW})`);
  }
  if (fields.length < 2 || heightText === '') {
    throw new RecordFileError(file, `line ${line}, height`, 'the row has no height',
      `write time,height (e.g. ${EXAMPLE_ROW}), or delete the row: gaps in a record are allowed`);
  }
  if (!DECIMAL.test(heightText)) {
    throw new RecordFileError(file, `line ${line}, height`, `"${heightText}" is not a number`,
      'write the height in metres with a decimal point (e.g. 2.41), or delete the row: gaps are allowed');
  }
  const height = Number(heightText);
  if (Math.abs(height) >= IMPLAUSIBLE_HEIGHT) {
    throw new RecordFileError(file, `line ${line}, height`,
      `${heightText} m is not a plausible tide height (a missing-value marker, or millimetres?)`,
      'delete rows the gauge marked as missing (gaps are allowed) and give heights in metres');
  }
  return { line, time, height };
}

/** Reads the text of a gauge record; every unreadable row is a RecordFileError naming its line. */
export function parseRecord(text: string, file: string): GaugeRecord {
  const rows: Row[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  let seenContent = false;
  for (let i = 0; i < lines.length; i++) {
    const body = itemAt(lines, i, 'lines').trim();
    if (body === '' || body.startsWith('#')) continue;
    const row = parseRow(file, i + 1, body, !seenContent);
    seenContent = true;
    if (row !== 'header') rows.push(row);
  }
  if (rows.length === 0) {
    throw new RecordFileError(file, 'rows', 'the record holds no time,height rows',
      `write one row per reading, e.g. ${EXAMPLE_ROW}`);
  }
  let wasUnsorted = false;
  for (let i = 1; i < rows.length; i++) if (itemAt(rows, i, 'rows').time < itemAt(rows, i - 1, 'rows').time) wasUnsorted = true;
  if (wasUnsorted) rows.sort((a, b) => a.time - b.time || a.line - b.line);
  const times: number[] = [];
  const heights: number[] = [];
  const lineOf: number[] = [];
  let duplicatesDropped = 0;
  for (const row of rows) {
    const last = times.length - 1;
    if (last >= 0 && times[last] === row.time) {
      if (heights[last] === row.height) {
        duplicatesDropped++;
        continue;
      }
      throw new RecordFileError(file, `lines ${lineOf[last]} and ${row.line}, height`,
        `two different heights (${heights[last]} m and ${row.height} m) for ${new Date(row.time).toISOString()}`,
        'keep the right one of the two rows and delete the other');
    }
    times.push(row.time);
    heights.push(row.height);
    lineOf.push(row.line);
  }
  return { file, times: Float64Array.from(times), heights: Float64Array.from(heights), duplicatesDropped, wasUnsorted };
}
