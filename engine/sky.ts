// Moon and sun for the almanac: quarters of the Moon (syzygies and quadratures for springs and
// neaps), every sun and moon rise and set per local day, and the Moon's illumination.

export { moonQuarters, syzygiesAndQuadratures, QUARTER_NAMES } from './sky/quarters.js';
export type { MoonQuarter, AstronomicalSpringNeap } from './sky/quarters.js';
export { skyForDays, skyCrossings } from './sky/rise-set.js';
export type { SkyDay, SkyEvent, SunNote, MoonNote, DaySpan } from './sky/rise-set.js';
export type { Crossing } from './sky/crossings.js';
export { createSkyEphemeris, skyHeight, skySite } from './sky/ephemeris.js';
export type { SkyBody, SkyEphemeris, SkySite } from './sky/ephemeris.js';
