// The public value types of tidal stream stations: the station files as loaded and the events the
// engine computes. Plain data, like ../types.ts; speeds in knots, directions in degrees true (the
// direction the stream sets toward, clockwise from north).

import type { Position } from '../types.js';

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
