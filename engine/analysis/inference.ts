// Inference of the constituents a short record cannot separate (Foreman 1977, Manual for Tidal Heights
// Analysis and Prediction, IOS Pacific Marine Science Report 77-10; Pugh 1987, Tides, Surges and
// Mean Sea-Level, §4.2.3): an inferred constituent is taken to stand to a separated neighbour as it does
// in the equilibrium tide, with the amplitude ratio of the equilibrium amplitudes and an equal Greenwich
// phase lag. Each keeps its own node factor and argument. The pair enters the least squares as one
// unknown: H [f₁cos(θ₁ − g) + r f₂cos(θ₂ − g)] = H cos g·(f₁cos θ₁ + r f₂cos θ₂) + H sin g·(f₁sin θ₁ + r f₂sin θ₂),
// so the neighbour is fitted with the inferred line's share already in the model, not corrected after.
import { entryOf } from '../item.js';

/**
 * Equilibrium amplitudes (metres) of Cartwright and Tayler (1971) and Cartwright and Edden (1973), from
 * memory; tests/engine/equilibrium.test.ts checks every ratio below against the equilibrium tide
 * computed from astronomy-engine's Moon and Sun.
 */
const EQUILIBRIUM_AMPLITUDE: Readonly<Record<string, number>> = {
  M2: 0.242334, S2: 0.112841, N2: 0.046398, K2: 0.030704, NU2: 0.008811, '2N2': 0.006184,
  L2: 0.006862, T2: 0.006575, K1: 0.141565, P1: 0.046843,
};

export interface InferenceRule {
  name: string; // the constituent inferred
  from: string; // the separated neighbour it is inferred from
  ratio: number; // amplitude ratio name/from in the equilibrium tide; phase lags equal
}

const rule = (name: string, from: string): InferenceRule =>
  ({ name, from, ratio: entryOf(EQUILIBRIUM_AMPLITUDE, name, 'EQUILIBRIUM_AMPLITUDE') / entryOf(EQUILIBRIUM_AMPLITUDE, from, 'EQUILIBRIUM_AMPLITUDE') });

/**
 * The pairs inferred when the record cannot separate the first from its neighbours. These are the lines
 * of the gravitational tide large enough to matter (equilibrium amplitude over 6 mm) whose neighbour is
 * a main constituent. Not inferred: MU2 (it shares its speed with the shallow-water 2MS2, which usually
 * outweighs it), Sa, Ssa and MSf (mostly seasons, weather and shallow water) and the overtides: none of
 * these has an equilibrium ratio to trust.
 */
export const INFERENCE_RULES: readonly InferenceRule[] = [
  rule('K2', 'S2'), // 182.6 days to separate from S2
  rule('T2', 'S2'), // 365.3 days
  rule('P1', 'K1'), // 182.6 days
  rule('NU2', 'N2'), // 205.9 days
  rule('2N2', 'N2'), // 27.6 days from N2, 205.4 days from MU2
  rule('L2', 'M2'), // 31.8 days from S2, 205.9 days from LAMBDA2
];

/** The rules that apply: constituents left out by the Rayleigh criterion whose neighbour was admitted. */
export function applicableInferences(admitted: readonly string[], unseparated: readonly string[]): InferenceRule[] {
  return INFERENCE_RULES.filter((r) => unseparated.includes(r.name) && admitted.includes(r.from));
}
