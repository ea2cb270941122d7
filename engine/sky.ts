// Moon and sun for the almanac: quarters of the Moon (syzygies and quadratures for springs and
// neaps), sun and moon rise/set per local day, and the Moon's illumination.

export { moonQuarters, syzygiesAndQuadratures, QUARTER_NAMES } from './sky/quarters.js';
export type { MoonQuarter, AstronomicalSpringNeap } from './sky/quarters.js';
export { meeusPhaseInstant, meeusPhaseJde, meeusQuarters } from './sky/meeus-phases.js';
export { skyForDays, sunCrossings, moonCrossings } from './sky/rise-set.js';
export type { SkyDay, SunNote, MoonNote, DaySpan, Crossing } from './sky/rise-set.js';
