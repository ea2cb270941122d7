// The Moon's height above the rise/set horizon for any observer, from geocentric coordinates that
// are computed once per instant and shared by every station. Right ascension, declination and
// distance do not depend on the observer; only the hour angle (longitude) and the altitude
// (latitude) do, and those are cheap. Every operation follows suncalc's getMoonPosition and
// getMoonTimes' horizon in the same order, so the heights are identical to the last bit.

import { moonCoords, toDaysTT } from './moon-coords.js';

const { PI, sin, cos, tan, asin } = Math;
const rad = PI / 180;
const DAY_MS = 86_400_000;
const J1970 = 2440588;
const J2000 = 2451545;
const EARTH_RADIUS_KM = 6378.14;

/** Where the observer stands, in the forms the formulas use. */
export interface Observer {
  phi: number; // latitude, radians
  lw: number; // west longitude, radians (suncalc's sign)
  sinPhi: number;
  cosPhi: number;
}

export function observer(latitude: number, longitude: number): Observer {
  const phi = rad * latitude;
  return { phi, lw: rad * -longitude, sinPhi: sin(phi), cosPhi: cos(phi) };
}

// What a height needs of one instant, all independent of the observer.
const SLOTS = 6; // sidereal angle, ra, sin dec, cos dec, Earth radius / distance, semidiameter term

// Instants are whole milliseconds (suncalc reads them through a Date, which drops the fraction).
function fillSlots(out: Float64Array, at: number, t: number): void {
  const d = t / DAY_MS - 0.5 + J1970 - J2000; // suncalc toDays
  const c = moonCoords(toDaysTT(d));
  out[at] = rad * (280.46061837 + 360.98564736629 * d); // suncalc siderealTime before "− lw"
  out[at + 1] = c.ra;
  out[at + 2] = sin(c.dec);
  out[at + 3] = cos(c.dec);
  out[at + 4] = EARTH_RADIUS_KM / c.dist;
  out[at + 5] = (0.2725 * asin(EARTH_RADIUS_KM / c.dist)) / rad; // upper limb: semidiameter
}

// suncalc getMoonPosition's altitude (degrees) plus getMoonTimes' horizon terms: the height of
// the upper limb above the rise/set horizon.
function heightFrom(s: Float64Array, at: number, o: Observer): number {
  const H = s[at] - o.lw - s[at + 1];
  const hGeo = asin(o.sinPhi * s[at + 2] + o.cosPhi * s[at + 3] * cos(H));
  const h = hGeo - asin(s[at + 4] * cos(hGeo));
  const hr = h < 0 ? 0 : h;
  const altitude = (h + 0.0002967 / tan(hr + 0.00312536 / (hr + 0.08901179))) / rad;
  return altitude + s[at + 5] + 0.09;
}

const scratch = new Float64Array(SLOTS);

/** Height (degrees) of the Moon's upper limb above the rise/set horizon at any instant. */
export function moonHeightAt(t: number, o: Observer): number {
  fillSlots(scratch, 0, Math.trunc(t));
  return heightFrom(scratch, 0, o);
}

// One grid of instants `base + k·step`, filled as stations ask; NaN marks a slot not yet computed.
interface Grid {
  base: number;
  step: number;
  count: number;
  slots: Float64Array;
}

const GRID_PAD = 3 * DAY_MS; // zones put the same year's days up to ~1 day apart
const MAX_GRIDS = 4; // one per phase of the step (zones at whole, half and quarter hours)
const grids = new Map<string, Grid>();

/**
 * A function giving the height at `from + k·step` for k = 0..count−1, from a shared grid that
 * stations with the same phase of the step (every whole-hour zone) fill and reuse.
 */
export function moonHeightsOnGrid(from: number, step: number, count: number, o: Observer): (k: number) => number {
  const grid = gridFor(from, step, count);
  const offset = (from - grid.base) / step;
  const s = grid.slots;
  return (k: number): number => {
    const at = (offset + k) * SLOTS;
    if (Number.isNaN(s[at])) fillSlots(s, at, grid.base + (offset + k) * step);
    return heightFrom(s, at, o);
  };
}

function gridFor(from: number, step: number, count: number): Grid {
  const phase = ((from % step) + step) % step;
  const key = `${step}|${phase}`;
  const last = from + (count - 1) * step;
  let grid = grids.get(key);
  if (grid === undefined || from < grid.base || last > grid.base + (grid.count - 1) * step) {
    // Keep only this year's grid per phase: a new span replaces the old one.
    if (grid === undefined && grids.size >= MAX_GRIDS) grids.clear();
    const base = from - Math.round(GRID_PAD / step) * step;
    const n = count + 2 * Math.round(GRID_PAD / step);
    grid = { base, step, count: n, slots: new Float64Array(n * SLOTS).fill(NaN) };
    grids.set(key, grid);
  }
  return grid;
}
