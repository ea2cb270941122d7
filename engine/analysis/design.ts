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
  /** Fills `row` for the instant t (UTC ms). */
  fill(t: number, row: Float64Array): void;
}

/**
 * f and u are taken at noon UTC of each day (they change by under 0.02° a day); V is carried from that
 * noon to the instant at the constituent's speed, which is exact because V is linear in time.
 */
export function designRows(names: readonly string[]): DesignRows {
  const m = names.length;
  const speeds = Float64Array.from(names, (n) => constituentSpeed(n) * RAD);
  // Per UTC day: f, then V + u at noon (radians); kept, since the fit and the residual pass both ask.
  const days = new Map<number, Float64Array>();
  let anchor = Number.NaN;
  let day: Float64Array = new Float64Array(2 * m);
  const setDay = (t: number): void => {
    const index = Math.floor(t / DAY);
    anchor = index * DAY + DAY / 2;
    const known = days.get(index);
    if (known !== undefined) {
      day = known;
      return;
    }
    const nodal = nodeFactors(names, anchor);
    const V = equilibriumArguments(names, anchor);
    day = new Float64Array(2 * m);
    for (let j = 0; j < m; j++) {
      day[j] = nodal.f[j]!;
      day[m + j] = (V[j]! + nodal.u[j]!) * RAD;
    }
    days.set(index, day);
  };
  return {
    size: 1 + 2 * m,
    fill(t: number, row: Float64Array): void {
      if (!(Math.abs(t - anchor) <= DAY / 2) || t - anchor === DAY / 2) setDay(t);
      const hours = (t - anchor) / HOUR;
      row[0] = 1;
      for (let j = 0; j < m; j++) {
        const arg = day[m + j]! + speeds[j]! * hours;
        const f = day[j]!;
        row[1 + 2 * j] = f * Math.cos(arg);
        row[2 + 2 * j] = f * Math.sin(arg);
      }
    },
  };
}
