// Linear least squares by the normal equations, solved with a Cholesky factorisation (Golub and
// Van Loan, Matrix Computations, §4.2). The design matrix is never stored: each observation's row is
// folded into AᵀA and Aᵀy soon after it is made, so a year of hourly readings needs only m² numbers.
import { numberAt } from '../item.js';

// Rows are gathered in blocks of 32 and folded in together: each entry of AᵀA is then updated once per
// block by a short dot product instead of once per row (about twice as fast, measured on a year of
// hourly rows with 121 unknowns).
const BLOCK = 32;

export interface NormalEquations {
  size: number; // m, the number of unknowns
  matrix: Float64Array; // AᵀA, row-major m×m (upper triangle filled while accumulating)
  rhs: Float64Array; // Aᵀy
  count: number; // observations folded in
  block: Float64Array; // rows waiting to be folded in, column by column (m × BLOCK)
  blockY: Float64Array;
  pending: number;
}

export function createNormalEquations(size: number): NormalEquations {
  return {
    size, matrix: new Float64Array(size * size), rhs: new Float64Array(size), count: 0,
    block: new Float64Array(size * BLOCK), blockY: new Float64Array(BLOCK), pending: 0,
  };
}

/** Folds the waiting rows into AᵀA and Aᵀy (upper triangle only). */
function flush(eq: NormalEquations): void {
  const { size, matrix, rhs, block, blockY, pending } = eq;
  for (let i = 0; i < size; i++) {
    const bi = i * BLOCK;
    let sy = 0;
    for (let r = 0; r < pending; r++) sy += numberAt(block, bi + r, 'block') * numberAt(blockY, r, 'blockY');
    rhs[i] = numberAt(rhs, i, 'rhs') + sy;
    const base = i * size;
    for (let j = i; j < size; j++) {
      const bj = j * BLOCK;
      // four partial sums let the dot product run without waiting on each addition
      let s0 = 0, s1 = 0, s2 = 0, s3 = 0, r = 0;
      for (; r + 3 < pending; r += 4) {
        s0 += numberAt(block, bi + r, 'block') * numberAt(block, bj + r, 'block');
        s1 += numberAt(block, bi + r + 1, 'block') * numberAt(block, bj + r + 1, 'block');
        s2 += numberAt(block, bi + r + 2, 'block') * numberAt(block, bj + r + 2, 'block');
        s3 += numberAt(block, bi + r + 3, 'block') * numberAt(block, bj + r + 3, 'block');
      }
      for (; r < pending; r++) s0 += numberAt(block, bi + r, 'block') * numberAt(block, bj + r, 'block');
      matrix[base + j] = numberAt(matrix, base + j, 'matrix') + ((s0 + s1) + (s2 + s3));
    }
  }
  eq.pending = 0;
}

/** Adds one observation y with design row `row` to the normal equations. */
export function addObservation(eq: NormalEquations, row: Float64Array, y: number): void {
  const p = eq.pending;
  for (let k = 0; k < eq.size; k++) eq.block[k * BLOCK + p] = numberAt(row, k, 'row');
  eq.blockY[p] = y;
  eq.count++;
  if (++eq.pending === BLOCK) flush(eq);
}

/** AᵀA (upper triangle, row-major) with every observation added so far folded in. */
export function normalMatrix(eq: NormalEquations): Float64Array {
  if (eq.pending > 0) flush(eq);
  return eq.matrix;
}

/** Thrown when AᵀA is not positive definite: the unknown at `index` is not determined by the data. */
export class SingularSystemError extends Error {
  override name = 'SingularSystemError';
  constructor(readonly index: number) {
    super(`normal equations are singular at unknown ${index}`);
  }
}

/**
 * Cholesky factor L (lower triangle, row-major) of the symmetric matrix whose upper triangle is given.
 * A pivot smaller than `relativeTolerance` times its diagonal entry means the column is (nearly) a
 * combination of earlier ones: the record cannot tell those unknowns apart.
 */
export function choleskyFactor(upper: Float64Array, size: number, relativeTolerance = 1e-10): Float64Array {
  const L = new Float64Array(size * size);
  for (let j = 0; j < size; j++) {
    let diag = numberAt(upper, j * size + j, 'upper');
    for (let k = 0; k < j; k++) diag -= numberAt(L, j * size + k, 'L') ** 2;
    if (!(diag > relativeTolerance * numberAt(upper, j * size + j, 'upper'))) throw new SingularSystemError(j);
    const ljj = Math.sqrt(diag);
    L[j * size + j] = ljj;
    for (let i = j + 1; i < size; i++) {
      let sum = numberAt(upper, j * size + i, 'upper'); // A[i][j] = A[j][i] from the upper triangle
      for (let k = 0; k < j; k++) sum -= numberAt(L, i * size + k, 'L') * numberAt(L, j * size + k, 'L');
      L[i * size + j] = sum / ljj;
    }
  }
  return L;
}

/** Solves L Lᵀ x = b. */
export function solveCholesky(L: Float64Array, size: number, b: Float64Array): Float64Array {
  const x = Float64Array.from(b);
  for (let i = 0; i < size; i++) {
    let sum = numberAt(x, i, 'x');
    for (let k = 0; k < i; k++) sum -= numberAt(L, i * size + k, 'L') * numberAt(x, k, 'x');
    x[i] = sum / numberAt(L, i * size + i, 'L');
  }
  for (let i = size - 1; i >= 0; i--) {
    let sum = numberAt(x, i, 'x');
    for (let k = i + 1; k < size; k++) sum -= numberAt(L, k * size + i, 'L') * numberAt(x, k, 'x');
    x[i] = sum / numberAt(L, i * size + i, 'L');
  }
  return x;
}

/** (AᵀA)⁻¹ from its Cholesky factor, column by column; the unknowns' covariance up to σ². */
export function inverseFromCholesky(L: Float64Array, size: number): Float64Array {
  const inverse = new Float64Array(size * size);
  const unit = new Float64Array(size);
  for (let c = 0; c < size; c++) {
    unit.fill(0);
    unit[c] = 1;
    const column = solveCholesky(L, size, unit);
    for (let r = 0; r < size; r++) inverse[r * size + c] = numberAt(column, r, 'column');
  }
  return inverse;
}

export interface LeastSquaresSolution {
  coefficients: Float64Array;
  inverse: Float64Array; // (AᵀA)⁻¹, m×m
}

/** Solves the accumulated normal equations; throws SingularSystemError when they are not determined. */
export function solveNormalEquations(eq: NormalEquations): LeastSquaresSolution {
  const L = choleskyFactor(normalMatrix(eq), eq.size);
  return { coefficients: solveCholesky(L, eq.size, eq.rhs), inverse: inverseFromCholesky(L, eq.size) };
}
