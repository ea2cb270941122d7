// The baseline the benchmarks measure against: direct cosine sums at 1-minute steps.
import { compileAstronomicalTerms, entryOf, findConstituent, IndexOutOfRangeError, numberAt } from '../../engine/index.js';
import type { ReferenceStation } from '../../engine/index.js';

const DAY = 86_400_000;
const DEG = Math.PI / 180;

// Compiled once per set of constituents, as the kernel is compiled once per station: a fresh compilation
// on every timed run would also throw away the optimised code the two jobs share (V, f and u) each time
// it is collected, and the job measured after it would pay for that.
const compiled = new Map<string, ReturnType<typeof compileAstronomicalTerms>>();

/** Heights at 1-minute steps by direct cosines, node factors and V₀ refreshed at each UTC midnight. */
export function directMinuteSeries(station: ReferenceStation, start: number, days: number): Float64Array {
  const names = Object.keys(station.constituents);
  const n = names.length;
  const key = names.join(' ');
  const terms = compiled.get(key) ?? compileAstronomicalTerms(names);
  compiled.set(key, terms);
  const H = Float64Array.from(names, (k) => entryOf(station.constituents, k, 'constituents').amplitude);
  const g = Float64Array.from(names, (k) => entryOf(station.constituents, k, 'constituents').phase);
  const omegaPerMinute = Float64Array.from(names, (k) => (findConstituent(k)!.speed * DEG) / 60);
  const V = new Float64Array(n);
  const f = new Float64Array(n);
  const u = new Float64Array(n);
  const amplitude = new Float64Array(n);
  const phase = new Float64Array(n);
  const out = new Float64Array(days * 1440);
  for (let d = 0; d < days; d++) {
    terms.evaluate(start + d * DAY, V, f, u);
    for (let k = 0; k < n; k++) {
      amplitude[k] = numberAt(f, k, 'node factors') * numberAt(H, k, 'amplitudes');
      phase[k] = (numberAt(V, k, 'equilibrium arguments') + numberAt(u, k, 'nodal angles') - numberAt(g, k, 'phase lags')) * DEG;
    }
    for (let m = 0; m < 1440; m++) {
      let h = station.mean_level;
      for (let k = 0; k < n; k++) {
        // the check written out, not a call: the baseline's inner loop must not be slowed by the helper
        const a = amplitude[k], p = phase[k], w = omegaPerMinute[k];
        if (a === undefined || p === undefined || w === undefined) throw new IndexOutOfRangeError('constituents', k, n);
        h += a * Math.cos(p + w * m);
      }
      out[d * 1440 + m] = h;
    }
  }
  return out;
}
