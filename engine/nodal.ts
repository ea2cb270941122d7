// Node factors f, nodal angles u and equilibrium arguments V after Schureman (1958), Manual of Harmonic
// Analysis and Prediction of Tides (US C&GS Special Publication 98). Formula numbers are his.

import { fundamentalArguments, lunarOrbit, normalizeDegrees, type FundamentalArguments } from './astro.js';
import { findConstituent, CONSTITUENT_NAMES, type Constituent, type NodalRule } from './constituents.js';
import { itemAt, numberAt } from './item.js';

const DEG = Math.PI / 180;

type RuleValues = Record<NodalRule, { f: number; u: number }>;

/** f and u (degrees) of every node-factor family at the given fundamental arguments. */
export function nodalRules(args: FundamentalArguments): RuleValues {
  const { I, nu, xi, nuPrime, twoNuSecond } = lunarOrbit(args.N);
  const i = I * DEG;
  const sinI = Math.sin(i);
  const sin2I = Math.sin(2 * i);
  const cosHalf2 = Math.cos(i / 2) ** 2;
  const sinHalf2 = Math.sin(i / 2) ** 2;
  const nuR = nu * DEG;
  const P = (args.p - xi) * DEG; // Schureman: P = p − ξ, the perigee reckoned from the lunar intersection
  const fM2 = cosHalf2 ** 2 / 0.9154; // formula 78
  const fO1 = (sinI * cosHalf2) / 0.38; // formula 75

  // L2 (Schureman's formulas 213–215): the two elliptic terms near 2T − s + 2h combined into one.
  const tan2 = sinHalf2 / cosHalf2;
  const invRa = Math.sqrt(1 - 12 * tan2 * Math.cos(2 * P) + 36 * tan2 * tan2);
  const R = Math.atan2(Math.sin(2 * P), cosHalf2 / sinHalf2 / 6 - Math.cos(2 * P)); // tan R = sin 2P / (⅙cot²½I − cos 2P)

  // M1 (Schureman's formulas 197, 206): the two elliptic diurnal terms at T − s + h ± p, argument taken
  // at T − s + h + p. Their sum is ∝ 3 cos I·e^{iP} + cos²½I·e^{−iP}, whose angle Q satisfies
  // tan Q = (5 cos I − 1)/(7 cos I + 1)·tan P and whose size is 2 cos²½I/Qa,
  // 1/Qa = (¼ + 1.5 cos I cos 2P / cos²½I + 2.25 cos²I / cos⁴½I)^½; so u = −ν + (Q − P), f = f(O1)/Qa.
  const cosI = Math.cos(i);
  const invQa = Math.sqrt(0.25 + (1.5 * cosI * Math.cos(2 * P)) / cosHalf2 + (2.25 * cosI * cosI) / (cosHalf2 * cosHalf2));
  const QminusP = Math.atan2(-cosHalf2 * Math.sin(2 * P), 3 * cosI + cosHalf2 * Math.cos(2 * P));

  return {
    none: { f: 1, u: 0 },
    Mm: { f: (2 / 3 - sinI * sinI) / 0.5021, u: 0 }, // formula 73
    Mf: { f: (sinI * sinI) / 0.1578, u: -2 * xi }, // formula 74
    O1: { f: fO1, u: 2 * xi - nu }, // formula 75
    J1: { f: sin2I / 0.7214, u: -nu }, // formula 76
    OO1: { f: (sinI * sinHalf2) / 0.0164, u: -2 * xi - nu }, // formula 77
    M2: { f: fM2, u: 2 * xi - 2 * nu }, // formula 78
    eta2: { f: (sinI * sinI) / 0.1565, u: -2 * nu }, // formula 79
    M3: { f: cosHalf2 ** 3 / 0.8758, u: 3 * xi - 3 * nu }, // formula 149
    // formula 227: lunar and solar K1 combined
    K1: { f: Math.sqrt(0.8965 * sin2I * sin2I + 0.6001 * sin2I * Math.cos(nuR) + 0.1006), u: -nuPrime },
    // formula 235: lunar and solar K2 combined
    K2: {
      f: Math.sqrt(19.0444 * sinI ** 4 + 2.7702 * sinI * sinI * Math.cos(2 * nuR) + 0.0981),
      u: -twoNuSecond,
    },
    M1: { f: fO1 * invQa, u: -nu + QminusP / DEG },
    L2: { f: fM2 * invRa, u: 2 * xi - 2 * nu - R / DEG },
  };
}

