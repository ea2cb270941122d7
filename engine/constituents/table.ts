// The constituent table: data, not code. Speeds, Schureman argument multipliers and node-factor terms
// are all derived from these rows in engine/constituents.ts.
//
// Astronomical constituents: Doodson numbers (multipliers of τ, s, h, p, N′, p′, with τ = T + h − s the
// mean lunar time and N′ = −N), the constant of Schureman's (1958) equilibrium argument V in degrees
// (a multiple of 90°), and the node-factor rule: the Schureman formula family that gives f and u.
// Compound (shallow-water) constituents: parents with multipliers; V, u add, f multiplies.

/** Schureman's node-factor families, named after a member; engine/nodal.ts gives each its f and u. */
export type NodalRule =
  | 'none' // solar: f = 1, u = 0
  | 'Mm' // f formula 73, u = 0
  | 'Mf' // f formula 74, u = −2ξ
  | 'O1' // f formula 75, u = 2ξ − ν
  | 'J1' // f formula 76, u = −ν
  | 'OO1' // f formula 77, u = −2ξ − ν
  | 'M2' // f formula 78, u = 2ξ − 2ν
  | 'eta2' // f formula 79, u = −2ν
  | 'M3' // f formula 149, u = 3ξ − 3ν
  | 'K1' // f formula 227, u = −ν′
  | 'K2' // f formula 235, u = −2ν″
  | 'M1' // f = f(O1)/Qa, u from Q (Schureman's M1 terms)
  | 'L2'; // f = f(M2)/Ra, u = 2ξ − 2ν − R (Schureman's L2 terms)

export type Species = 'long-period' | 'diurnal' | 'semidiurnal' | 'terdiurnal' | 'quarter-diurnal' | 'sixth-diurnal' | 'eighth-diurnal';

export interface AstronomicalRow {
  name: string;
  doodson: readonly [number, number, number, number, number, number];
  phase: number;
  nodal: NodalRule;
  aliases?: readonly string[];
}

export interface CompoundRow {
  name: string;
  parents: readonly (readonly [string, number])[];
  aliases?: readonly string[];
}

export type ConstituentRow = AstronomicalRow | CompoundRow;

// Phases and node-factor families after Schureman (1958), Table 2; Doodson numbers after Doodson (1921).
export const ASTRONOMICAL: readonly AstronomicalRow[] = [
  // long-period
  { name: 'Sa', doodson: [0, 0, 1, 0, 0, 0], phase: 0, nodal: 'none' },
  { name: 'Ssa', doodson: [0, 0, 2, 0, 0, 0], phase: 0, nodal: 'none' },
  { name: 'MSm', doodson: [0, 1, -2, 1, 0, 0], phase: 0, nodal: 'Mm' },
  { name: 'Mm', doodson: [0, 1, 0, -1, 0, 0], phase: 0, nodal: 'Mm' },
  { name: 'Mf', doodson: [0, 2, 0, 0, 0, 0], phase: 0, nodal: 'Mf' },
  { name: 'Mtm', doodson: [0, 3, 0, -1, 0, 0], phase: 0, nodal: 'Mf' },
  { name: 'MSqm', doodson: [0, 4, -2, 0, 0, 0], phase: 0, nodal: 'Mf' },
  // diurnal
  { name: '2Q1', doodson: [1, -3, 0, 2, 0, 0], phase: 90, nodal: 'O1' },
  { name: 'SIGMA1', doodson: [1, -3, 2, 0, 0, 0], phase: 90, nodal: 'O1', aliases: ['SIG1', 'σ1'] },
  { name: 'Q1', doodson: [1, -2, 0, 1, 0, 0], phase: 90, nodal: 'O1' },
  { name: 'RHO1', doodson: [1, -2, 2, -1, 0, 0], phase: 90, nodal: 'O1', aliases: ['ρ1'] },
  { name: 'O1', doodson: [1, -1, 0, 0, 0, 0], phase: 90, nodal: 'O1' },
  { name: 'TAU1', doodson: [1, -1, 2, 0, 0, 0], phase: -90, nodal: 'J1', aliases: ['τ1'] },
  { name: 'M1', doodson: [1, 0, 0, 1, 0, 0], phase: -90, nodal: 'M1' },
  { name: 'CHI1', doodson: [1, 0, 2, -1, 0, 0], phase: -90, nodal: 'J1', aliases: ['χ1'] },
  { name: 'PI1', doodson: [1, 1, -3, 0, 0, 1], phase: 90, nodal: 'none', aliases: ['π1'] },
  { name: 'P1', doodson: [1, 1, -2, 0, 0, 0], phase: 90, nodal: 'none' },
  { name: 'S1', doodson: [1, 1, -1, 0, 0, 0], phase: 0, nodal: 'none' },
  { name: 'K1', doodson: [1, 1, 0, 0, 0, 0], phase: -90, nodal: 'K1' },
  { name: 'PSI1', doodson: [1, 1, 1, 0, 0, -1], phase: -90, nodal: 'none', aliases: ['ψ1'] },
  { name: 'PHI1', doodson: [1, 1, 2, 0, 0, 0], phase: -90, nodal: 'none', aliases: ['φ1'] },
  { name: 'THETA1', doodson: [1, 2, -2, 1, 0, 0], phase: -90, nodal: 'J1', aliases: ['THE1', 'θ1'] },
  { name: 'J1', doodson: [1, 2, 0, -1, 0, 0], phase: -90, nodal: 'J1' },
  { name: 'OO1', doodson: [1, 3, 0, 0, 0, 0], phase: -90, nodal: 'OO1' },
  { name: 'UPSILON1', doodson: [1, 4, 0, -1, 0, 0], phase: -90, nodal: 'OO1', aliases: ['UPS1', 'υ1'] },
  // semidiurnal
  { name: 'EPSILON2', doodson: [2, -3, 2, 1, 0, 0], phase: 0, nodal: 'M2', aliases: ['EPS2', 'ε2'] },
  { name: '2N2', doodson: [2, -2, 0, 2, 0, 0], phase: 0, nodal: 'M2' },
  { name: 'MU2', doodson: [2, -2, 2, 0, 0, 0], phase: 0, nodal: 'M2', aliases: ['μ2'] },
  { name: 'N2', doodson: [2, -1, 0, 1, 0, 0], phase: 0, nodal: 'M2' },
  { name: 'NU2', doodson: [2, -1, 2, -1, 0, 0], phase: 0, nodal: 'M2', aliases: ['ν2'] },
  { name: 'M2', doodson: [2, 0, 0, 0, 0, 0], phase: 0, nodal: 'M2' },
  { name: 'LAMBDA2', doodson: [2, 1, -2, 1, 0, 0], phase: 180, nodal: 'M2', aliases: ['LAM2', 'LDA2', 'λ2'] },
  { name: 'L2', doodson: [2, 1, 0, -1, 0, 0], phase: 180, nodal: 'L2' },
  { name: 'T2', doodson: [2, 2, -3, 0, 0, 1], phase: 0, nodal: 'none' },
  { name: 'S2', doodson: [2, 2, -2, 0, 0, 0], phase: 0, nodal: 'none' },
  { name: 'R2', doodson: [2, 2, -1, 0, 0, -1], phase: 180, nodal: 'none' },
  { name: 'K2', doodson: [2, 2, 0, 0, 0, 0], phase: 0, nodal: 'K2' },
  { name: 'ETA2', doodson: [2, 3, 0, -1, 0, 0], phase: 0, nodal: 'eta2', aliases: ['η2'] },
  // terdiurnal (degree-3 lunar term)
  { name: 'M3', doodson: [3, 0, 0, 0, 0, 0], phase: 0, nodal: 'M3' },
];

