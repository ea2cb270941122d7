// The station file, as zod schemas: exactly the keys a reference port or a secondary port may hold.
// Checks that need words of their own (time zones, constituent names, ids) raise custom issues
// carrying `params: { problem, fix }`, which issues.ts turns into one-line StationFileErrors.

import * as z from 'zod';
import { IANAZone } from 'luxon';
import { CONSTITUENTS, CONSTITUENT_NAMES } from '../constituents.js';
import { nearestName } from './suggest.js';
import {
  ELLIPSE_KEYS, STREAM_DIFFERENCE_KEYS, STREAM_FIELD_HELP, STREAM_KEYS, STREAM_SECONDARY_KEYS,
} from './stream-help.js';

export const STATION_ID_PATTERN = /^[a-z0-9-]+$/;
export const DEFAULT_DATUM_EPOCH = 2020;

type CheckContext = z.core.ParsePayload<string>;

function fail(ctx: CheckContext, problem: string, fix: string): void {
  ctx.issues.push({ code: 'custom', input: ctx.value, message: problem, params: { problem, fix } });
}

/** Turns free text into a plausible id: "Brinewold Head" → "brinewold-head". */
export function idFromText(text: string): string {
  const slug = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .slice(0, 64)
    .replace(/^-+|-+$/g, '');
  return slug === '' ? 'station' : slug;
}

function checkId(ctx: CheckContext): void {
  const id = ctx.value;
  if (id === '') {
    fail(ctx, 'is empty', 'write lower-case letters, digits and hyphens, e.g. brinewold-head');
  } else if (id.length > 64) {
    fail(ctx, `"${id.slice(0, 20)}…" is ${id.length} characters long`, 'write a short id of at most 64 characters');
  } else if (!STATION_ID_PATTERN.test(id)) {
    fail(ctx, `"${id}" may only hold lower-case letters a-z, digits and hyphens`, `write ${idFromText(id)}`);
  }
}

export const stationId = z.string().check(checkId);

const knownZones: readonly string[] = Intl.supportedValuesOf('timeZone');

export function checkTimezone(ctx: CheckContext): void {
  const zone = ctx.value;
  if (zone.length > 64) {
    fail(ctx, `"${zone.slice(0, 20)}…" is ${zone.length} characters long, longer than any time zone name`, 'write an IANA time zone name such as Europe/Lisbon or Pacific/Auckland');
    return;
  }
  const exact = knownZones.includes(zone);
  const nearest = exact ? zone : nearestName(zone, knownZones);
  if (!IANAZone.isValidZone(zone)) {
    const hint = nearest ? `did you mean ${nearest}? write timezone: ${nearest}` : 'write an IANA time zone name such as Europe/Lisbon or Pacific/Auckland';
    fail(ctx, `"${zone}" is not a known IANA time zone`, hint);
  } else if (!exact && nearest !== undefined && nearest.toLowerCase() === zone.toLowerCase()) {
    fail(ctx, `"${zone}" is spelt with the wrong capitals`, `write timezone: ${nearest}`);
  }
}

/** The longest each text field may be, in characters: enough for any real name, and a page line. */
export const TEXT_LIMITS = { name: 120, datum: 80, provenance: 2000, other: 500 } as const;

function checkText(ctx: CheckContext): void {
  if (ctx.value.trim() === '') fail(ctx, 'is empty', 'write some text');
}

function textOf(limit: number) {
  return z.string().check((ctx: CheckContext) => {
    if (ctx.value.trim() === '') fail(ctx, 'is empty', 'write some text');
    else if (ctx.value.length > limit) {
      fail(ctx, `is ${ctx.value.length} characters long, more than the ${limit} allowed`, `shorten it to at most ${limit} characters`);
    }
  });
}

/** Other text fields (levelling notes, window names, stream texts…). */
export const text = textOf(TEXT_LIMITS.other);

/** The optional region a station is grouped under in the index and the combined volumes. */
export const region = textOf(TEXT_LIMITS.name).optional();

/** Every name a station file may use for a constituent (canonical names and aliases) → canonical name. */
export const CANONICAL_CONSTITUENT: ReadonlyMap<string, string> = new Map(
  CONSTITUENTS.flatMap((c) => [c.name, ...c.aliases].map((alias) => [alias, c.name] as const)),
);

