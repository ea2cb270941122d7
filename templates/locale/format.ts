// The one formatter of tidewright: every height, position, date, month, weekday, UTC offset and
// duration that the website, the PDF books, the exports and the CLI print goes through here, in the
// reader's language (numbers, dates and names from Intl; words from the message catalogue).
// One rule each: heights to the centimetre (feet to the tenth), positions in degrees and minutes to
// the tenth, offsets as UTC±hh:mm (±hh:mm:ss where the zone has seconds), 24-hour clocks.
import { DateTime } from 'luxon';
import type { MessageKey, Params } from './catalogue.js';

export type Units = 'm' | 'ft';

// International foot (1959 agreement): exactly 0.3048 m.
const METRES_PER_FOOT = 0.3048;
/** A true minus sign: wider than a hyphen, never mistaken for a dash. */
export const MINUS = '\u2212';
const NBSP = '\u00a0';

/** Metres in the display unit (feet are converted; metres pass through). */
/** The value kept under `key`, made by `make` the first time. */
function remembered<K, V>(kept: Map<K, V>, key: K, make: () => V): V {
  let value = kept.get(key);
  if (value === undefined) {
    value = make();
    kept.set(key, value);
  }
  return value;
}

export function inUnits(metres: number, units: Units): number {
  return units === 'ft' ? metres / METRES_PER_FOOT : metres;
}

/** Seconds east of UTC from an offset written "+01:00" or "+05:41:16"; 0 for anything else. */
export function offsetSeconds(offset: string): number {
  const m = /^([+-])(\d{2}):(\d{2})(?::(\d{2}))?$/.exec(offset);
  if (!m) return 0;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 3600 + Number(m[3]) * 60 + Number(m[4] ?? 0));
}

/** UTC epoch milliseconds of one of the model's ISO UTC instants ("2027-03-28T01:00:00Z"). */
export function instant(iso: string): number {
  return Date.parse(iso);
}

export interface Format {
  readonly intlLocale: string;
  number(value: number, digits: number): string;
  heightNumber(metres: number, below?: boolean): string;
  height(metres: number): string;
  heightSigned(metres: number): string;
  unit(): string;
  latitude(degrees: number): string;
  longitude(degrees: number): string;
  position(p: { latitude: number; longitude: number }): string;
  offset(offset: string): string;
  clockAt(iso: string, offset: string): string;
  date(date: string, parts?: { year?: boolean; weekday?: boolean }): string;
  monthName(month: number): string;
  monthShort(month: number): string;
  weekdayShort(weekday: number): string;
  hours(hours: number): string;
  duration(seconds: number): string;
  minutesSigned(minutes: number): string;
  list(items: readonly string[]): string;
}

/** Intl's locale for a catalogue language: bare English reads day-month-year, as tide books do. */
export function intlLocaleOf(tag: string): string {
  return tag === 'en' ? 'en-GB' : tag;
}

