// Every rise and set of the Sun or the Moon between two instants: a root search on the body's
// height above the rise/set horizon (./ephemeris.ts). The height is sampled every hour;
// a sign change is refined to a fraction of a second; where no sign change shows but the height
// comes close enough to zero that a short rise-and-set could hide between two samples (judged by
// the largest rate at which the height can change), the interval is halved until it is either
// ruled out or a sign change appears. Near the polar circles this finds the rise and set a few
// minutes apart at the edges of the midnight sun, and both moonrises of a day.

import { maxHeightRate, skyHeight, type SkyBody, type SkyEphemeris, type SkySite } from './ephemeris.js';

/** A crossing of the rise/set horizon: +1 rising, −1 setting. Time in UTC ms. */
export interface Crossing {
  time: number;
  direction: 1 | -1;
}

const STEP_MS = 60 * 60_000;
const SHORTEST_MS = 1000; // a rise and set closer than a second are not told apart

/** Every crossing with fromMs ≤ time < toMs, in time order. */
export function crossings(
  eph: SkyEphemeris, body: SkyBody, fromMs: number, toMs: number, site: SkySite,
): Crossing[] {
  const out: Crossing[] = [];
  if (!(fromMs < toMs)) return out;
  const height = (t: number): number => skyHeight(eph, body, t, site);
  const rate = maxHeightRate(body, site);

  const search = (a: number, ha: number, b: number, hb: number): void => {
    if (ha > 0 !== hb > 0) {
      out.push({ time: refine(height, a, b, ha, hb), direction: hb > 0 ? 1 : -1 });
      return;
    }
    // Same side at both ends: going to zero and back needs at least |h|/rate each way.
    if (b - a < SHORTEST_MS || Math.min(Math.abs(ha), Math.abs(hb)) > (rate * (b - a)) / 2) return;
    const m = (a + b) / 2;
    const hm = height(m);
    search(a, ha, m, hm);
    search(m, hm, b, hb);
  };

  let t0 = fromMs;
  let h0 = height(t0);
  while (t0 < toMs) {
    const t1 = Math.min(t0 + STEP_MS, toMs);
    const h1 = height(t1);
    search(t0, h0, t1, h1);
    t0 = t1;
    h0 = h1;
  }
  return out.filter((c) => c.time >= fromMs && c.time < toMs);
}

// Illinois variant of regula falsi (Dowell & Jarratt 1971): keeps the sign change bracketed and
// converges in a few steps on a smooth curve.
function refine(height: (t: number) => number, lo: number, hi: number, hLo: number, hHi: number): number {
  let side = 0;
  for (let i = 0; i < 60 && hi - lo > 100; i++) {
    const t = hi - (hHi * (hi - lo)) / (hHi - hLo);
    const h = height(t);
    if (h > 0 === hHi > 0) {
      hi = t;
      hHi = h;
      if (side === -1) hLo /= 2;
      side = -1;
    } else {
      lo = t;
      hLo = h;
      if (side === 1) hHi /= 2;
      side = 1;
    }
    if (Math.abs(h) < 1e-7) return Math.round(t);
  }
  return Math.round((lo + hi) / 2);
}
