// The baseline the benchmarks measure against: direct cosine sums at 1-minute steps.
import { compileAstronomicalTerms, entryOf, findConstituent, valueAt } from '../../engine/index.js';
import type { ReferenceStation } from '../../engine/index.js';

const DAY = 86_400_000;
const DEG = Math.PI / 180;

/** Heights at 1-minute steps by direct cosines, node factors and V₀ refreshed at each UTC midnight. */
export function directMinuteSeries(station: ReferenceStation, start: number, days: number): Float64Array {
  const names = Object.keys(station.constituents);
  const n = names.length;
  const terms = compileAstronomicalTerms(names);
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
      amplitude[k] = valueAt(f, k, 'node factors') * valueAt(H, k, 'amplitudes');
      phase[k] = (valueAt(V, k, 'equilibrium arguments') + valueAt(u, k, 'nodal angles') - valueAt(g, k, 'phase lags')) * DEG;
    }
    for (let m = 0; m < 1440; m++) {
      let h = station.mean_level;
      for (let k = 0; k < n; k++) h += valueAt(amplitude, k, 'amplitudes') * Math.cos(valueAt(phase, k, 'phases') + valueAt(omegaPerMinute, k, 'speeds') * m);
      out[d * 1440 + m] = h;
    }
  }
  return out;
}