function resolve(names: readonly string[]): Constituent[] {
  return names.map((name) => {
    const c = findConstituent(name);
    if (!c) throw new Error(`unknown constituent "${name}"; known: ${CONSTITUENT_NAMES.join(', ')}`);
    return c;
  });
}

/** A set of constituents compiled for repeated evaluation of V, f and u at instants. */
export interface AstronomicalTerms {
  readonly constituents: readonly Constituent[];
  /** Writes V (degrees, [0, 360)), f and u (degrees) of each constituent at instant t into the arrays. */
  evaluate(t: number, V: Float64Array, f: Float64Array, u: Float64Array): void;
}

const RULE_NAMES = Object.keys(nodalRules(fundamentalArguments(0))) as NodalRule[];

export function compileAstronomicalTerms(names: readonly string[]): AstronomicalTerms {
  const constituents = resolve(names);
  const n = constituents.length;
  const mult = new Float64Array(n * 6);
  const phase = new Float64Array(n);
  // node-factor terms flattened: constituent k uses terms termStart[k] … termStart[k + 1] − 1
  const termStart = new Int32Array(n + 1);
  const termRule: number[] = [];
  const termU: number[] = [];
  const termF: number[] = [];
  constituents.forEach((c, k) => {
    for (let i = 0; i < 6; i++) mult[k * 6 + i] = itemAt(c.multipliers, i, 'multipliers');
    phase[k] = c.phase;
    for (const term of c.nodal) {
      termRule.push(RULE_NAMES.indexOf(term.rule));
      termU.push(term.uMultiplier);
      termF.push(term.fExponent);
    }
    termStart[k + 1] = termRule.length;
  });
  const ruleF = new Float64Array(RULE_NAMES.length);
  const ruleU = new Float64Array(RULE_NAMES.length);
  return {
    constituents,
    evaluate(t, V, f, u) {
      const a = fundamentalArguments(t);
      const rules = nodalRules(a);
      for (let i = 0; i < RULE_NAMES.length; i++) {
        ruleF[i] = rules[itemAt(RULE_NAMES, i, 'RULE_NAMES')].f;
        ruleU[i] = rules[itemAt(RULE_NAMES, i, 'RULE_NAMES')].u;
      }
      for (let k = 0; k < n; k++) {
        const m = k * 6;
        const v =
          numberAt(phase, k, 'phase') + numberAt(mult, m, 'mult') * a.T + numberAt(mult, m + 1, 'mult') * a.s + numberAt(mult, m + 2, 'mult') * a.h +
          numberAt(mult, m + 3, 'mult') * a.p + numberAt(mult, m + 4, 'mult') * a.N + numberAt(mult, m + 5, 'mult') * a.pp;
        V[k] = normalizeDegrees(v);
        let fk = 1;
        let uk = 0;
        for (let j = itemAt(termStart, k, 'termStart'); j < itemAt(termStart, k + 1, 'termStart'); j++) {
          const r = itemAt(termRule, j, 'termRule');
          for (let e = 0; e < itemAt(termF, j, 'termF'); e++) fk *= numberAt(ruleF, r, 'ruleF');
          uk += itemAt(termU, j, 'termU') * numberAt(ruleU, r, 'ruleU');
        }
        f[k] = fk;
        u[k] = uk;
      }
    },
  };
}

/** Node factors f and nodal angles u (degrees) of the named constituents at the given arguments. */
export function nodeFactorsFromArguments(
  names: readonly string[],
  args: FundamentalArguments,
): { f: Float64Array; u: Float64Array } {
  const constituents = resolve(names);
  const rules = nodalRules(args);
  const f = new Float64Array(constituents.length).fill(1);
  const u = new Float64Array(constituents.length);
  constituents.forEach((c, k) => {
    for (const term of c.nodal) {
      f[k] = numberAt(f, k, 'f') * rules[term.rule].f ** term.fExponent;
      u[k] = numberAt(u, k, 'u') + term.uMultiplier * rules[term.rule].u;
    }
  });
  return { f, u };
}

/** Node factors f and nodal angles u (degrees) of the named constituents at instant t (UTC ms). */
export function nodeFactors(names: readonly string[], t: number): { f: Float64Array; u: Float64Array } {
  return nodeFactorsFromArguments(names, fundamentalArguments(t));
}

/** Equilibrium arguments V (degrees, [0, 360)) of the named constituents at instant t: V₀ of that instant. */
export function equilibriumArguments(names: readonly string[], t: number): Float64Array {
  const terms = compileAstronomicalTerms(names);
  const n = names.length;
  const V = new Float64Array(n);
  terms.evaluate(t, V, new Float64Array(n), new Float64Array(n));
  return V;
}
