// The public value types of tidewright: stations as loaded, tide events, and the StationYear model.
// Everything here is plain data (JSON-serialisable); renderers read these and never recompute.

import type * as z from 'zod';
import type {
  constituentSchema, positionSchema, referencePortSchema, secondaryPortSchema, windowSchema,
} from './stations/schema.js';

export type EventType = 'high' | 'low';

// Stations as loaded: each type follows from the station file's zod schema
// (./stations/schema.ts, where every field's unit and range is stated), so they are written once.
export type Position = z.output<typeof positionSchema>; // degrees, north and east positive

export type ConstituentConstant = z.output<typeof constituentSchema>; // H metres, g degrees [0, 360) UTC

export type WindowSide = 'above' | 'below';

/** A station file's window: open while the tide is at or above `above`, or at or below `below` (metres). */
export type WindowSpec = z.output<typeof windowSchema>;

// datum_epoch has a default, so a station built in code may leave it out; the loader adds the path.
type AsLoaded<T> = Omit<T, 'datum_epoch'> & {
  datum_epoch?: number; // first year of the 19-year span for LAT/HAT (default 2020)
  sourceFile?: string; // path of the file it was loaded from (for error messages)
};

export type ReferenceStation = AsLoaded<z.output<typeof referencePortSchema>>;

export type SecondaryStation = AsLoaded<z.output<typeof secondaryPortSchema>>;

export type SecondaryDifferences = SecondaryStation['differences'];

export type DifferencePair = SecondaryDifferences['high_water']['springs']; // minutes (+ later), metres

export type Station = ReferenceStation | SecondaryStation;

/** A high or low water as the engine computes it: UTC epoch milliseconds, metres above datum. */
export interface TideEvent {
  time: number;
  type: EventType;
  height: number;
}

// ---------------------------------------------------------------------------------------------
// The StationYear model (engine/almanac builds it; templates and templates/pdf read it).
// Times: `time` fields are ISO UTC instants to the second ("2027-01-01T03:12:41Z");
// `local` fields are ISO with the station's offset ("2027-03-28T14:02:10+01:00");
// `clock` fields are the local wall-clock "HH:mm" ready to print.
// Heights: metres above the station's datum, rounded to the millimetre.
// ---------------------------------------------------------------------------------------------

export type MoonPhaseName = 'new' | 'first-quarter' | 'full' | 'last-quarter';
export type SpringNeapKind = 'spring' | 'neap';

export interface AlmanacEvent {
  time: string;
  local: string;
  clock: string;
  date: string; // local date "YYYY-MM-DD" of the printed minute (23:59:40 prints 00:00 on the next day)
  offset: string; // "+01:00"; "+05:41:16" where the zone's offset has seconds
  type: EventType;
  height: number;
  belowDatum: boolean; // height < 0: dries below chart datum, printed unmistakably
}

export interface MoonPhaseEntry {
  time: string;
  local: string;
  clock: string;
  date: string; // local date "YYYY-MM-DD" of the printed minute
  phase: MoonPhaseName;
}

export interface SpringNeapEntry {
  date: string; // local date of the peak (spring) or trough (neap) of the station's own daily range
  kind: SpringNeapKind;
  range: number; // the station's predicted range on that day, metres
  astronomical: string; // ISO UTC instant of the syzygy (spring) or quadrature (neap) it follows
  lagHours: number; // hours from that syzygy/quadrature to this marker
}

export interface Datums {
  LAT: number;
  HAT: number;
  MHWS: number;
  MHWN: number;
  MLWN: number;
  MLWS: number;
  MSL: number;
  epoch: { from: number; to: number }; // years spanned for LAT/HAT, e.g. 2020..2038
}

export type TideTypeCode = 'semidiurnal' | 'mixed-semidiurnal' | 'mixed-diurnal' | 'diurnal';

export interface TideType {
  formNumber: number; // (K1 + O1) / (M2 + S2)
  kind: TideTypeCode; // the renderers word it in the reader's language
}

/** A change of UTC offset within a local day: the instant and the offsets either side. */
export interface OffsetChange {
  time: string; // ISO UTC instant of the change, to the second
  from: string; // "+00:00"
  to: string; // "+01:00"
}

/**
 * Something a publisher should check before printing, as a code with its numbers (the renderers
 * word it). Heights in metres above the station's datum; `epoch` is the LAT/HAT span in years.
 */
export type ModelWarning =
  | { code: 'lat-above-datum'; LAT: number; epoch: { from: number; to: number } }
  | { code: 'low-water-below-lat'; height: number; time: string; date: string; clock: string;
      offset: string; LAT: number; epoch: { from: number; to: number } }
  | { code: 'window-never-opens' | 'window-never-closes'; window: string; side: WindowSide; level: number;
      lowest: number; highest: number; year: number };

/** One rise or set of the Sun or the Moon on a local day. */
export interface SkyEntry {
  body: 'sun' | 'moon';
  type: 'rise' | 'set';
  time: string; // ISO UTC instant to the second
  clock: string; // local "HH:mm"
}

