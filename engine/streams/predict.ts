// A stream station compiled into two height-like kernels, one for the east and one for the north
// component of the velocity (./ellipse.ts gives each constituent's component amplitude and phase), so
// the height engine's prediction kernel and its node factors serve streams unchanged. Knots throughout.

import { constituentSpeed } from '../constituents.js';
import type { EngineContext } from '../context.js';
import { compilePredictor, type Predictor } from '../predict.js';
import type { ConstituentConstant, ReferenceStation } from '../types.js';
import { ellipseToComponents } from './ellipse.js';
import type { StreamStation, StreamVelocity } from './types.js';

const DEG = Math.PI / 180;
/** Knots per metre per second: 1 kn = 1852 m per hour. */
export const KNOTS_PER_METRE_PER_SECOND = 3600 / 1852;
/** A stream whose main constituent's ellipse is at least this round is rotary: its slack is its least speed. */
export const ROTARY_MINOR_TO_MAJOR = 0.3;

export interface StreamPredictor {
  readonly station: StreamStation;
  readonly east: Predictor;
  readonly north: Predictor;
  readonly floodDirection: number; // degrees true
  readonly ebbDirection: number;
  readonly rotary: boolean;
  /** Radians per hour of the fastest constituent. */
  readonly fastestSpeed: number;
  velocityAt(t: number): StreamVelocity;
  /** The component toward the flood direction, knots (negative on the ebb). */
  alongAt(t: number): number;
  /** East and north components, knots, at start + i·stepMs. */
  series(start: number, stepMs: number, count: number): { east: Float64Array; north: Float64Array };
  /**
   * Their rates, knots per hour, at start + i·stepMs, without the slow change of f and u (a part in 10⁵):
   * for scanning only; exact rates come from east.rateAt and north.rateAt.
   */
  rateSeries(start: number, stepMs: number, count: number): { east: Float64Array; north: Float64Array };
}

/** Degrees true (clockwise from north) toward which a velocity sets; null for no velocity. */
export function bearingOf(east: number, north: number): number | null {
  if (east === 0 && north === 0) return null;
  const b = Math.atan2(east, north) / DEG;
  return b < 0 ? b + 360 : b + 0;
}

export function velocity(east: number, north: number): StreamVelocity {
  return { east, north, speed: Math.hypot(east, north), direction: bearingOf(east, north) };
}

/** The height-like stations of the east and north components, in knots. */
export function componentStations(station: StreamStation): { east: ReferenceStation; north: ReferenceStation } {
  const scale = station.unit === 'm/s' ? KNOTS_PER_METRE_PER_SECOND : 1;
  const east: Record<string, ConstituentConstant> = {};
  const north: Record<string, ConstituentConstant> = {};
  for (const [name, ellipse] of Object.entries(station.constituents)) {
    const c = ellipseToComponents(ellipse);
    east[name] = { amplitude: c.east.amplitude * scale, phase: c.east.phase };
    north[name] = { amplitude: c.north.amplitude * scale, phase: c.north.phase };
  }
  const common = {
    kind: 'reference' as const,
    name: station.name,
    position: station.position,
    timezone: station.timezone,
    datum: 'no current',
    provenance: station.provenance,
    ...(station.sourceFile !== undefined ? { sourceFile: station.sourceFile } : {}),
  };
  return {
    east: { ...common, id: `${station.id}-east`, mean_level: station.mean_current.east * scale, constituents: east },
    north: { ...common, id: `${station.id}-north`, mean_level: station.mean_current.north * scale, constituents: north },
  };
}

/** True when the constituent with the longest major axis has |minor| ≥ ROTARY_MINOR_TO_MAJOR·major. */
export function isRotary(station: StreamStation): boolean {
  let main: { major: number; minor: number } | undefined;
  for (const e of Object.values(station.constituents)) if (!main || e.major > main.major) main = e;
  return main !== undefined && main.major > 0 && Math.abs(main.minor) >= ROTARY_MINOR_TO_MAJOR * main.major;
}

/** d/dt of f·A·cos(V + u − G) with f and u held: ω·f·A·cos(V + u − G + 90°), a height-like station of its own. */
function rateStation(component: ReferenceStation): ReferenceStation {
  const constituents: Record<string, ConstituentConstant> = {};
  for (const [name, c] of Object.entries(component.constituents)) {
    constituents[name] = { amplitude: c.amplitude * constituentSpeed(name) * DEG, phase: (((c.phase - 90) % 360) + 360) % 360 };
  }
  return { ...component, id: `${component.id}-rate`, mean_level: 0, constituents };
}

export function compileStreamPredictor(station: StreamStation): StreamPredictor {
  const parts = componentStations(station);
  const east = compilePredictor(parts.east);
  const north = compilePredictor(parts.north);
  let rates: { east: Predictor; north: Predictor } | undefined;
  const rateKernels = () => (rates ??= { east: compilePredictor(rateStation(parts.east)), north: compilePredictor(rateStation(parts.north)) });
  const flood = station.flood_direction;
  const ebb = station.ebb_direction ?? (flood + 180) % 360;
  const fx = Math.sin(flood * DEG);
  const fy = Math.cos(flood * DEG);
  return {
    station,
    east,
    north,
    floodDirection: flood,
    ebbDirection: ebb,
    rotary: isRotary(station),
    fastestSpeed: Math.max(east.fastestSpeed, north.fastestSpeed),
    velocityAt: (t) => velocity(east.heightAt(t), north.heightAt(t)),
    alongAt: (t) => east.heightAt(t) * fx + north.heightAt(t) * fy,
    series: (start, stepMs, count) => ({ east: east.heights(start, stepMs, count), north: north.heights(start, stepMs, count) }),
    rateSeries: (start, stepMs, count) => {
      const k = rateKernels();
      return { east: k.east.heights(start, stepMs, count), north: k.north.heights(start, stepMs, count) };
    },
  };
}

/** The compiled predictor of a stream station, kept in the context per station object. */
export function streamPredictorFor(station: StreamStation, ctx?: EngineContext): StreamPredictor {
  let p = ctx?.streamPredictors.get(station);
  if (!p) {
    p = compileStreamPredictor(station);
    ctx?.streamPredictors.set(station, p);
  }
  return p;
}
