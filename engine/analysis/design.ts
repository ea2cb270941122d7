// The rows of the harmonic design matrix: [1, f·cos(V+u), f·sin(V+u), …] per observation, with the
// node factor f, nodal angle u and equilibrium argument V of engine/nodal.ts (Schureman 1958), exactly
// as the predictor uses them, so constants from an analysis predict the record they came from.

import { constituentSpeed } from '../constituents.js';
import { equilibriumArguments, nodeFactors } from '../nodal.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;
const RAD = Math.PI / 180;

export interface DesignRows {
  size: number; // 1 + 2·constituents
  /** Fills `row` for the instant t (UTC ms); instants should come in time order for the day cache. */
  fill(t: number, row: Float64Array): void;
}

/**
 * f and u are taken at noon UTC of each day (they change by under 0.02° a day); V is carried from that
 * noon to the instant at the constituent's speed, which is exact because V is linear in time.
 */
export function designRows(names: readonly string[]): DesignRows {
  const m = names.length;
  const speeds = Float64Array.from(names, (n) => constituentSpeed(n) * RAD);
  const f = new Float64Array(m);
  const phase0 = new Float64Array(m); // V + u at the anchor, radians
  let anchor = Number.NaN;
  const setDay = (t: number): void => {
    anchor = Math.floor(t / DAY) * DAY + DAY / 2;
    const nodal = nodeFactors(names, anchor);
    const V = equilibriumArguments(names, anchor);
    for (let j = 0; j < m; j++) {
      f[j] = nodal.f[j]!;
      phase0[j] = (V[j]! + nodal.u[j]!) * RAD;
    }
  };
  return {
    size: 1 + 2 * m,
    fill(t: number, row: Float64Array): void {
      if (!(Math.abs(t - anchor) <= DAY / 2) || t - anchor === DAY / 2) setDay(t);
      const hours = (t - anchor) / HOUR;
      row[0] = 1;
      for (let j = 0; j < m; j++) {
        const arg = phase0[j]! + speeds[j]! * hours;
        row[1 + 2 * j] = f[j]! * Math.cos(arg);
        row[2 + 2 * j] = f[j]! * Math.sin(arg);
      }
    },
  };
}
