// Heights of the Sun and the Moon above the rise/set horizon for any observer, from geocentric
// positions that are computed once per instant and shared by every station. The positions come
// from the ephemeris of `astronomy-engine` (geocentric vector with aberration, rotated to the true
// equator and equinox of date, and Greenwich apparent sidereal time) on a coarse grid of instants;
// between grid points they are interpolated (4-point Lagrange), which is exact to well under
// 0.0001° at these steps. Only the observer's part (parallax, the zenith) is done per station.
//
// Rise and set follow astronomy-engine's convention for SearchRiseSet: the upper limb of the disc
// (radius 695 700 km for the Sun, 1 738.1 km for the Moon) on the sea-level horizon lowered by a
// refraction of 34′, with the Moon seen from the observer's place (topocentric).
//
// The grids live in a SkyEphemeris that the caller creates, shares between the stations of a
// build and drops with it: no state at module scope.

import { Body, GeoVector, MakeTime, RotateVector, Rotation_EQJ_EQD, SiderealTime } from 'astronomy-engine';
import { firstOf, itemAt, numberAt } from '../item.js';

export type SkyBody = 'sun' | 'moon';

/** Geocentric positions of the Sun and Moon on grids of instants, filled as they are asked for. */
export interface SkyEphemeris {
  readonly grids: Record<SkyBody, Map<number, Float64Array>>; // block index → BLOCK points of SLOTS values
}

export function createSkyEphemeris(): SkyEphemeris {
  return { grids: { sun: new Map(), moon: new Map() } };
}

/** Where the observer stands, in the forms the height formula uses. */
export interface SkySite {
  latitude: number; // degrees (geodetic)
  sinPhi: number;
  cosPhi: number;
  lambda: number; // east longitude, degrees
  rhoCos: number; // observer's distance from the Earth's axis, AU
  rhoSin: number; // observer's distance from the equatorial plane, AU
}

const DEG = Math.PI / 180;
const DAY_MS = 86_400_000;
const J2000_MS = Date.UTC(2000, 0, 1, 12);
const KM_PER_AU = 1.4959787069098932e8;
// IERS (2010) conventions: equatorial radius and flattening of the reference ellipsoid.
const EARTH_RADIUS_KM = 6378.1366;
const EARTH_AXIS_RATIO = 1 - 1 / 298.25642;
const REFRACTION_DEG = 34 / 60; // the conventional refraction at the horizon
const RADIUS_AU: Record<SkyBody, number> = { sun: 695_700 / KM_PER_AU, moon: 1738.1 / KM_PER_AU };

export function skySite(latitude: number, longitude: number): SkySite {
  const phi = latitude * DEG;
  const sinPhi = Math.sin(phi);
  const cosPhi = Math.cos(phi);
  // Geodetic to geocentric at sea level (Meeus 1998, ch. 11).
  const c = 1 / Math.hypot(cosPhi, EARTH_AXIS_RATIO * sinPhi);
  const s = EARTH_AXIS_RATIO * EARTH_AXIS_RATIO * c;
  return {
    latitude, sinPhi, cosPhi, lambda: longitude,
    rhoCos: (EARTH_RADIUS_KM * c * cosPhi) / KM_PER_AU,
    rhoSin: (EARTH_RADIUS_KM * s * sinPhi) / KM_PER_AU,
  };
}

// Grid steps: the Moon moves ~0.5°/h, the Sun ~0.04°/h; at these steps the interpolation error
// of the positions is below 1e-5° (checked in the tests against the ephemeris itself).
const STEP_MS: Record<SkyBody, number> = { sun: 24 * 3_600_000, moon: 4 * 3_600_000 };
const BLOCK = 128; // points per block
const SLOTS = 4; // x, y, z (AU, true equator of date), GAST − ERA (degrees)

// Earth rotation angle (IERS 2003), degrees, from days since J2000 UT.
function earthRotation(ut: number): number {
  return 360 * (0.779057273264 + 1.00273781191135448 * ut);
}

function fillBlock(body: SkyBody, index: number): Float64Array {
  const out = new Float64Array(BLOCK * SLOTS);
  const step = STEP_MS[body];
  const which = body === 'sun' ? Body.Sun : Body.Moon;
  for (let i = 0; i < BLOCK; i++) {
    const t = MakeTime(new Date((index * BLOCK + i) * step));
    const v = RotateVector(Rotation_EQJ_EQD(t), GeoVector(which, t, true));
    let d = (SiderealTime(t) * 15 - earthRotation(t.ut)) % 360;
    if (d > 180) d -= 360;
    if (d <= -180) d += 360;
    out.set([v.x, v.y, v.z, d], i * SLOTS);
  }
  return out;
}

