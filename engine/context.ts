// The engine's caches, owned by whoever computes: create a context, hand it to the engine's functions
// for as long as their results may be shared (a unit of a build, one command), then drop it, and
// everything it holds goes with it. Without a context each call computes afresh; no cache of
// station results lives at module scope.
import type { DatumSummary } from './datums.js';
import type { Predictor } from './predict.js';
import type { StreamPredictor } from './streams/predict.js';
import type { StreamStation } from './streams/types.js';
import { createSkyEphemeris, type SkyEphemeris } from './sky/ephemeris.js';
import type { ReferenceStation, Station, TideEvent } from './types.js';

export interface EngineContext {
  /** Compiled harmonic predictors, per station object. */
  readonly predictors: Map<ReferenceStation, Predictor>;
  /** Compiled stream predictors (east and north kernels), per stream station object. */
  readonly streamPredictors: Map<StreamStation, StreamPredictor>;
  /** Datums per station object, with the reference port they were computed from. */
  readonly datums: Map<Station, { reference: ReferenceStation; summary: DatumSummary }>;
  /** A reference port's high and low waters over a datum epoch (first year → events), shared by its secondary ports. */
  readonly epochEvents: Map<ReferenceStation, Map<number, TideEvent[]>>;
  /** Sun and Moon positions; may be shared by several contexts (they depend on no station). */
  readonly sky: SkyEphemeris;
}

export function createEngineContext(shared: { sky?: SkyEphemeris } = {}): EngineContext {
  return {
    predictors: new Map(), streamPredictors: new Map(), datums: new Map(), epochEvents: new Map(),
    sky: shared.sky ?? createSkyEphemeris(),
  };
}
