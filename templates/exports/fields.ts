// One vocabulary for every export: `predict --format json|csv`, the build's CSV and JSON downloads.
// A field has the same name and meaning wherever it appears (README, "Fields of the exports"):
// snake_case; `station_id` on every record; an instant in UTC is named for what it is (`time`, `start`,
// `end`: ISO 8601 with Z, to the second) and the same instant in the station's local time adds `_local`
// (ISO 8601 with the offset); a quantity carries its unit (`height_m`, `height_ft`, `duration_min`);
// yes/no facts are true/false in both CSV and JSON.
import { inUnits, type Units } from '../locale/index.js';

export type FieldValue = string | number | boolean | null;
export type ExportRecord = Record<string, FieldValue>;

/** `height_m` or `height_ft`: the name says the unit. */
export const heightField = (units: Units): string => (units === 'ft' ? 'height_ft' : 'height_m');

/** A height in the export's unit: metres to the millimetre, feet to the hundredth. */
export function exportHeight(metres: number, units: Units): number {
  const scale = units === 'ft' ? 100 : 1000;
  return Math.round(inUnits(metres, units) * scale) / scale + 0; // + 0 turns -0 into 0
}

export const eventFields = (units: Units): string[] => ['station_id', 'time', 'time_local', 'date_local', 'type', heightField(units), 'below_chart_datum'];
export const heightFields = (units: Units): string[] => ['station_id', 'time', 'time_local', heightField(units)];

/**
 * A high or low water. `dateLocal` is the local date of its printed minute (23:59:40 prints 00:00 the next
 * day); `height` in metres above chart datum; `below_chart_datum` when it prints below zero.
 */
export function eventRecord(stationId: string, time: string, timeLocal: string, dateLocal: string, type: string, height: number, units: Units): ExportRecord {
  const h = exportHeight(height, units);
  return { station_id: stationId, time, time_local: timeLocal, date_local: dateLocal, type, [heightField(units)]: h, below_chart_datum: h < 0 };
}

/** A height at an instant; null where there is none (outside a secondary port's events). */
export function heightRecord(stationId: string, time: string, timeLocal: string, height: number | null, units: Units): ExportRecord {
  return { station_id: stationId, time, time_local: timeLocal, [heightField(units)]: height === null || !Number.isFinite(height) ? null : exportHeight(height, units) };
}

/** One CSV field, quoted when it holds a comma, quote or line break (RFC 4180 §2). */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

function csvValue(value: FieldValue, digits: number | undefined): string {
  if (value === null) return '';
  if (typeof value === 'number') return digits === undefined ? String(value) : value.toFixed(digits);
  return csvField(String(value));
}

/**
 * Header and rows of a CSV table (RFC 4180: CRLF line ends), fields in the given order. Numbers print
 * with `digits[field]` decimals (heights: 3 for metres, 2 for feet), else as they are.
 */
export function csvTable(fields: readonly string[], records: readonly ExportRecord[], digits: Readonly<Record<string, number>> = {}): string[] {
  const lines = [fields.join(',')];
  for (const r of records) lines.push(fields.map((f) => csvValue(r[f] ?? null, digits[f])).join(','));
  return lines;
}

/** Decimals of the height fields in CSV. */
export const HEIGHT_DIGITS: Readonly<Record<string, number>> = { height_m: 3, height_ft: 2, level_m: 3, level_ft: 2 };

export const csvText = (lines: readonly string[]): string => `${lines.join('\r\n')}\r\n`;
