// Fundamental astronomical arguments of the tide and the lunar-orbit terms of Schureman's node factors.
// All angles in degrees. Time t is a UTC instant in epoch milliseconds.

/** The six fundamental arguments at an instant (degrees, in [0, 360)). */
export interface FundamentalArguments {
  T: number; // hour angle of the mean sun at Greenwich (Schureman: 180° at 0h UT, so S2's V = 2T)
  s: number; // mean longitude of the Moon
  h: number; // mean longitude of the Sun
  p: number; // longitude of the Moon's perigee
  N: number; // longitude of the Moon's ascending node
  pp: number; // longitude of the Sun's perigee (Schureman's p₁, written p′)
}

/** Lunar-orbit terms of Schureman (1958) that depend on N only (degrees). */
export interface LunarOrbit {
  I: number; // obliquity of the Moon's orbit to the equator
  nu: number; // ν, right ascension of the intersection of the Moon's orbit with the equator
  xi: number; // ξ, longitude in the Moon's orbit of that intersection (so the Moon's longitude from it is s − ξ)
  nuPrime: number; // ν′, the nodal angle of the combined lunar-solar K1
  twoNuSecond: number; // 2ν″, the nodal angle of the combined lunar-solar K2
}

const DEG = Math.PI / 180;
const MS_PER_HOUR = 3_600_000;
const MS_PER_DAY = 86_400_000;
const J2000_MS = Date.UTC(2000, 0, 1, 12, 0, 0); // J2000.0 epoch, read here on the UTC axis (see note below)
const HOURS_PER_CENTURY = 36525 * 24;

// Meeus (1998), Astronomical Algorithms, 2nd ed.: Moon's mean longitude L′, mean anomaly M′ and node Ω
// (eq. 47.1, 47.4, 47.7); Sun's mean longitude L₀ and mean anomaly M (eq. 25.2, 25.3). Coefficients of
// T (Julian centuries from J2000.0), T², T³, T⁴.
type Polynomial = readonly [number, number, number, number, number];
const MOON_MEAN_LONGITUDE: Polynomial = [218.3164477, 481267.88123421, -0.0015786, 1 / 538841, -1 / 65194000];
const MOON_MEAN_ANOMALY: Polynomial = [134.9633964, 477198.8675055, 0.0087414, 1 / 69699, -1 / 14712000];
const MOON_NODE: Polynomial = [125.0445479, -1934.1362891, 0.0020754, 1 / 467441, -1 / 60616000];
const SUN_MEAN_LONGITUDE: Polynomial = [280.46646, 36000.76983, 0.0003032, 0, 0];
const SUN_MEAN_ANOMALY: Polynomial = [357.52911, 35999.05029, -0.0001537, 0, 0];

/** Rates of the fundamental arguments, degrees per mean solar hour (the linear terms above). */
export const ARGUMENT_RATES = {
  T: 15,
  s: MOON_MEAN_LONGITUDE[1] / HOURS_PER_CENTURY,
  h: SUN_MEAN_LONGITUDE[1] / HOURS_PER_CENTURY,
  p: (MOON_MEAN_LONGITUDE[1] - MOON_MEAN_ANOMALY[1]) / HOURS_PER_CENTURY,
  N: MOON_NODE[1] / HOURS_PER_CENTURY,
  pp: (SUN_MEAN_LONGITUDE[1] - SUN_MEAN_ANOMALY[1]) / HOURS_PER_CENTURY,
} as const;

function polynomial(c: Polynomial, x: number): number {
  return c[0] + x * (c[1] + x * (c[2] + x * (c[3] + x * c[4])));
}

/** Reduce an angle in degrees to [0, 360). */
export function normalizeDegrees(a: number): number {
  const r = a - 360 * Math.floor(a / 360); // not %: floor is several times faster on doubles
  return r >= 360 ? r - 360 : r;
}

