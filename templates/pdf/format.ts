// How numbers, heights, places and dates are written in the book.
import type { HeightUnits } from './options.js';

const METRES_PER_FOOT = 0.3048; // the international foot of 1959, exact

/** Metres to the display unit; dividing by the exact 0.3048 keeps ties such as 1.143 m = 3.75 ft exact. */
export function inUnits(metres: number, units: HeightUnits): number {
  return units === 'ft' ? metres / METRES_PER_FOOT : metres;
}
export const MINUS = '\u2212'; // a true minus sign: wider than a hyphen, never mistaken for a dash

/** A height above datum for print: metres to the centimetre, feet to the tenth. */
export function formatHeight(metres: number, units: HeightUnits, below = metres < 0): string {
  const value = inUnits(metres, units);
  const text = Math.abs(value).toFixed(units === 'ft' ? 1 : 2);
  return below ? MINUS + text : text;
}

/** A length such as a range (never negative) with its unit. */
export function formatLength(metres: number, units: HeightUnits): string {
  return `${formatHeight(metres, units)} ${unitLabel(units)}`;
}

/** A signed difference, always with its sign ("+0.30", "−0.10"). */
export function formatSignedHeight(metres: number, units: HeightUnits): string {
  const s = formatHeight(metres, units);
  return metres < 0 || Number(s) === 0 ? s : `+${s}`;
}

export function formatSignedMinutes(minutes: number): string {
  if (minutes === 0) return '0 min';
  return `${minutes > 0 ? '+' : MINUS}${Math.abs(minutes)} min`;
}

export function unitLabel(units: HeightUnits): string {
  return units === 'ft' ? 'ft' : 'm';
}

export function unitWord(units: HeightUnits): string {
  return units === 'ft' ? 'feet' : 'metres';
}

/** Latitude or longitude as degrees and decimal minutes: 47°36.00′ N. */
export function formatAngle(deg: number, positive: string, negative: string): string {
  const abs = Math.abs(deg);
  let d = Math.floor(abs);
  let m = Math.round((abs - d) * 60 * 100) / 100;
  if (m >= 60) { d += 1; m -= 60; }
  return `${d}°${m.toFixed(2).padStart(5, '0')}′ ${deg < 0 ? negative : positive}`;
}

export function formatPosition(p: { latitude: number; longitude: number }): string {
  return `${formatAngle(p.latitude, 'N', 'S')}  ${formatAngle(p.longitude, 'E', 'W')}`;
}

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September',
  'October', 'November', 'December'];

/** "2027-03-28" → "28 March 2027" (or without the year). */
export function formatDate(iso: string, withYear = true): string {
  const [y, m, d] = iso.split('-').map(Number);
  return `${d} ${MONTHS[m - 1]}${withYear ? ` ${y}` : ''}`;
}

export function shortMonth(month: number): string {
  return MONTHS[month - 1].slice(0, 3);
}

/** "+01:00" → "UTC+01:00"; "+00:00" → "UTC+00:00" (stated in full, never as a zone abbreviation). */
export function formatOffset(offset: string): string {
  return `UTC${offset.replace('-', MINUS)}`;
}

/** Removes control characters so a station file cannot inject line breaks or invisible codes. */
export function printable(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, ' ');
}
