// Choosing the constituents a record can resolve, by the Rayleigh criterion (Godin 1972, The Analysis
// of Tides; Pugh 1987, §4.2.2): a candidate is admitted when its speed differs from that of every
// constituent already admitted (and from zero, the mean level) by at least 360°·R over the record's
// length, and the sampling interval resolves it (below the Nyquist speed 180°/Δt).

import { constituentSpeed, findConstituent } from '../constituents.js';
import { itemAt } from '../item.js';

/**
 * Candidates in order of priority: the large astronomical ones first, so that when two cannot be
 * separated the one usually larger is kept (K1 before P1, S2 before K2, M2 before N2); then the
 * shallow-water ones, the long-period ones and the smaller lines. Names unknown to the engine are skipped.
 */
export const ANALYSIS_CANDIDATES: readonly string[] = [
  'M2', 'S2', 'K1', 'O1', 'N2', 'K2', 'P1', 'Q1',
  'M4', 'MS4', 'MN4', 'M6', 'M3', 'MK3', '2MS6', '2MN6', 'M8',
  'Mf', 'Mm', 'MSf', 'Ssa', 'Sa',
  'NU2', 'MU2', '2N2', 'L2', 'T2', 'LAMBDA2', 'EPSILON2', 'ETA2', 'R2', '2SM2', 'MSN2', 'MKS2', 'MNS2',
  'J1', 'OO1', 'M1', '2Q1', 'RHO1', 'SIGMA1', 'TAU1', 'CHI1', 'PI1', 'PHI1', 'THETA1', 'PSI1', 'S1', 'SO1',
  'UPSILON1', 'MO3', 'SO3', 'SK3', 'S4', 'MK4', 'SN4', 'SK4', 'S6', 'MSN6', '2SM6', 'MSK6', '2MK6',
  '3MS8', '3MN8', '2MSN8', 'MSm', 'Mtm', 'MSqm',
];

export interface ExcludedConstituent {
  name: string;
  reason: 'rayleigh' | 'nyquist';
  conflictsWith?: string; // the admitted constituent it could not be told apart from ('Z0' = the mean level)
  daysNeeded?: number; // record length that would separate the two at this R
}

export interface ConstituentSelection {
  admitted: string[]; // in priority order
  excluded: ExcludedConstituent[];
}

export interface SelectionOptions {
  spanHours: number; // record length T
  intervalHours: number; // usual sampling interval Δt
  rayleigh?: number; // R, default 1
  candidates?: readonly string[];
}

/** The Rayleigh-separable, Nyquist-resolved subset of the candidates for a record of this length. */
export function selectConstituents(options: SelectionOptions): ConstituentSelection {
  const R = options.rayleigh ?? 1;
  // Canonical names only (the station file takes those), each once.
  const candidates = [...new Set((options.candidates ?? ANALYSIS_CANDIDATES)
    .map((n) => findConstituent(n)?.name)
    .filter((n): n is string => n !== undefined))];
  const nyquist = options.intervalHours > 0 ? 180 / options.intervalHours : Infinity;
  const admittedSpeeds: number[] = [0];
  const admittedNames: string[] = ['Z0'];
  const excluded: ExcludedConstituent[] = [];
  for (const name of candidates) {
    if (admittedNames.includes(name)) continue;
    const speed = constituentSpeed(name);
    if (speed >= nyquist) {
      excluded.push({ name, reason: 'nyquist' });
      continue;
    }
    let closest = -1;
    let closestGap = Infinity;
    for (let i = 0; i < admittedSpeeds.length; i++) {
      const gap = Math.abs(speed - itemAt(admittedSpeeds, i, 'admittedSpeeds'));
      if (gap < closestGap) {
        closestGap = gap;
        closest = i;
      }
    }
    if (closestGap * options.spanHours >= 360 * R) {
      admittedSpeeds.push(speed);
      admittedNames.push(name);
    } else {
      excluded.push({
        name,
        reason: 'rayleigh',
        conflictsWith: itemAt(admittedNames, closest, 'admittedNames'),
        daysNeeded: closestGap > 0 ? (360 * R) / closestGap / 24 : Infinity,
      });
    }
  }
  return { admitted: admittedNames.slice(1), excluded };
}

/** Record length (hours) that separates two constituents at Rayleigh factor R: 360°·R / |σ₁ − σ₂|. */
export function separationHours(a: string, b: string, rayleigh = 1): number {
  return (360 * rayleigh) / Math.abs(constituentSpeed(a) - constituentSpeed(b));
}
