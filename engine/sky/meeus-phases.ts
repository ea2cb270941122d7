// An independent method for the instants of the Moon's quarters, used to cross-check the
// ephemeris in ./quarters.ts: Meeus (1998), *Astronomical Algorithms*, 2nd ed., ch. 49 ("Phases
// of the Moon"): mean phase (49.1), the periodic terms for new/full moon and for the quarters,
// the W correction of the quarters and the 14 planetary terms A1..A14. Stated accuracy: a few
// seconds against the full lunar theory for 1900–2100. Result in TT, converted to UTC with ΔT.

import type { MoonPhaseName } from '../types.js';

const RAD = Math.PI / 180;
const DAY_MS = 86_400_000;
const JD_UNIX_EPOCH = 2440587.5;

// ΔT = TT − UT in seconds, Espenak & Meeus (2006) polynomial for 2005–2050; outside it the
// 2050 value is kept (ΔT changes by well under a minute in a century here, below our tolerance).
function deltaTSeconds(year: number): number {
  const t = Math.min(Math.max(year, 2005), 2050) - 2000;
  return 62.92 + 0.32217 * t + 0.005589 * t * t;
}

/** UTC ms of the lunar phase numbered k (Meeus 49.2: k integer for new moon, +0.25 first quarter, …; k = 0 near 2000-01-06). */
export function meeusPhaseInstant(k: number): number {
  const year = 2000 + k / 12.3685;
  return (meeusPhaseJde(k) - JD_UNIX_EPOCH) * DAY_MS - deltaTSeconds(year) * 1000;
}

