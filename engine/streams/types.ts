// The public value types of tidal stream stations: the station files as loaded and the events the
// engine computes. Plain data, like ../types.ts; speeds in knots, directions in degrees true (the
// direction the stream sets toward, clockwise from north).

import type {
  DayEntry, ModelWarning, MonthEntry, MoonPhaseEntry, Position, SpringNeapEntry, SpringNeapKind,
} from '../types.js';

/** One constituent's tidal current ellipse (axes in the station's `unit`). */
export interface CurrentEllipse {
  major: number; // semi-major axis, ≥ 0
  minor: number; // semi-minor axis, signed: > 0 the vector turns counter-clockwise, < 0 clockwise
  inclination: number; // direction of the major axis, degrees counter-clockwise from east, [0, 180)
  phase: number; // g, Greenwich phase lag of the current along the major axis, degrees [0, 360), UTC
}

export type StreamUnit = 'kn' | 'm/s';

interface StreamCommon {
  id: string;
  name: string;
  position: Position;
  timezone: string;
  flood_direction: number; // degrees true toward which the flood sets
  ebb_direction?: number; // degrees true toward which the ebb sets (default: opposite the flood)
  tide_reference?: string; // id of a tide station whose range gives springs and neaps
  provenance: string;
  region?: string; // the coast or area it is listed under
  sourceFile?: string;
}

export interface StreamStation extends StreamCommon {
  kind: 'stream';
  unit: StreamUnit;
  mean_current: { east: number; north: number }; // steady part, in `unit`
  constituents: Record<string, CurrentEllipse>;
}

export interface StreamTimeDifference {
  time: number; // minutes, + later than at the reference stream station
}

export interface StreamRateDifference extends StreamTimeDifference {
  rate: number; // ratio of this station's rate to the reference station's
}

export interface StreamSecondaryDifferences {
  slack_to_flood: StreamTimeDifference; // the slack after which the flood begins
  flood: StreamRateDifference; // the strongest flood
  slack_to_ebb: StreamTimeDifference; // the slack after which the ebb begins
  ebb: StreamRateDifference; // the strongest ebb
}

export interface StreamSecondaryStation extends StreamCommon {
  kind: 'stream-secondary';
  reference: string; // id of a stream station (kind: stream) in the same set
  differences: StreamSecondaryDifferences;
}

export type AnyStreamStation = StreamStation | StreamSecondaryStation;

export type StreamEventType = 'slack' | 'flood' | 'ebb';

/** A slack or a strongest flood or ebb: UTC epoch ms, knots, degrees true (null: no set at slack). */
export interface StreamEvent {
  time: number;
  type: StreamEventType;
  speed: number;
  direction: number | null;
}

/** The velocity at one instant, knots: east and north components, speed and the direction it sets toward. */
export interface StreamVelocity {
  east: number;
  north: number;
  speed: number;
  direction: number | null; // null when the speed is zero
}

// ---------------------------------------------------------------------------------------------
// The StreamYear model: a stream station's year in the same shape as a tide station's StationYear
// (events, days with sun and moon, moon phases, springs and neaps, months), speeds instead of heights.
// Speeds in knots to the hundredth, directions in degrees true to the tenth.
// ---------------------------------------------------------------------------------------------


export interface StreamAlmanacEvent {
  time: string; // ISO UTC to the second
  local: string; // ISO with the station's offset
  clock: string; // local "HH:mm" of the nearest minute
  date: string; // local date "YYYY-MM-DD" of the printed minute (23:59:40 prints 00:00 on the next day)
  offset: string; // "+01:00"
  type: StreamEventType;
  speed: number; // knots
  direction: number | null; // degrees true toward which the stream sets; null at a slack without set
}

/** The calendar, clock (`start`/`end` instants) and sky fields, the same as a tide day's (one builder makes both). */
type SharedDayFields = Omit<DayEntry, 'events' | 'curve' | 'springNeap' | 'range'>;

export interface StreamDayEntry extends SharedDayFields {
  events: StreamAlmanacEvent[]; // this day's slacks and strongest floods and ebbs, in time order
  /** Component toward the flood direction (knots, ebb negative) every `curveStepMinutes` from local midnight to the next. */
  curve: number[];
  springNeap: SpringNeapKind | null;
  strongestFlood: number | null; // the day's greatest flood rate, knots
  strongestEbb: number | null;
}

export interface StreamYear {
  kind: 'stream';
  station: AnyStreamStation; // as loaded
  year: number;
  timezone: string;
  invented: boolean; // demo data: every output says so (both cautions are the renderers' words)
  reference: null | { id: string; name: string }; // a stream-secondary station's reference stream station
  tideReference: null | { id: string; name: string }; // the tide station springs and neaps come from
  floodDirection: number;
  ebbDirection: number;
  rotary: boolean; // slack is the least speed, not a turn through zero
  /** Where springs and neaps come from: the tide reference's range, or the stream's own (flood + ebb rate, knots). */
  springNeapFrom: 'tide-reference' | 'stream';
  events: StreamAlmanacEvent[];
  moonPhases: MoonPhaseEntry[];
  springNeap: SpringNeapEntry[]; // range: metres from a tide reference, knots (flood + ebb rate) from the stream
  curveStepMinutes: number;
  days: StreamDayEntry[];
  months: MonthEntry[];
  offsetChanges: NonNullable<DayEntry['offsetChange']>[];
  extremes: { strongestFlood: StreamAlmanacEvent | null; strongestEbb: StreamAlmanacEvent | null };
  warnings: ModelWarning[]; // none yet for streams; the same codes as a tide station's
  generator: { name: 'tidewright'; version: string };
}
