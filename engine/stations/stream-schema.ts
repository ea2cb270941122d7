// The stream station files as zod schemas: `kind: stream` (tidal current ellipses) and
// `kind: stream-secondary` (time differences and rate ratios from a stream station).

import * as z from 'zod';
import { checkConstituentName, checkTimezone, positionSchema, region, stationId, text } from './schema.js';

const bearing = z.number().min(0).lt(360);

export const ellipseSchema = z.strictObject({
  major: z.number().min(0),
  minor: z.number(),
  inclination: z.number().min(0).lt(360),
  phase: z.number().min(0).lt(360),
});

export const streamStationSchema = z.strictObject({
  id: stationId,
  name: text,
  kind: z.literal('stream'),
  position: positionSchema,
  timezone: z.string().check(checkTimezone),
  flood_direction: bearing,
  ebb_direction: bearing.optional(),
  unit: z.enum(['kn', 'm/s']),
  mean_current: z.strictObject({ east: z.number().min(-20).max(20), north: z.number().min(-20).max(20) }).default({ east: 0, north: 0 }),
  constituents: z
    .record(z.string().check(checkConstituentName), ellipseSchema)
    .refine((all) => Object.keys(all).length > 0, {
      params: { problem: 'lists no constituents', fix: 'add at least M2: { major: …, minor: …, inclination: …, phase: … }' },
    }),
  tide_reference: stationId.optional(),
  provenance: text,
  region,
});

const timeDifference = z.number().min(-720).max(720);
const slackDifference = z.strictObject({ time: timeDifference });
const rateDifference = z.strictObject({ time: timeDifference, rate: z.number().gt(0).max(10) });

export const streamSecondarySchema = z.strictObject({
  id: stationId,
  name: text,
  kind: z.literal('stream-secondary'),
  reference: stationId,
  position: positionSchema,
  timezone: z.string().check(checkTimezone),
  flood_direction: bearing,
  ebb_direction: bearing.optional(),
  differences: z.strictObject({
    slack_to_flood: slackDifference,
    flood: rateDifference,
    slack_to_ebb: slackDifference,
    ebb: rateDifference,
  }),
  tide_reference: stationId.optional(),
  provenance: text,
  region,
});
