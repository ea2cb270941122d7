import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RecordFileError } from '../../engine/errors.js';
import { checkAnalysable, summariseRecord } from '../../engine/analysis/coverage.js';
import { parseInstant, parseRecord, type GaugeRecord } from '../../engine/analysis/record.js';
import { firstOf } from '../../engine/index.js';

const dir = new URL('../fixtures/records/', import.meta.url);
const read = (name: string): GaugeRecord => parseRecord(readFileSync(new URL(name, dir), 'utf8'), name);
const HOUR = 3_600_000;
const M2_S2_HOURS = 360 / (30 - 28.9841042); // REFERENCE-VALUES §5: 14.77 days

function errorOf(fn: () => unknown): RecordFileError {
  try {
    fn();
  } catch (error) {
    if (error instanceof RecordFileError) return error;
    throw error;
  }
  throw new Error('expected a RecordFileError');
}

function hourly(days: number, start = Date.UTC(2027, 0, 1), skip: (i: number) => boolean = () => false): GaugeRecord {
  const times: number[] = [];
  for (let i = 0; i <= days * 24; i++) if (!skip(i)) times.push(start + i * HOUR);
  return { file: 'synthetic.csv', times: Float64Array.from(times), heights: new Float64Array(times.length),
    duplicatesDropped: 0, wasUnsorted: false };
}

describe('parseInstant', () => {
  it('reads Z, ±hh:mm and ±hhmm offsets, fractions and a space separator (ISO 8601)', () => {
    expect(parseInstant('2027-01-01T00:00:00Z')).toBe(Date.UTC(2027, 0, 1));
    expect(parseInstant('2027-01-01T01:00:00+01:00')).toBe(Date.UTC(2027, 0, 1));
    expect(parseInstant('2027-01-01 05:30-0230')).toBe(Date.UTC(2027, 0, 1, 8));
    expect(parseInstant('2027-01-01T00:00:00.250Z')).toBe(Date.UTC(2027, 0, 1) + 250);
  });
  it('rejects impossible dates and flags times without offset', () => {
    expect(parseInstant('2027-02-29T00:00:00Z')).toBeUndefined();
    expect(parseInstant('2028-02-29T00:00:00Z')).toBe(Date.UTC(2028, 1, 29));
    expect(parseInstant('2027-01-01T24:00:00Z')).toBeUndefined();
    expect(parseInstant('2027-01-01T00:00:00')).toBe('no-offset');
    expect(parseInstant('01/02/2027 00:00')).toBeUndefined();
  });
});

describe('parseRecord', () => {
  it('sorts, drops exact duplicates, handles offsets, comments, blank lines and no header', () => {
    const record = read('messy.csv');
    expect(Array.from(record.times)).toEqual([0, 1, 2, 3.5].map((h) => Date.UTC(2027, 0, 1) + h * HOUR));
    // 02:00+01:00 is 01:00Z; the exact repeat of 00:00Z is dropped
    expect(Array.from(record.heights)).toEqual([2.41, 2.8, 3.1, 3.3]);
    expect(record.duplicatesDropped).toBe(1);
    expect(record.wasUnsorted).toBe(true);
  });
  it('skips a header line and reads CRLF line ends', () => {
    const record = read('crlf.csv');
    expect(record.times.length).toBe(1);
    expect(record.heights[0]).toBe(1.5);
  });
  it('names file, line and fix for a bad time', () => {
    const e = errorOf(() => read('bad-time.csv'));
    expect(e.message).toBe('bad-time.csv: line 4, time: "2027-01-32T02:00:00Z" is not an ISO 8601 time; ' +
      'write the time like 2027-01-01T00:00:00Z (a row reads 2027-01-01T00:00:00Z,2.41)');
  });
  it('refuses a time without UTC offset, saying how to add one', () => {
    const e = errorOf(() => read('no-offset.csv'));
    expect(e.field).toBe('line 2, time');
    expect(e.fix).toContain('2027-01-01T00:00:00Z');
  });
  it('refuses a decimal comma and a word as height, naming the line', () => {
    const e = errorOf(() => read('bad-height.csv'));
    expect(e.field).toBe('line 3');
    expect(e.fix).toContain('decimal point');
    const word = errorOf(() => parseRecord('time,height\n2027-01-01T00:00:00Z,abc\n', 'w.csv'));
    expect(word.message).toMatch(/^w\.csv: line 2, height: "abc" is not a number; /);
    const none = errorOf(() => parseRecord('2027-01-01T00:00:00Z,\n', 'n.csv'));
    expect(none.field).toBe('line 1, height');
  });
  it('refuses missing-value markers such as -999', () => {
    const e = errorOf(() => read('missing-marker.csv'));
    expect(e.field).toBe('line 3, height');
    expect(e.problem).toContain('-999');
  });
  it('refuses an empty record', () => {
    expect(errorOf(() => read('empty.csv')).field).toBe('rows');
    expect(errorOf(() => parseRecord('', 'blank.csv')).message).toMatch(/^blank\.csv: rows: /);
  });
  it('refuses two different heights for one instant, naming both lines', () => {
    const e = errorOf(() => read('conflicting-duplicates.csv'));
    expect(e.field).toBe('lines 3 and 5, height');
    expect(e.problem).toContain('2.8 m and 2.95 m');
  });
});

describe('record coverage', () => {
  it('measures span, interval, coverage and the longest gap', () => {
    // 30 days hourly with a 5-day hole: 720 h − 120 h + 1.5 h (the step across the hole counts 1.5 intervals)
    const record = hourly(30, Date.UTC(2027, 0, 1), (i) => i > 240 && i < 360);
    const s = summariseRecord(record);
    expect(s.spanHours).toBe(720);
    expect(s.intervalHours).toBe(1);
    expect(s.coverage).toBeCloseTo(601.5 / 720, 6);
    expect(firstOf(s.gaps, 'gaps').hours).toBe(120);
  });
  it('refuses a record shorter than the M2/S2 separation of 14.77 days (REFERENCE-VALUES §5)', () => {
    const record = hourly(14);
    const e = errorOf(() => checkAnalysable(record, summariseRecord(record), M2_S2_HOURS));
    expect(e.message).toMatch(/^synthetic\.csv: time: the record spans 14\.00 days .* 14\.77 days/);
    expect(() => checkAnalysable(hourly(15), summariseRecord(hourly(15)), M2_S2_HOURS)).not.toThrow();
  });
  it('refuses a record with more than half its span missing', () => {
    const record = hourly(40, Date.UTC(2027, 0, 1), (i) => i > 200 && i < 720);
    const e = errorOf(() => checkAnalysable(record, summariseRecord(record), M2_S2_HOURS));
    expect(e.problem).toMatch(/^54 % of the record's span has no readings; the longest gap is 21\.67 days from 2027-01-09T08:00Z/);
  });
});
