import { describe, expect, it } from 'vitest';
import {
  addObservation, choleskyFactor, createNormalEquations, normalMatrix, SingularSystemError, solveNormalEquations,
} from '../../engine/analysis/leastsquares.js';
import { itemAt } from '../../engine/index.js';

describe('least squares by normal equations', () => {
  it('fits a straight line exactly as the textbook closed form does', () => {
    // Worked by hand: points (0,1), (1,3), (2,4), (3,4) → means 1.5 and 3, Sxy = 3 + 0 + 0.5 + 1.5 = 5, Sxx = 5 → slope 1, intercept 3 − 1·1.5 = 1.5
    const eq = createNormalEquations(2);
    for (const [x, y] of [[0, 1], [1, 3], [2, 4], [3, 4]] as const) addObservation(eq, Float64Array.of(1, x), y);
    const { coefficients, inverse } = solveNormalEquations(eq);
    expect(coefficients[0]).toBeCloseTo(1.5, 12);
    expect(coefficients[1]).toBeCloseTo(1, 12);
    // (AᵀA)⁻¹ for x = 0..3: [[14, −6], [−6, 4]] / (4·14 − 36) = /20
    expect(Array.from(inverse)).toEqual([0.7, -0.3, -0.3, 0.2].map((v) => expect.closeTo(v, 12)));
  });

  it('recovers the coefficients of a noiseless sum of sines (a small harmonic fit)', () => {
    const eq = createNormalEquations(5);
    const truth = [0.5, 1.2, -0.4, 0.3, 0.8];
    const row = new Float64Array(5);
    for (let t = 0; t < 200; t++) {
      const a = 0.3 * t, b = 0.71 * t;
      row.set([1, Math.cos(a), Math.sin(a), Math.cos(b), Math.sin(b)]);
      let y = 0;
      for (let k = 0; k < 5; k++) y += itemAt(truth, k, 'truth') * itemAt(row, k, 'row');
      addObservation(eq, row, y);
    }
    const x = solveNormalEquations(eq).coefficients;
    truth.forEach((v, k) => expect(x[k]).toBeCloseTo(v, 10));
  });

  it('reports which unknown is undetermined when two columns are the same', () => {
    const eq = createNormalEquations(3);
    for (let t = 0; t < 10; t++) addObservation(eq, Float64Array.of(1, t, 2 * t), t);
    expect(() => choleskyFactor(normalMatrix(eq), 3)).toThrow(SingularSystemError);
    try {
      choleskyFactor(normalMatrix(eq), 3);
    } catch (e) {
      expect((e as SingularSystemError).index).toBe(2);
    }
  });
});
