// Text formatting for the website: heights in the chosen unit, positions, UTC offsets, dates.
// Pure functions over the model's values; the templates print what these return.
import { DateTime } from 'luxon';

export type Units = 'm' | 'ft';

// International foot (1959 agreement): exactly 0.3048 m.
const METRES_PER_FOOT = 0.3048;

const MINUS = '\u2212';

/** Height in the display unit, as a number (feet are converted; metres pass through). */
export function toUnits(metres: number, units: Units): number {
  return units === 'ft' ? metres / METRES_PER_FOOT : metres;
}

/** Digits of a height without its unit: metres to the centimetre, feet to the tenth; a true minus sign. */
export function heightNumber(metres: number, units: Units): string {
  const value = toUnits(metres, units);
  const digits = units === 'ft' ? 1 : 2;
  const text = Math.abs(value).toFixed(digits);
  // A negative height keeps its sign even when it rounds to zero: it still dries below chart datum.
  return metres < 0 ? `${MINUS}${text}` : text;
}

/** Height with its unit, e.g. "4.21 m", "−0.12 m", "13.8 ft". */
export function heightText(metres: number, units: Units): string {
  return `${heightNumber(metres, units)}\u00a0${units}`;
}

/** The unit's name in words, for headings and legends. */
export function unitName(units: Units): string {
  return units === 'ft' ? 'feet' : 'metres';
}

/** One coordinate as degrees and decimal minutes with a hemisphere letter, e.g. 47°36.0′ N. */
export function coordinate(value: number, positive: string, negative: string): string {
  const hemi = value < 0 ? negative : positive;
  let tenths = Math.round(Math.abs(value) * 600); // tenths of a minute
  const degrees = Math.floor(tenths / 600);
  tenths -= degrees * 600;
  const minutes = (tenths / 10).toFixed(1).padStart(4, '0');
  return `${degrees}°${minutes}′\u00a0${hemi}`;
}

export function positionText(position: { latitude: number; longitude: number }): string {
  return `${coordinate(position.latitude, 'N', 'S')}, ${coordinate(position.longitude, 'E', 'W')}`;
}

/** "+01:00" → "UTC+01:00"; the zero offset is written "UTC+00:00" so every page reads the same way. */
export function offsetText(offset: string): string {
  return `UTC${offset.replace('-', MINUS)}`;
}

/** A UTC instant as the long local date in a zone: the day it falls on at the station. */
export function localLongDate(iso: string, zone: string): string {
  return DateTime.fromISO(iso, { zone, locale: 'en' }).toFormat('cccc d LLLL yyyy');
}

/** The wall clock "HH:mm" of a UTC instant at a fixed offset such as "+01:00" (the clock before a change). */
export function clockIn(iso: string, offset: string): string {
  const m = /^([+-])(\d{2}):(\d{2})$/.exec(offset);
  const minutes = m ? (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3])) : 0;
  const t = new Date(Date.parse(iso) + minutes * 60_000);
  return `${String(t.getUTCHours()).padStart(2, '0')}:${String(t.getUTCMinutes()).padStart(2, '0')}`;
}

/** Hours as "1 day 17 h" or "9 h" (age of the tide, lags). */
export function hoursText(hours: number): string {
  const whole = Math.round(hours);
  const days = Math.floor(whole / 24);
  const rest = whole - days * 24;
  if (days === 0) return `${rest} h`;
  return `${days} day${days === 1 ? '' : 's'} ${rest} h`;
}

/** Differences of time in minutes with an explicit sign: "+25 min", "−10 min", "0 min". */
export function minutesSigned(minutes: number): string {
  if (minutes === 0) return '0 min';
  return `${minutes > 0 ? '+' : MINUS}${Math.abs(minutes)} min`;
}

/** Height differences with an explicit sign and unit: "+0.30 m", "−0.20 m". */
export function heightSigned(metres: number, units: Units): string {
  const value = toUnits(metres, units);
  const text = Math.abs(value).toFixed(units === 'ft' ? 1 : 2);
  const sign = value > 0 ? '+' : value < 0 ? MINUS : '';
  return `${sign}${text}\u00a0${units}`;
}

const PHASE_WORDS: Record<string, string> = {
  new: 'New moon',
  'first-quarter': 'First quarter',
  full: 'Full moon',
  'last-quarter': 'Last quarter',
};

export function phaseName(phase: string): string {
  return PHASE_WORDS[phase] ?? phase;
}
