// Instants of the Moon's quarters (new, first quarter, full, last quarter) from the ephemeris of
// `astronomy-engine` (its geocentric ecliptic longitude difference Moon − Sun reaching 0°, 90°,
// 180°, 270°). Cross-checked in the tests against Meeus (1998) ch. 49 (tests/fixtures/meeus-phases.ts).

import { NextMoonQuarter, SearchMoonQuarter } from 'astronomy-engine';
import { itemAt } from '../item.js';
import type { MoonPhaseName } from '../types.js';

export interface MoonQuarter {
  time: number; // UTC epoch ms
  phase: MoonPhaseName;
}

/** What a quarter means for the tide: new and full moon are syzygies, the quarters quadratures. */
export interface AstronomicalSpringNeap {
  time: number; // UTC epoch ms
  kind: 'syzygy' | 'quadrature';
  phase: MoonPhaseName;
}

export const QUARTER_NAMES: readonly MoonPhaseName[] = ['new', 'first-quarter', 'full', 'last-quarter'];

/** Every quarter with startMs ≤ time < endMs, in time order. */
export function moonQuarters(startMs: number, endMs: number): MoonQuarter[] {
  const out: MoonQuarter[] = [];
  if (!(endMs > startMs)) return out;
  let q = SearchMoonQuarter(new Date(startMs));
  while (q.time.date.getTime() < endMs) {
    const time = q.time.date.getTime();
    if (time >= startMs) out.push({ time, phase: itemAt(QUARTER_NAMES, q.quarter, 'moon quarter names') });
    q = NextMoonQuarter(q);
  }
  return out;
}

/** Syzygies (new and full moon) and quadratures (first and last quarter) with startMs ≤ time < endMs. */
export function syzygiesAndQuadratures(startMs: number, endMs: number): AstronomicalSpringNeap[] {
  return moonQuarters(startMs, endMs).map(({ time, phase }) => ({
    time,
    phase,
    kind: phase === 'new' || phase === 'full' ? 'syzygy' : 'quadrature',
  }));
}