export function createFormat(tag: string, units: Units, t: (key: MessageKey, params?: Params) => string): Format {
  const intlLocale = intlLocaleOf(tag);
  const numbers = new Map<number, Intl.NumberFormat>();
  const numberFormat = (digits: number): Intl.NumberFormat => {
    let nf = numbers.get(digits);
    if (!nf) {
      nf = new Intl.NumberFormat(intlLocale, { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false });
      numbers.set(digits, nf);
    }
    return nf;
  };
  const number = (value: number, digits: number): string => {
    const text = numberFormat(digits).format(Math.abs(value));
    return value < 0 && Number(Math.abs(value).toFixed(digits)) !== 0 ? `${MINUS}${text}` : text;
  };
  const heightDigits = units === 'ft' ? 1 : 2;
  const unit = (): string => (units === 'ft' ? 'ft' : 'm');
  // A negative height keeps its sign even when it rounds to zero: it still dries below chart datum.
  const heightNumber = (metres: number, below = metres < 0): string => {
    const text = numberFormat(heightDigits).format(Math.abs(inUnits(metres, units)));
    return below ? `${MINUS}${text}` : text;
  };
  const angle = (value: number, positive: MessageKey, negative: MessageKey): string => {
    let tenths = Math.round(Math.abs(value) * 600); // tenths of a minute of arc
    const degrees = Math.floor(tenths / 600);
    tenths -= degrees * 600;
    const minutes = numberFormat(1).format(tenths / 10).padStart(4, '0');
    return `${degrees}°${minutes}′${NBSP}${t(value < 0 ? negative : positive)}`;
  };
  const dateTime = (date: string): DateTime => DateTime.fromISO(date, { zone: 'UTC', locale: intlLocale });
  const duration = (seconds: number): string => {
    const s = Math.round(Math.abs(seconds));
    const parts: string[] = [];
    const h = Math.floor(s / 3600);
    const m = Math.floor((s % 3600) / 60);
    const sec = s % 60;
    if (h > 0) parts.push(t('unit.hours', { count: h }));
    if (m > 0) parts.push(t('unit.minutes', { count: m }));
    if (sec > 0) parts.push(t('unit.seconds', { count: sec }));
    return parts.length === 0 ? t('unit.minutes', { count: 0 }) : parts.join(' ');
  };
  const listFormat = new Intl.ListFormat(intlLocale, { style: 'long', type: 'conjunction' });
  // names of months and weekdays, asked for on every row of a table: formatted once per language
  const monthNames = new Map<number, string>();
  const monthShorts = new Map<number, string>();
  const weekdayShorts = new Map<number, string>();
  const dates = new Map<string, string>();
  return {
    intlLocale,
    number,
    heightNumber,
    height: (metres) => `${heightNumber(metres)}${NBSP}${unit()}`,
    heightSigned: (metres) => {
      const value = inUnits(metres, units);
      const text = numberFormat(heightDigits).format(Math.abs(value));
      const zero = Number(Math.abs(value).toFixed(heightDigits)) === 0;
      return `${zero ? '' : value > 0 ? '+' : MINUS}${text}${NBSP}${unit()}`;
    },
    unit,
    latitude: (d) => angle(d, 'position.north', 'position.south'),
    longitude: (d) => angle(d, 'position.east', 'position.west'),
    position: (p) => `${angle(p.latitude, 'position.north', 'position.south')}, ${angle(p.longitude, 'position.east', 'position.west')}`,
    offset: (offset) => `UTC${offset.replace('-', MINUS)}`,
    clockAt: (iso, offset) => {
      const w = new Date(instant(iso) + offsetSeconds(offset) * 1000);
      return `${String(w.getUTCHours()).padStart(2, '0')}:${String(w.getUTCMinutes()).padStart(2, '0')}`;
    },
    // the edition's date is in every page's footer: each date is worded once per form
    date: (date, parts = {}) => remembered(dates, `${date}|${parts.year !== false}|${parts.weekday === true}`, () => dateTime(date).toLocaleString({
      day: 'numeric', month: 'long', ...(parts.year !== false && { year: 'numeric' }),
      ...(parts.weekday && { weekday: 'long' }),
    })),
    monthName: (month) => remembered(monthNames, month, () => DateTime.utc(2000, month, 1).setLocale(intlLocale).toLocaleString({ month: 'long' })),
    monthShort: (month) => remembered(monthShorts, month, () => DateTime.utc(2000, month, 1).setLocale(intlLocale).toLocaleString({ month: 'short' })),
    // 2024-01-01 was a Monday (ISO weekday 1)
    weekdayShort: (weekday) => remembered(weekdayShorts, weekday, () => DateTime.utc(2024, 1, weekday).setLocale(intlLocale).toLocaleString({ weekday: 'short' })),
    hours: (hours) => {
      const whole = Math.round(hours);
      const days = Math.floor(whole / 24);
      const rest = whole - days * 24;
      return days === 0 ? t('unit.hoursShort', { count: rest }) : t('unit.daysHours', { days, hours: rest });
    },
    duration,
    minutesSigned: (minutes) => {
      const text = t('unit.minutesShort', { count: Math.abs(minutes) });
      return minutes === 0 ? text : `${minutes > 0 ? '+' : MINUS}${text}`;
    },
    list: (items) => listFormat.format(items),
  };
}
