// A straight line d = d_neaps + k·(d_springs − d_neaps) through (k, d) pairs by least squares, with one
// round of outlier rejection (|residual| above 3.5 robust standard deviations, σ ≈ 1.4826·MAD; Hampel's
// rule) so that one badly matched or surge-hit event does not tilt the line.
import { itemAt } from '../item.js';

export interface DifferenceFit {
  neaps: number; // d at k = 0
  springs: number; // d at k = 1
  rms: number; // RMS of the residuals of the events kept
  count: number; // events kept
  rejected: number; // events dropped as outliers
  constant: boolean; // k spread too narrow for a slope: one value for springs and neaps
}

// Below this spread of k a record covers too little of the spring-neap cycle to fit a slope.
const MIN_K_SPREAD = 0.15;

function line(k: readonly number[], d: readonly number[], use: readonly boolean[]): { a: number; b: number; constant: boolean } {
  let n = 0, sk = 0, sd = 0;
  for (let i = 0; i < k.length; i++) if (use[i]) { n++; sk += itemAt(k, i, 'k'); sd += itemAt(d, i, 'd'); }
  const mk = sk / n, md = sd / n;
  let skk = 0, skd = 0;
  for (let i = 0; i < k.length; i++) {
    if (!use[i]) continue;
    skk += (itemAt(k, i, 'k') - mk) ** 2;
    skd += (itemAt(k, i, 'k') - mk) * (itemAt(d, i, 'd') - md);
  }
  if (n < 3 || Math.sqrt(skk / n) < MIN_K_SPREAD) return { a: md, b: 0, constant: true };
  const b = skd / skk;
  return { a: md - b * mk, b, constant: false };
}

function median(values: number[]): number {
  const s = [...values].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? itemAt(s, m, 's') : (itemAt(s, m - 1, 's') + itemAt(s, m, 's')) / 2;
}

/** Fits d against k; `floor` is the smallest residual ever called an outlier (minutes or metres). */
export function fitAgainstRangeFactor(k: readonly number[], d: readonly number[], floor: number): DifferenceFit {
  const use = k.map(() => true);
  let fit = line(k, d, use);
  const residual = (i: number): number => itemAt(d, i, 'd') - (fit.a + fit.b * itemAt(k, i, 'k'));
  const mad = median(k.map((_, i) => Math.abs(residual(i))));
  const limit = Math.max(floor, 3.5 * 1.4826 * mad);
  let rejected = 0;
  for (let i = 0; i < k.length; i++) {
    if (Math.abs(residual(i)) > limit) {
      use[i] = false;
      rejected++;
    }
  }
  if (rejected > 0 && k.length - rejected >= 3) fit = line(k, d, use);
  else if (rejected > 0) {
    use.fill(true);
    rejected = 0;
  }
  let sumSq = 0, count = 0;
  for (let i = 0; i < k.length; i++) {
    if (!use[i]) continue;
    sumSq += residual(i) ** 2;
    count++;
  }
  return { neaps: fit.a, springs: fit.a + fit.b, rms: Math.sqrt(sumSq / count), count, rejected, constant: fit.constant };
}