// Shallow-water and compound constituents, named by their parents in the usual way (MS4 = M2 + S2).
export const COMPOUND: readonly CompoundRow[] = [
  { name: 'MSf', parents: [['S2', 1], ['M2', -1]] },
  { name: 'SO1', parents: [['S2', 1], ['O1', -1]] },
  { name: 'MNS2', parents: [['M2', 1], ['N2', 1], ['S2', -1]] },
  { name: 'MKS2', parents: [['M2', 1], ['K2', 1], ['S2', -1]] },
  { name: 'MSN2', parents: [['M2', 1], ['S2', 1], ['N2', -1]] },
  { name: '2SM2', parents: [['S2', 2], ['M2', -1]] },
  { name: 'MO3', parents: [['M2', 1], ['O1', 1]] },
  { name: 'SO3', parents: [['S2', 1], ['O1', 1]] },
  { name: 'MK3', parents: [['M2', 1], ['K1', 1]] },
  { name: 'SK3', parents: [['S2', 1], ['K1', 1]] },
  { name: 'MN4', parents: [['M2', 1], ['N2', 1]] },
  { name: 'M4', parents: [['M2', 2]] },
  { name: 'SN4', parents: [['S2', 1], ['N2', 1]] },
  { name: 'MS4', parents: [['M2', 1], ['S2', 1]] },
  { name: 'MK4', parents: [['M2', 1], ['K2', 1]] },
  { name: 'S4', parents: [['S2', 2]] },
  { name: 'SK4', parents: [['S2', 1], ['K2', 1]] },
  { name: '2MN6', parents: [['M2', 2], ['N2', 1]] },
  { name: 'M6', parents: [['M2', 3]] },
  { name: 'MSN6', parents: [['M2', 1], ['S2', 1], ['N2', 1]] },
  { name: '2MS6', parents: [['M2', 2], ['S2', 1]] },
  { name: '2MK6', parents: [['M2', 2], ['K2', 1]] },
  { name: '2SM6', parents: [['S2', 2], ['M2', 1]] },
  { name: 'MSK6', parents: [['M2', 1], ['S2', 1], ['K2', 1]] },
  { name: 'S6', parents: [['S2', 3]] },
  { name: '3MN8', parents: [['M2', 3], ['N2', 1]] },
  { name: 'M8', parents: [['M2', 4]] },
  { name: '2MSN8', parents: [['M2', 2], ['S2', 1], ['N2', 1]] },
  { name: '3MS8', parents: [['M2', 3], ['S2', 1]] },
];
