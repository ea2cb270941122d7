// The keys and the "what to write" help of stream station files (kind: stream, kind: stream-secondary).
// Plain data, so schema.ts can list the keys without importing the stream schemas themselves.

export const STREAM_KEYS = [
  'id', 'name', 'kind', 'position', 'timezone', 'flood_direction', 'ebb_direction', 'unit', 'mean_current',
  'constituents', 'tide_reference', 'provenance', 'region',
] as const;

export const STREAM_SECONDARY_KEYS = [
  'id', 'name', 'kind', 'reference', 'position', 'timezone', 'flood_direction', 'ebb_direction', 'differences',
  'tide_reference', 'provenance', 'region',
] as const;

export const ELLIPSE_KEYS = ['major', 'minor', 'inclination', 'phase'] as const;
export const STREAM_DIFFERENCE_KEYS = ['slack_to_flood', 'flood', 'slack_to_ebb', 'ebb'] as const;

/** What to write, for each field of a stream station file (`*` stands for a constituent name). */
export const STREAM_FIELD_HELP: Readonly<Record<string, string>> = {
  kind: 'write kind: stream (a stream station with current ellipses) or kind: stream-secondary (time differences and rate ratios from a stream station)',
  flood_direction: 'write the direction in degrees true (0 up to 360) toward which the flood sets, e.g. flood_direction: 75',
  ebb_direction: 'write the direction in degrees true (0 up to 360) toward which the ebb sets, or leave it out for the opposite of the flood',
  unit: 'write unit: kn (knots) or unit: m/s, the unit of the ellipse axes and the mean current',
  mean_current: 'write the steady part of the stream as mean_current: { east: 0.1, north: -0.05 } in the station\'s unit, or leave it out',
  'mean_current.east': 'write the eastward part of the steady stream in the station\'s unit, e.g. east: 0.1',
  'mean_current.north': 'write the northward part of the steady stream in the station\'s unit, e.g. north: -0.05',
  constituents: 'write one line per constituent, e.g. M2: { major: 2.10, minor: 0.15, inclination: 15.0, phase: 110.0 }',
  'constituents.*': 'write { major, minor, inclination, phase }, e.g. M2: { major: 2.10, minor: 0.15, inclination: 15.0, phase: 110.0 }',
  'constituents.*.major': 'write the semi-major axis in the station\'s unit, zero or more, e.g. major: 2.10',
  'constituents.*.minor': 'write the semi-minor axis in the station\'s unit, positive when the stream turns counter-clockwise, negative when clockwise, e.g. minor: 0.15',
  'constituents.*.inclination': 'write the direction of the major axis in degrees counter-clockwise from east, 0 up to 360, e.g. inclination: 15.0',
  'constituents.*.phase': 'write the Greenwich phase lag of the current along the major axis in degrees from 0 up to (not including) 360, e.g. phase: 110.0',
  tide_reference: 'write the id of a tide station in the same folder whose springs and neaps this stream follows, e.g. tide_reference: brinewold-head, or leave it out',
  reference: 'write the id of a stream station (kind: stream) in the same folder, e.g. reference: wrackrun-narrows',
  differences: 'write differences: with slack_to_flood: { time: minutes }, flood: { time: minutes, rate: ratio }, slack_to_ebb: { time: minutes } and ebb: { time: minutes, rate: ratio }',
  'differences.slack_to_flood': 'write e.g. slack_to_flood: { time: 20 }',
  'differences.slack_to_ebb': 'write e.g. slack_to_ebb: { time: 10 }',
  'differences.flood': 'write e.g. flood: { time: 15, rate: 0.8 }',
  'differences.ebb': 'write e.g. ebb: { time: 10, rate: 0.7 }',
  'differences.*.time': 'write minutes from -720 to 720, positive when the event comes later than at the reference stream station, e.g. time: 15',
  'differences.*.rate': 'write the ratio of this station\'s rate to the reference station\'s, above 0 and at most 10, e.g. rate: 0.8',
};