export function checkConstituentName(ctx: CheckContext): void {
  const name = ctx.value;
  if (CANONICAL_CONSTITUENT.has(name)) return;
  const near = nearestName(name, CANONICAL_CONSTITUENT.keys());
  const nearest = near === undefined ? undefined : CANONICAL_CONSTITUENT.get(near);
  const fix = nearest
    ? `did you mean ${nearest}? write ${nearest}`
    : `use one of the ${CONSTITUENT_NAMES.length} constituent names tidewright knows (M2, S2, N2, K1, O1, M4, …; tidewright help constituents lists them)`;
  fail(ctx, `"${name}" is not a constituent tidewright knows`, fix);
}

function checkDay(ctx: CheckContext): void {
  const day = ctx.value;
  const valid = /^\d{4}-\d{2}-\d{2}$/.test(day) && new Date(`${day}T00:00:00Z`).toISOString().slice(0, 10) === day;
  if (!valid) fail(ctx, `"${day}" is not a date written YYYY-MM-DD`, 'write a date such as 2019-03-01');
}

// The station's records (all optional): the region it is listed and bound under, the publisher's number,
// chart datum against the land-levelling datum, the observations the constants come from, and the
// authority for the datum.
const stationRecords = {
  region,
  number: z.string().check(checkText).check((ctx) => {
    if (ctx.value.length > 16) fail(ctx, `"${ctx.value.slice(0, 20)}" is ${ctx.value.length} characters long`, 'write a short number of at most 16 characters, e.g. number: "0412"');
  }).optional(),
  levelling: z.strictObject({
    datum: text,
    chart_datum_below: z.number().min(-100).max(100),
  }).optional(),
  observations: z.strictObject({
    from: z.string().check(checkDay),
    to: z.string().check(checkDay),
    source: text,
  }).refine((o) => o.from <= o.to, {
    params: { problem: 'ends before it starts', fix: 'write the first day as from: and the last day as to:' },
  }).optional(),
  datum_authority: text.optional(),
};

export const positionSchema = z.strictObject({
  latitude: z.number().min(-90).max(90),
  longitude: z.number().min(-180).max(180),
});

export const constituentSchema = z.strictObject({
  amplitude: z.number().min(0),
  phase: z.number().min(0).lt(360),
});

function checkWindowId(ctx: CheckContext): void {
  const id = ctx.value;
  if (id === '') fail(ctx, 'is empty', 'write lower-case letters, digits and hyphens, e.g. id: sill');
  else if (id.length > 64) fail(ctx, `"${id.slice(0, 20)}…" is ${id.length} characters long`, 'write a short id of at most 64 characters');
  else if (!STATION_ID_PATTERN.test(id)) fail(ctx, `"${id}" may only hold lower-case letters a-z, digits and hyphens`, `write id: ${idFromText(id)}`);
}

const windowLevel = z.number().min(-100).max(100);

// A window is open while the tide is at or above `above`, or at or below `below`: exactly one of them.
export const windowSchema = z
  .strictObject({
    id: z.string().check(checkWindowId),
    name: text,
    above: windowLevel.optional(),
    below: windowLevel.optional(),
  })
  .check((ctx) => {
    const { above, below } = ctx.value;
    if ((above === undefined) === (below === undefined)) {
      const problem = above === undefined ? 'gives neither above: nor below:' : 'gives both above: and below:';
      ctx.issues.push({
        code: 'custom', input: ctx.value, message: problem, path: [above === undefined ? 'above' : 'below'],
        params: { problem, fix: 'write exactly one: above: 2.40 (open while the tide is at or above 2.40 m) or below: 3.10 (open while at or below)' },
      });
    }
  });

export const windowsSchema = z.array(windowSchema).check((ctx) => {
  const seen = new Set<string>();
  ctx.value.forEach((w, i) => {
    if (seen.has(w.id)) {
      const problem = `"${w.id}" is already the id of another window of this station`;
      ctx.issues.push({ code: 'custom', input: w.id, message: problem, path: [i, 'id'], params: { problem, fix: 'give each window its own id' } });
    }
    seen.add(w.id);
  });
});

// Key order here is the order a loaded station keeps (and the order problems are listed in).
export const referencePortSchema = z.strictObject({
  id: stationId,
  name: textOf(TEXT_LIMITS.name),
  kind: z.literal('reference'),
  position: positionSchema,
  timezone: z.string().check(checkTimezone),
  datum: textOf(TEXT_LIMITS.datum),
  mean_level: z.number().min(-100).max(100),
  constituents: z
    .record(z.string().check(checkConstituentName), constituentSchema)
    .refine((all) => Object.keys(all).length > 0, {
      params: { problem: 'lists no constituents', fix: 'add at least M2: { amplitude: …, phase: … }' },
    }),
  provenance: textOf(TEXT_LIMITS.provenance),
  datum_epoch: z.int().min(1900).max(2100).default(DEFAULT_DATUM_EPOCH),
  windows: windowsSchema.optional(),
  ...stationRecords,
});