function blockOf(eph: SkyEphemeris, body: SkyBody, index: number): Float64Array {
  const grid = eph.grids[body];
  let block = grid.get(index);
  if (block === undefined) {
    block = fillBlock(body, index);
    grid.set(index, block);
  }
  return block;
}

const scratch = new Float64Array(SLOTS);

// The grid values at instant t (4-point Lagrange interpolation between k−1 … k+2).
function interpolate(eph: SkyEphemeris, body: SkyBody, t: number): Float64Array {
  const step = STEP_MS[body];
  const k = Math.floor(t / step);
  const u = t / step - k;
  const w0 = (-u * (u - 1) * (u - 2)) / 6;
  const w1 = ((u + 1) * (u - 1) * (u - 2)) / 2;
  const w2 = (-(u + 1) * u * (u - 2)) / 2;
  const w3 = ((u + 1) * u * (u - 1)) / 6;
  const index = Math.floor((k - 1) / BLOCK);
  const first = (k - 1 - index * BLOCK) * SLOTS;
  if (first + 4 * SLOTS <= BLOCK * SLOTS) {
    const b = blockOf(eph, body, index);
    for (let s = 0; s < SLOTS; s++) {
      scratch[s] = w0 * numberAt(b, first + s, 'b') + w1 * numberAt(b, first + SLOTS + s, 'b') + w2 * numberAt(b, first + 2 * SLOTS + s, 'b') + w3 * numberAt(b, first + 3 * SLOTS + s, 'b');
    }
    return scratch;
  }
  // The four points straddle two blocks.
  scratch.fill(0);
  const w = [w0, w1, w2, w3];
  for (let j = 0; j < 4; j++) {
    const kj = k - 1 + j;
    const bj = Math.floor(kj / BLOCK);
    const b = blockOf(eph, body, bj);
    const at = (kj - bj * BLOCK) * SLOTS;
    for (let s = 0; s < SLOTS; s++) scratch[s] = numberAt(scratch, s, 'scratch') + itemAt(w, j, 'w') * numberAt(b, at + s, 'b');
  }
  return scratch;
}

/**
 * Height (degrees) of the body's upper limb above the rise/set horizon at instant t (UTC ms):
 * positive while it is up. Topocentric: the observer's offset from the Earth's centre is
 * subtracted before the altitude is taken (the Moon's parallax is about 1°).
 */
export function skyHeight(eph: SkyEphemeris, body: SkyBody, t: number, site: SkySite): number {
  const g = interpolate(eph, body, t);
  const ut = (t - J2000_MS) / DAY_MS;
  const theta = (earthRotation(ut) + numberAt(g, 3, 'g') + site.lambda) * DEG; // local apparent sidereal angle
  const cosT = Math.cos(theta);
  const sinT = Math.sin(theta);
  const x = firstOf(g, 'g') - site.rhoCos * cosT;
  const y = numberAt(g, 1, 'g') - site.rhoCos * sinT;
  const z = numberAt(g, 2, 'g') - site.rhoSin;
  const r = Math.sqrt(x * x + y * y + z * z);
  const up = (site.cosPhi * (x * cosT + y * sinT) + site.sinPhi * z) / r;
  const altitude = Math.asin(Math.max(-1, Math.min(1, up))) / DEG;
  return altitude + Math.asin(RADIUS_AU[body] / r) / DEG + REFRACTION_DEG;
}

/**
 * An upper bound of |d height / dt| in degrees per millisecond: the Earth turns 361°/day
 * (less the body's own eastward motion, ignored here to stay an upper bound), the declination
 * changes by at most ~0.5°/day (Sun) or ~8.2°/day (Moon); 10 % is added for the parallax and
 * limb terms.
 */
export function maxHeightRate(body: SkyBody, site: SkySite): number {
  const declinationRate = body === 'sun' ? 0.5 : 8.2;
  return (1.1 * (361 * Math.abs(site.cosPhi) + declinationRate * Math.abs(site.sinPhi))) / DAY_MS;
}