/** Julian Ephemeris Day (TT) of the lunar phase numbered k, Meeus ch. 49. */
export function meeusPhaseJde(k: number): number {
  const T = k / 1236.85; // Meeus 49.3
  const T2 = T * T;
  const T3 = T2 * T;
  const T4 = T3 * T;
  // Meeus 49.1: mean phase, JDE
  let jde = 2451550.09766 + 29.530588861 * k + 0.00015437 * T2 - 0.00000015 * T3 + 0.00000000073 * T4;
  const E = 1 - 0.002516 * T - 0.0000074 * T2; // Meeus 47.6
  const M = (2.5534 + 29.1053567 * k - 0.0000014 * T2 - 0.00000011 * T3) * RAD; // Sun's mean anomaly, 49.4
  const Mp = (201.5643 + 385.81693528 * k + 0.0107582 * T2 + 0.00001238 * T3 - 0.000000058 * T4) * RAD; // Moon's, 49.5
  const F = (160.7108 + 390.67050284 * k - 0.0016118 * T2 - 0.00000227 * T3 + 0.000000011 * T4) * RAD; // 49.6
  const Om = (124.7746 - 1.56375588 * k + 0.0020672 * T2 + 0.00000215 * T3) * RAD; // 49.7
  const s = Math.sin;
  const fraction = ((k % 1) + 1) % 1;
  const isNewOrFull = Math.abs(fraction) < 1e-9 || Math.abs(fraction - 0.5) < 1e-9;
  if (isNewOrFull) {
    const full = Math.abs(fraction - 0.5) < 1e-9;
    jde +=
      (full ? -0.40614 : -0.4072) * s(Mp) +
      (full ? 0.17302 : 0.17241) * E * s(M) +
      (full ? 0.01614 : 0.01608) * s(2 * Mp) +
      (full ? 0.01043 : 0.01039) * s(2 * F) +
      (full ? 0.00734 : 0.00739) * E * s(Mp - M) -
      (full ? 0.00515 : 0.00514) * E * s(Mp + M) +
      (full ? 0.00209 : 0.00208) * E * E * s(2 * M) -
      0.00111 * s(Mp - 2 * F) -
      0.00057 * s(Mp + 2 * F) +
      0.00056 * E * s(2 * Mp + M) -
      0.00042 * s(3 * Mp) +
      0.00042 * E * s(M + 2 * F) +
      0.00038 * E * s(M - 2 * F) -
      0.00024 * E * s(2 * Mp - M) -
      0.00017 * s(Om) -
      0.00007 * s(Mp + 2 * M) +
      0.00004 * s(2 * Mp - 2 * F) +
      0.00004 * s(3 * M) +
      0.00003 * s(Mp + M - 2 * F) +
      0.00003 * s(2 * Mp + 2 * F) -
      0.00003 * s(Mp + M + 2 * F) +
      0.00003 * s(Mp - M + 2 * F) -
      0.00002 * s(Mp - M - 2 * F) -
      0.00002 * s(3 * Mp + M) +
      0.00002 * s(4 * Mp);
  } else {
    jde +=
      -0.62801 * s(Mp) +
      0.17172 * E * s(M) -
      0.01183 * E * s(Mp + M) +
      0.00862 * s(2 * Mp) +
      0.00804 * s(2 * F) +
      0.00454 * E * s(Mp - M) +
      0.00204 * E * E * s(2 * M) -
      0.0018 * s(Mp - 2 * F) -
      0.0007 * s(Mp + 2 * F) -
      0.0004 * s(3 * Mp) -
      0.00034 * E * s(2 * Mp - M) +
      0.00032 * E * s(M + 2 * F) +
      0.00032 * E * s(M - 2 * F) -
      0.00028 * E * E * s(Mp + 2 * M) +
      0.00027 * E * s(2 * Mp + M) -
      0.00017 * s(Om) -
      0.00005 * s(Mp - M - 2 * F) +
      0.00004 * s(2 * Mp + 2 * F) -
      0.00004 * s(Mp + M + 2 * F) +
      0.00004 * s(Mp - 2 * M) +
      0.00003 * s(Mp + M - 2 * F) +
      0.00003 * s(3 * M) +
      0.00002 * s(2 * Mp - 2 * F) +
      0.00002 * s(Mp - M + 2 * F) -
      0.00002 * s(3 * Mp + M);
    const W =
      0.00306 - 0.00038 * E * Math.cos(M) + 0.00026 * Math.cos(Mp) - 0.00002 * Math.cos(Mp - M) +
      0.00002 * Math.cos(Mp + M) + 0.00002 * Math.cos(2 * F);
    jde += Math.abs(fraction - 0.25) < 1e-9 ? W : -W;
  }
  // Planetary arguments A1..A14 and their terms, common to all phases.
  const A = [
    [299.77 + 0.107408 * k - 0.009173 * T2, 0.000325],
    [251.88 + 0.016321 * k, 0.000165],
    [251.83 + 26.651886 * k, 0.000164],
    [349.42 + 36.412478 * k, 0.000126],
    [84.66 + 18.206239 * k, 0.00011],
    [141.74 + 53.303771 * k, 0.000062],
    [207.14 + 2.453732 * k, 0.00006],
    [154.84 + 7.30686 * k, 0.000056],
    [34.52 + 27.261239 * k, 0.000047],
    [207.19 + 0.121824 * k, 0.000042],
    [291.34 + 1.844379 * k, 0.00004],
    [161.72 + 24.198154 * k, 0.000037],
    [239.56 + 25.513099 * k, 0.000035],
    [331.55 + 3.592518 * k, 0.000023],
  ];
  for (const [arg, coeff] of A) jde += coeff * s(arg * RAD);
  return jde;
}

/** Quarters with startMs ≤ time < endMs by Meeus ch. 49, for comparison with the ephemeris. */
export function meeusQuarters(startMs: number, endMs: number): { time: number; phase: MoonPhaseName }[] {
  const out: { time: number; phase: MoonPhaseName }[] = [];
  const yearOf = (ms: number) => 1970 + ms / (365.2425 * DAY_MS);
  // Meeus 49.2: k ≈ (year − 2000) × 12.3685; start a lunation early and step by quarters.
  let k = Math.floor((yearOf(startMs) - 2000) * 12.3685) - 1;
  const phases: MoonPhaseName[] = ['new', 'first-quarter', 'full', 'last-quarter'];
  for (;; k += 1) {
    for (let q = 0; q < 4; q++) {
      const time = meeusPhaseInstant(k + q / 4);
      if (time >= endMs) return out;
      if (time >= startMs) out.push({ time, phase: phases[q] });
    }
  }
}