// Half a day either way: beyond that a secondary event would pair with the wrong tide.
const differencePair = z.strictObject({
  time: z.number().min(-720).max(720),
  height: z.number().min(-50).max(50),
});

const springsAndNeaps = z.strictObject({ springs: differencePair, neaps: differencePair });

export const secondaryPortSchema = z.strictObject({
  id: stationId,
  name: textOf(TEXT_LIMITS.name),
  kind: z.literal('secondary'),
  reference: stationId,
  position: positionSchema,
  timezone: z.string().check(checkTimezone),
  datum: textOf(TEXT_LIMITS.datum),
  differences: z.strictObject({ high_water: springsAndNeaps, low_water: springsAndNeaps }),
  provenance: textOf(TEXT_LIMITS.provenance),
  datum_epoch: z.int().min(1900).max(2100).default(DEFAULT_DATUM_EPOCH),
  windows: windowsSchema.optional(),
  ...stationRecords,
});

export const STATION_KINDS = ['reference', 'secondary', 'stream', 'stream-secondary'] as const;
export type StationKind = (typeof STATION_KINDS)[number];
export const isStreamKind = (kind: StationKind): kind is 'stream' | 'stream-secondary' => kind.startsWith('stream');

function streamKeysAt(path: readonly PropertyKey[], kind: 'stream' | 'stream-secondary'): readonly string[] {
  const [first, second] = path;
  if (path.length === 0) return kind === 'stream' ? STREAM_KEYS : STREAM_SECONDARY_KEYS;
  if (first === 'position') return ['latitude', 'longitude'];
  if (first === 'mean_current') return ['east', 'north'];
  if (first === 'constituents' && second !== undefined) return ELLIPSE_KEYS;
  if (first === 'differences' && path.length === 1) return STREAM_DIFFERENCE_KEYS;
  if (first === 'differences') return String(second).startsWith('slack') ? ['time'] : ['time', 'rate'];
  return [];
}

/** The keys allowed in the map at `path` (for "unknown key" suggestions). */
export function allowedKeysAt(path: readonly PropertyKey[], kind: StationKind): readonly string[] {
  const [first, second, third] = path;
  if (isStreamKind(kind)) return streamKeysAt(path, kind);
  if (path.length === 0) {
    return Object.keys((kind === 'reference' ? referencePortSchema : secondaryPortSchema).shape);
  }
  if (first === 'position') return ['latitude', 'longitude'];
  if (first === 'levelling') return ['datum', 'chart_datum_below'];
  if (first === 'observations') return ['from', 'to', 'source'];
  if (first === 'constituents' && second !== undefined) return ['amplitude', 'phase'];
  if (first === 'differences' && path.length === 1) return ['high_water', 'low_water'];
  if (first === 'differences' && third === undefined) return ['springs', 'neaps'];
  if (first === 'differences') return ['time', 'height'];
  if (first === 'windows' && path.length === 2) return ['id', 'name', 'above', 'below'];
  return [];
}

/** Keys that exist only for the other kind of port, so the message can say so. */
export function keyOfOtherKind(key: string, kind: StationKind): StationKind | undefined {
  const others: Record<StationKind, StationKind> = {
    reference: 'secondary', secondary: 'reference', stream: 'stream-secondary', 'stream-secondary': 'stream',
  };
  const other = others[kind];
  const ownKeys = allowedKeysAt([], kind);
  const otherKeys = allowedKeysAt([], other);
  return !ownKeys.includes(key) && otherKeys.includes(key) ? other : undefined;
}