export interface DayEntry {
  date: string; // local date "YYYY-MM-DD"
  weekday: number; // ISO weekday: 1 = Monday … 7 = Sunday
  month: number; // 1..12
  dayOfMonth: number;
  start: string; // ISO UTC instant of the day's first local instant (local midnight, or after a skipped one)
  end: string; // ISO UTC instant of the next day's start (exclusive)
  hours: number; // 24, or 23 / 25 on daylight-saving change days
  offsetStart: string; // UTC offset at the day's start, "+00:00"
  offsetEnd: string; // UTC offset at the end of the day
  offsetChange: null | OffsetChange;
  events: AlmanacEvent[]; // this day's high and low waters, in time order
  curve: number[]; // heights every `curveStepMinutes` from `start` to `end` (inclusive)
  sunrise: string | null; // ISO UTC; null = no sunrise this day (polar night or polar day: see sunNote)
  sunset: string | null;
  sunriseClock: string | null;
  sunsetClock: string | null;
  sunNote: null | 'sun-up-all-day' | 'sun-down-all-day';
  moonrise: string | null;
  moonset: string | null;
  moonriseClock: string | null;
  moonsetClock: string | null;
  sky: SkyEntry[]; // every sun and moon rise and set of this day, in time order (the single fields are the first of each)
  moonPhase: MoonPhaseName | null; // a quarter falls on this local day
  moonIllumination: number; // 0..1 at local noon
  springNeap: SpringNeapKind | null; // marker on this day
  range: number | null; // largest high-to-low range of the day, metres
}

export interface MonthEntry {
  month: number; // 1..12 (the renderers name it)
  slug: string; // "01"
  firstDayIndex: number; // index into days
  dayCount: number;
}

export interface StationYear {
  station: Station; // as loaded
  year: number;
  timezone: string;
  invented: boolean; // demo data: every output says so (the caution itself is the renderers' words)
  reference: null | { id: string; name: string }; // for a secondary port, its reference port
  events: AlmanacEvent[];
  moonPhases: MoonPhaseEntry[];
  springNeap: SpringNeapEntry[];
  datums: Datums;
  tideType: TideType;
  meanSpringRange: number; // metres
  meanNeapRange: number;
  ageOfTideHours: number; // from the constants: (g_S2 − g_M2) / (speed S2 − speed M2)
  springLagHours: number | null; // mean lag of this year's spring marks after new or full moon (null without marks)
  curveStepMinutes: number;
  days: DayEntry[];
  months: MonthEntry[];
  offsetChanges: OffsetChange[];
  extremes: { highest: AlmanacEvent; lowest: AlmanacEvent }; // of this year
  warnings: ModelWarning[];
  hourly: HourlyYear; // heights on every local hour
  windows: WindowYear[]; // one per window of the station file, in its order (empty when it has none)
  generator: { name: 'tidewright'; version: string };
}

// --- access windows (engine/almanac/windows.ts) ----------------------------------------------

/** One open interval as printed on one local day; an interval across midnight is cut at the midnight. */
export interface WindowPiece {
  start: string; // ISO UTC to the second; the day's start when the window is already open at midnight
  end: string; // ISO UTC; the day's end when it is still open at midnight
  startLocal: string; // ISO with the station's offset
  endLocal: string;
  startClock: string; // "HH:mm", the start's nearest minute ("00:00" when open from the day's start)
  endClock: string; // "HH:mm", "24:00" when still open at the day's end
  fromPreviousDay: boolean; // open at the day's start (began on an earlier day)
  intoNextDay: boolean; // still open at the day's end
}

export interface WindowDay {
  date: string; // local date, the same order as StationYear.days
  state: 'closed' | 'open' | 'some'; // no window this day / open all day / the pieces below
  pieces: WindowPiece[];
}

/** Whole open intervals (not cut at midnight), for exports and calendars. */
export interface WindowInterval {
  start: string; // ISO UTC, clipped to the year's first local midnight
  end: string; // clipped to the year's last local midnight
  startLocal: string;
  endLocal: string;
}

export interface WindowYear {
  id: string;
  name: string;
  side: WindowSide;
  level: number; // metres above the station's datum
  method: 'harmonic' | 'secondary-curve'; // crossings on the prediction, or on the secondary curve
  intervals: WindowInterval[];
  days: WindowDay[];
  openDays: number; // days with any opening
  // a level beyond the year's highest or lowest water: the window never opens, or never closes
  outOfRange: null | { code: 'window-never-opens' | 'window-never-closes'; lowest: number; highest: number };
}

// --- heights through the day (engine/almanac/hourly.ts) --------------------------------------

/** Heights on each local whole hour of one day: 24, or 23/25 on clock-change days. */
export interface HourlyDay {
  date: string; // local date
  clocks: string[]; // "HH:00" in local time; a repeated hour comes twice
  offsets: string[]; // the UTC offset of each, "+01:00" (tells the two repeated hours apart)
  heights: number[]; // metres above datum, to the millimetre
}

export interface HourlyYear {
  method: 'harmonic' | 'secondary-curve'; // the prediction, or the secondary curve between the port's events
  days: HourlyDay[]; // the same order as StationYear.days
}
