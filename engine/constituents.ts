// The harmonic constituents: the table in engine/constituents/table.ts resolved into speeds, Schureman's
// argument multipliers and node-factor terms. Speeds are computed from the Doodson numbers and the rates
// of the fundamental arguments, never typed in.

import { ARGUMENT_RATES } from './astro.js';
import { ASTRONOMICAL, COMPOUND, type NodalRule, type Species } from './constituents/table.js';

export type { NodalRule, Species } from './constituents/table.js';

/** One term of a constituent's node factor: f ← f·f_rule^fExponent, u ← u + uMultiplier·u_rule. */
export interface NodalTerm {
  rule: NodalRule;
  uMultiplier: number;
  fExponent: number;
}

/** Six numbers, one per fundamental argument (τ or T, s, h, p, N′ or N, p′). */
export type ArgumentMultipliers = readonly [number, number, number, number, number, number];

export interface Constituent {
  name: string;
  aliases: readonly string[];
  species: Species;
  /** Doodson numbers: multipliers of τ, s, h, p, N′, p′ (τ = T + h − s, N′ = −N). */
  doodson: ArgumentMultipliers;
  /** Schureman's multipliers of T, s, h, p, N, p′ in the equilibrium argument V. */
  multipliers: ArgumentMultipliers;
  /** Constant of V in degrees (Schureman's convention), in (−180, 180]. */
  phase: number;
  /** Angular speed, degrees per mean solar hour. */
  speed: number;
  nodal: readonly NodalTerm[];
  /** For compound (shallow-water) constituents: the parents and their multipliers; null otherwise. */
  parents: readonly (readonly [string, number])[] | null;
}

const SPECIES: readonly Species[] = [
  'long-period',
  'diurnal',
  'semidiurnal',
  'terdiurnal',
  'quarter-diurnal',
  'sixth-diurnal',
  'eighth-diurnal',
];

function speciesOf(name: string, tau: number): Species {
  const s = SPECIES[Math.abs(tau) === 0 ? 0 : Math.abs(tau) <= 3 ? Math.abs(tau) : Math.abs(tau) / 2 + 2];
  if (!s) throw new Error(`constituent ${name}: no species for ${tau} cycles per lunar day`);
  return s;
}

/** Doodson (τ-based) numbers → Schureman's (T-based) multipliers: a·τ = a·T + a·h − a·s, and N′ = −N. */
function schuremanMultipliers(d: ArgumentMultipliers): ArgumentMultipliers {
  return [d[0], d[1] - d[0], d[2] + d[0], d[3], d[4] === 0 ? 0 : -d[4], d[5]];
}

const RATES: ArgumentMultipliers = [ARGUMENT_RATES.T, ARGUMENT_RATES.s, ARGUMENT_RATES.h, ARGUMENT_RATES.p, ARGUMENT_RATES.N, ARGUMENT_RATES.pp];

function speedOf(m: ArgumentMultipliers): number {
  const r = RATES;
  return m[0] * r[0] + m[1] * r[1] + m[2] * r[2] + m[3] * r[3] + m[4] * r[4] + m[5] * r[5];
}

/** a + n·b, argument by argument. */
function plusTimes(a: ArgumentMultipliers, n: number, b: ArgumentMultipliers): ArgumentMultipliers {
  return [a[0] + n * b[0], a[1] + n * b[1], a[2] + n * b[2], a[3] + n * b[3], a[4] + n * b[4], a[5] + n * b[5]];
}

function wrapPhase(p: number): number {
  const r = ((p % 360) + 360) % 360;
  return r > 180 ? r - 360 : r;
}

function resolveTable(): Constituent[] {
  const byName = new Map<string, Constituent>();
  const out: Constituent[] = [];
  for (const row of ASTRONOMICAL) {
    const multipliers = schuremanMultipliers(row.doodson);
    const c: Constituent = {
      name: row.name,
      aliases: row.aliases ?? [],
      species: speciesOf(row.name, row.doodson[0]),
      doodson: [...row.doodson],
      multipliers,
      phase: wrapPhase(row.phase),
      speed: speedOf(multipliers),
      nodal: row.nodal === 'none' ? [] : [{ rule: row.nodal, uMultiplier: 1, fExponent: 1 }],
      parents: null,
    };
    byName.set(c.name, c);
    out.push(c);
  }
  for (const row of COMPOUND) {
    let doodson: ArgumentMultipliers = [0, 0, 0, 0, 0, 0];
    let phase = 0;
    const terms = new Map<NodalRule, NodalTerm>();
    for (const [parentName, n] of row.parents) {
      const parent = byName.get(parentName);
      if (!parent) throw new Error(`constituent ${row.name}: parent ${parentName} must come earlier in the table`);
      doodson = plusTimes(doodson, n, parent.doodson);
      phase += n * parent.phase;
      // Schureman: u of a compound is the sum of its parents' u, f the product of their f
      for (const term of parent.nodal) {
        const t = terms.get(term.rule) ?? { rule: term.rule, uMultiplier: 0, fExponent: 0 };
        t.uMultiplier += n * term.uMultiplier;
        t.fExponent += Math.abs(n) * term.fExponent;
        terms.set(term.rule, t);
      }
    }
    const multipliers = schuremanMultipliers(doodson);
    const c: Constituent = {
      name: row.name,
      aliases: row.aliases ?? [],
      species: speciesOf(row.name, doodson[0]),
      doodson,
      multipliers,
      phase: wrapPhase(phase),
      speed: speedOf(multipliers),
      nodal: [...terms.values()],
      parents: row.parents,
    };
    byName.set(c.name, c);
    out.push(c);
  }
  return out.sort((a, b) => a.speed - b.speed);
}

/** Every constituent the engine knows, in order of speed. */
export const CONSTITUENTS: readonly Constituent[] = resolveTable();

/** Canonical names, in order of speed (a station file may also use the aliases). */
export const CONSTITUENT_NAMES: readonly string[] = CONSTITUENTS.map((c) => c.name);

const LOOKUP = new Map<string, Constituent>();
for (const c of CONSTITUENTS) {
  for (const key of [c.name, ...c.aliases]) {
    const k = key.toUpperCase();
    if (LOOKUP.has(k)) throw new Error(`constituent name ${key} is used twice in the table`);
    LOOKUP.set(k, c);
  }
}

/** The constituent of that name or alias (case does not matter), or undefined. */
export function findConstituent(name: string): Constituent | undefined {
  return LOOKUP.get(name.trim().toUpperCase());
}

/** Speed of the named constituent in degrees per mean solar hour; throws on an unknown name. */
export function constituentSpeed(name: string): number {
  const c = findConstituent(name);
  if (!c) throw new Error(`unknown constituent "${name}"; known: ${CONSTITUENT_NAMES.join(', ')}`);
  return c.speed;
}