/** What to write, for each field (`*` stands for a constituent name). */
export const FIELD_HELP: Readonly<Record<string, string>> = {
  '': 'write the station as key: value lines starting with id:, name:, kind:',
  id: 'write lower-case letters, digits and hyphens, e.g. id: brinewold-head',
  name: 'write the station name as text, e.g. name: Brinewold Head',
  kind: 'write kind: reference (a port with harmonic constants), kind: secondary (a port with time and height differences), kind: stream or kind: stream-secondary (tidal streams)',
  position: 'write position: { latitude: 47.60, longitude: -15.80 }',
  'position.latitude': 'write degrees from -90 to 90, north positive, e.g. latitude: 47.6',
  'position.longitude': 'write degrees from -180 to 180, east positive, e.g. longitude: -15.8',
  timezone: 'write an IANA time zone name such as Europe/Lisbon or Pacific/Auckland',
  datum: 'write the name of the zero for heights, e.g. datum: Chart Datum',
  provenance: 'write where the constants came from, e.g. provenance: "Harbour gauge 2019-2020"',
  datum_epoch: 'write the first year of the 19-year span for LAT and HAT as a whole year, e.g. datum_epoch: 2020, or leave it out',
  mean_level: 'write Z0, the mean level in metres above the datum, e.g. mean_level: 2.52',
  constituents: 'write one line per constituent, e.g. M2: { amplitude: 1.734, phase: 211.6 }',
  'constituents.*': 'write { amplitude: metres, phase: degrees }, e.g. M2: { amplitude: 1.734, phase: 211.6 }',
  'constituents.*.amplitude': 'write the amplitude in metres, zero or more, e.g. amplitude: 1.734',
  'constituents.*.phase': 'write the Greenwich phase lag in degrees from 0 up to (not including) 360, e.g. phase: 211.6',
  region: 'write the coast or area the station belongs to, used to group the index and the combined volumes, e.g. region: "Outer Skerries", or leave it out',
  number: 'write the publisher\'s station number as quoted text, e.g. number: "0412", or leave it out',
  levelling: 'write levelling: { datum: "Land Levelling Datum", chart_datum_below: 2.71 }, or leave it out',
  'levelling.datum': 'write the name of the land-levelling datum, e.g. datum: "Land Levelling Datum"',
  'levelling.chart_datum_below': 'write how many metres chart datum lies below the land-levelling datum, e.g. chart_datum_below: 2.71',
  observations: 'write observations: { from: 2019-03-01, to: 2020-02-29, source: "Harbour gauge" }, or leave it out',
  'observations.from': 'write the first day of the observations, e.g. from: 2019-03-01',
  'observations.to': 'write the last day of the observations, e.g. to: 2020-02-29',
  'observations.source': 'write where the observations come from, e.g. source: "Harbour gauge"',
  datum_authority: 'write who sets the chart datum here, e.g. datum_authority: "Hydrographic Office", or leave it out',
  reference: 'write the id of a reference port in the same folder, e.g. reference: brinewold-head',
  differences: 'write differences: with high_water: and low_water:, each with springs: and neaps: { time: minutes, height: metres }',
  'differences.*': 'write e.g. { springs: { time: 25, height: -0.30 }, neaps: { time: 15, height: -0.20 } }',
  'differences.*.*': 'write e.g. { time: 25, height: -0.30 }',
  'differences.*.*.time': 'write minutes from -720 to 720, positive when the tide comes later than at the reference port, e.g. time: 25',
  'differences.*.*.height': 'write metres to add to the reference port height, e.g. height: -0.30',
  windows: 'write a list of windows, e.g. windows: [{ id: sill, name: "Marina sill", above: 2.40 }]',
  'windows.*': 'write { id: sill, name: "Marina sill", above: 2.40 } (or below: for a level the tide must stay under)',
  'windows.*.id': 'write lower-case letters, digits and hyphens, unique within the station, e.g. id: sill',
  'windows.*.name': 'write the label to print, e.g. name: "Marina sill"',
  'windows.*.above': 'write metres above the datum: the window is open while the tide is at or above it, e.g. above: 2.40',
  'windows.*.below': 'write metres above the datum: the window is open while the tide is at or below it, e.g. below: 3.10',
};

/** The help text for a concrete path such as constituents.M2.phase (of a file of the given kind). */
export function fieldHelp(path: readonly PropertyKey[], kind?: StationKind): string {
  const parts = path.map(String);
  if (kind !== undefined && isStreamKind(kind)) {
    const exact = parts.map((p, i) => (i === 1 && parts[0] === 'constituents' ? '*' : p)).join('.');
    const loose = parts.map((p, i) => (i === 1 && parts[0] === 'differences' && parts.length === 3 ? '*' : p)).join('.');
    const help = STREAM_FIELD_HELP[exact] ?? STREAM_FIELD_HELP[loose];
    if (help !== undefined) return help;
  }
  // Constituent names and high_water/low_water, springs/neaps are the variable parts of a path.
  const wild = parts[0] === 'constituents' || parts[0] === 'windows' ? 1 : parts[0] === 'differences' ? 2 : 0;
  const key = parts.map((p, i) => (i >= 1 && i <= wild ? '*' : p)).join('.');
  return FIELD_HELP[key] ?? 'see the station file example in README.md';
}