/**
 * The fundamental arguments at instant t (UTC epoch ms).
 * The polynomials are defined on Terrestrial Time; we feed them UTC. ΔT (about 70 s) moves the Moon by
 * 0.01° and a lunar semidiurnal phase by 0.02°, i.e. a tide by about 3 s: below the accuracy that matters
 * for predictions from harmonic constants, and analysis uses the same convention, so it cancels.
 */
export function fundamentalArguments(t: number): FundamentalArguments {
  const c = (t - J2000_MS) / (MS_PER_HOUR * HOURS_PER_CENTURY);
  const moonLongitude = polynomial(MOON_MEAN_LONGITUDE, c);
  const sunLongitude = polynomial(SUN_MEAN_LONGITUDE, c);
  const msOfDay = ((t % MS_PER_DAY) + MS_PER_DAY) % MS_PER_DAY;
  return {
    // Schureman (1958): T = 180° + 15°·(hours of mean solar time at Greenwich)
    T: normalizeDegrees(180 + (15 * msOfDay) / MS_PER_HOUR),
    s: normalizeDegrees(moonLongitude),
    h: normalizeDegrees(sunLongitude),
    // perigee longitudes as mean longitude minus mean anomaly (Meeus 1998, ch. 47 and 25)
    p: normalizeDegrees(moonLongitude - polynomial(MOON_MEAN_ANOMALY, c)),
    N: normalizeDegrees(polynomial(MOON_NODE, c)),
    pp: normalizeDegrees(sunLongitude - polynomial(SUN_MEAN_ANOMALY, c)),
  };
}

// Schureman (1958): obliquity of the ecliptic ω and inclination of the Moon's orbit to the ecliptic i.
export const OBLIQUITY_OMEGA = 23.452;
export const LUNAR_INCLINATION_I = 5.145;

const W = OBLIQUITY_OMEGA * DEG;
const IN = LUNAR_INCLINATION_I * DEG;
// Napier's analogies for the triangle equinox–node–intersection (Schureman 1958, the formulas for ν and ξ):
// tan ½(N − ξ + ν) = cos ½(ω − i)/cos ½(ω + i) · tan ½N,  tan ½(N − ξ − ν) = sin ½(ω − i)/sin ½(ω + i) · tan ½N.
const K_SUM = Math.cos((W - IN) / 2) / Math.cos((W + IN) / 2);
const K_DIFF = Math.sin((W - IN) / 2) / Math.sin((W + IN) / 2);

/**
 * Lunar-orbit terms from the longitude of the Moon's node N (degrees), Schureman (1958):
 * cos I = cos i cos ω − sin i sin ω cos N; ν and ξ from the analogies above;
 * tan ν′ = sin 2I sin ν / (sin 2I cos ν + 0.3347) (formula 224);
 * tan 2ν″ = sin²I sin 2ν / (sin²I cos 2ν + 0.0727) (formula 232).
 */
export function lunarOrbit(N: number): LunarOrbit {
  let n = normalizeDegrees(N);
  if (n > 180) n -= 360; // keep ½N in (−90°, 90°] so the half-angle forms below stay continuous
  const half = (n * DEG) / 2;
  const cosI = Math.cos(IN) * Math.cos(W) - Math.sin(IN) * Math.sin(W) * Math.cos(n * DEG);
  const I = Math.acos(cosI);
  const a = Math.atan2(K_SUM * Math.sin(half), Math.cos(half)); // ½(N − ξ + ν)
  const b = Math.atan2(K_DIFF * Math.sin(half), Math.cos(half)); // ½(N − ξ − ν)
  const nu = a - b;
  const xi = n * DEG - a - b;
  const sin2I = Math.sin(2 * I);
  const sinI2 = Math.sin(I) ** 2;
  const nuPrime = Math.atan2(sin2I * Math.sin(nu), sin2I * Math.cos(nu) + 0.3347);
  const twoNuSecond = Math.atan2(sinI2 * Math.sin(2 * nu), sinI2 * Math.cos(2 * nu) + 0.0727);
  return { I: I / DEG, nu: nu / DEG, xi: xi / DEG, nuPrime: nuPrime / DEG, twoNuSecond: twoNuSecond / DEG };
}
