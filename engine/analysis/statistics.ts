// What the residual of a fit says: its size, and the confidence of each constituent's amplitude and
// phase from the covariance of its cos/sin pair (σ² (AᵀA)⁻¹, linearised; Pugh 1987, §4.2.4). These
// assume independent errors; a real residual is autocorrelated, so the intervals are optimistic.

import type { GaugeRecord } from './record.js';
import { numberAt } from '../item.js';

const DEG = 180 / Math.PI;
const Z95 = 1.959964; // two-sided 95 % point of the normal distribution

export interface ResidualStatistics {
  count: number; // readings
  unknowns: number; // parameters fitted
  rms: number; // root mean square of observed − fitted, metres
  maxAbs: number; // largest |observed − fitted|, metres
  maxAbsTime: number; // UTC ms where it occurred
  explained: number; // share of the observed variance the fit explains, 0..1
  standardError: number; // σ = √(Σr² / (n − m)), metres
}

export function residualStatistics(record: GaugeRecord, fitted: Float64Array, unknowns: number): ResidualStatistics {
  const { heights, times } = record;
  const n = heights.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += numberAt(heights, i, 'heights');
  mean /= n;
  let sumSq = 0, total = 0, maxAbs = 0, maxAbsTime = times[0] ?? 0;
  for (let i = 0; i < n; i++) {
    const r = numberAt(heights, i, 'heights') - numberAt(fitted, i, 'fitted');
    sumSq += r * r;
    total += (numberAt(heights, i, 'heights') - mean) ** 2;
    if (Math.abs(r) > maxAbs) {
      maxAbs = Math.abs(r);
      maxAbsTime = numberAt(times, i, 'times');
    }
  }
  return {
    count: n,
    unknowns,
    rms: Math.sqrt(sumSq / n),
    maxAbs,
    maxAbsTime,
    explained: total > 0 ? 1 - sumSq / total : 1,
    standardError: Math.sqrt(sumSq / Math.max(1, n - unknowns)),
  };
}

export interface ConstituentEstimate {
  amplitude: number;
  phase: number;
  amplitudeError: number; // 95 % half-width
  phaseError: number; // 95 % half-width, degrees
}

/**
 * Amplitude, phase and their 95 % half-widths from the cos/sin coefficients (a, b) at `index`, index+1
 * of the unknowns: σ_H² = (a²Caa + 2abCab + b²Cbb)/H², σ_g² = (b²Caa − 2abCab + a²Cbb)/H⁴.
 */
export function constituentUncertainty(
  a: number, b: number, inverse: Float64Array, size: number, index: number, variance: number,
): ConstituentEstimate {
  const caa = variance * numberAt(inverse, index * size + index, 'inverse');
  const cbb = variance * numberAt(inverse, (index + 1) * size + index + 1, 'inverse');
  const cab = variance * numberAt(inverse, index * size + index + 1, 'inverse');
  const amplitude = Math.hypot(a, b);
  let phase = (Math.atan2(b, a) * DEG) % 360;
  if (phase < 0) phase += 360;
  if (amplitude === 0) return { amplitude, phase: 0, amplitudeError: Z95 * Math.sqrt((caa + cbb) / 2), phaseError: 180 };
  const varH = (a * a * caa + 2 * a * b * cab + b * b * cbb) / (amplitude * amplitude);
  const varG = (b * b * caa - 2 * a * b * cab + a * a * cbb) / amplitude ** 4;
  return {
    amplitude,
    phase,
    amplitudeError: Z95 * Math.sqrt(Math.max(0, varH)),
    phaseError: Math.min(180, Z95 * Math.sqrt(Math.max(0, varG)) * DEG),
  };
}
