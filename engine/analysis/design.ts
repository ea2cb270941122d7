// The rows of the harmonic design matrix: [1, f·cos(V+u), f·sin(V+u), …] per observation, with the
// node factor f, nodal angle u and equilibrium argument V of engine/nodal.ts (Schureman 1958), exactly
// as the predictor uses them, so constants from an analysis predict the record they came from.

import { constituentSpeed } from '../constituents.js';
import { equilibriumArguments, nodeFactors } from '../nodal.js';
import type { InferenceRule } from './inference.js';
import { itemAt, numberAt } from '../item.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;
const RAD = Math.PI / 180;

export interface DesignRows {
  size: number; // 1 + 2·fitted constituents (+ 1 with a trend, the last unknown)
  /** Fills `row` for the instant t (UTC ms). */
  fill(t: number, row: Float64Array): void;
}

/**
 * f and u are taken at noon UTC of each day (they change by under 0.02° a day); V is carried from that
 * noon to the instant at the constituent's speed, which is exact because V is linear in time.
 * An inferred constituent adds ratio × its own f·cos, f·sin to the columns of the one it is inferred from.
 */
export function designRows(
  fitted: readonly string[], inferred: readonly InferenceRule[] = [], trend?: { from: number; to: number },
): DesignRows {
  const names = [...fitted, ...inferred.map((r) => r.name)];
  const m = names.length;
  const fittedCount = fitted.length;
  const target = Int32Array.from(inferred, (r) => fitted.indexOf(r.from));
  if (target.includes(-1)) throw new Error('an inferred constituent\'s neighbour must be fitted');
  const ratios = Float64Array.from(inferred, (r) => r.ratio);
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
      day[j] = numberAt(nodal.f, j, 'f');
      day[m + j] = (numberAt(V, j, 'V') + numberAt(nodal.u, j, 'u')) * RAD;
    }
    days.set(index, day);
  };
  return {
    size: 1 + 2 * fittedCount + (trend === undefined ? 0 : 1),
    fill(t: number, row: Float64Array): void {
      if (!(Math.abs(t - anchor) <= DAY / 2) || t - anchor === DAY / 2) setDay(t);
      const hours = (t - anchor) / HOUR;
      row[0] = 1;
      for (let j = 0; j < fittedCount; j++) {
        const arg = numberAt(day, m + j, 'day') + numberAt(speeds, j, 'speeds') * hours;
        const f = numberAt(day, j, 'day');
        row[1 + 2 * j] = f * Math.cos(arg);
        row[2 + 2 * j] = f * Math.sin(arg);
      }
      for (let i = 0; i < ratios.length; i++) {
        const j = fittedCount + i;
        const arg = numberAt(day, m + j, 'day') + numberAt(speeds, j, 'speeds') * hours;
        const rf = numberAt(ratios, i, 'ratios') * numberAt(day, j, 'day');
        const k = itemAt(target, i, 'target');
        row[1 + 2 * k] = numberAt(row, 1 + 2 * k, 'row') + rf * Math.cos(arg);
        row[2 + 2 * k] = numberAt(row, 2 + 2 * k, 'row') + rf * Math.sin(arg);
      }
      // −½ at the first reading, +½ at the last: its coefficient is the change of level over the record
      if (trend !== undefined) row[1 + 2 * fittedCount] = (t - trend.from) / (trend.to - trend.from) - 0.5;
    },
  };
}
