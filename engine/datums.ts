// Tidal datums of a station: LAT and HAT from 19 years of predicted high and low waters, the mean
// spring and neap levels from the constants, the tide type from the form number, the age of the tide.
import type { EngineContext } from './context.js';
import { DEFAULT_DATUM_EPOCH } from './stations/schema.js';
import { secondaryEventsFrom, secondaryPaddingMs } from './secondary.js';
import { harmonicStationOf, tideEvents, type StationLookup } from './tides.js';
import type {
  ConstituentConstant, Datums, ModelWarning, ReferenceStation, SecondaryStation, Station, TideEvent, TideType,
} from './types.js';

// At least one nodal cycle of 18.61 years (IHO resolution on chart datum, from memory).
export const DATUM_EPOCH_YEARS = 19;

const DAY = 86_400_000;
// Speeds of M2 and S2 in degrees per hour (Schureman 1958, Table 2).
const SPEED_M2 = 28.9841042;
const SPEED_S2 = 30;

/** Everything a tide book prints about a station's datums and character. */
export interface DatumSummary {
  datums: Datums;
  tideType: TideType;
  meanSpringRange: number; // MHWS − MLWS, metres
  meanNeapRange: number; // MHWN − MLWN
  ageOfTideHours: number; // from the constants (Pugh 1987)
  warnings: ModelWarning[];
}

type Levels = Pick<Datums, 'MHWS' | 'MHWN' | 'MLWN' | 'MLWS' | 'MSL'>;

const mm = (x: number): number => Math.round(x * 1000) / 1000;

function amplitude(c: Record<string, ConstituentConstant>, name: string): number {
  return c[name]?.amplitude ?? 0;
}

/** MHWS = Z0 + (M2 + S2), MHWN = Z0 + (M2 − S2), MLWN = Z0 − (M2 − S2), MLWS = Z0 − (M2 + S2) (Pugh 1987). */
export function harmonicLevels(station: ReferenceStation): Levels {
  const z0 = station.mean_level;
  const m2 = amplitude(station.constituents, 'M2');
  const s2 = amplitude(station.constituents, 'S2');
  return { MHWS: z0 + m2 + s2, MHWN: z0 + m2 - s2, MLWN: z0 - m2 + s2, MLWS: z0 - m2 - s2, MSL: z0 };
}

/**
 * Secondary-port levels: the reference port's levels with the height differences of the matching
 * state of the tide (springs at k = 1 for MHWS/MLWS, neaps at k = 0 for MHWN/MLWN); MSL is the mean
 * of the four, as it is for a reference port under the formulas above.
 */
export function secondaryLevels(reference: ReferenceStation, station: SecondaryStation): Levels {
  const r = harmonicLevels(reference);
  const d = station.differences;
  const MHWS = r.MHWS + d.high_water.springs.height;
  const MHWN = r.MHWN + d.high_water.neaps.height;
  const MLWN = r.MLWN + d.low_water.neaps.height;
  const MLWS = r.MLWS + d.low_water.springs.height;
  return { MHWS, MHWN, MLWN, MLWS, MSL: (MHWS + MHWN + MLWN + MLWS) / 4 };
}

/** Form number F = (K1 + O1)/(M2 + S2) (Courtier 1938, as given in Pugh 1987); capped at 999. */
export function formNumber(constituents: Record<string, ConstituentConstant>): number {
  const diurnal = amplitude(constituents, 'K1') + amplitude(constituents, 'O1');
  const semidiurnal = amplitude(constituents, 'M2') + amplitude(constituents, 'S2');
  if (semidiurnal <= 0) return diurnal > 0 ? 999 : 0;
  return Math.min(999, diurnal / semidiurnal);
}

/** Tide type from the form number: < 0.25, 0.25–1.5, 1.5–3, > 3 (Courtier 1938, as given in Pugh 1987). */
export function tideTypeOf(F: number): TideType {
  const formNumber = Math.round(F * 1000) / 1000;
  if (F < 0.25) return { formNumber, kind: 'semidiurnal' };
  if (F < 1.5) return { formNumber, kind: 'mixed-semidiurnal' };
  if (F <= 3) return { formNumber, kind: 'mixed-diurnal' };
  return { formNumber, kind: 'diurnal' };
}

/**
 * Age of the tide, hours: (g_S2 − g_M2)/(30 − 28.9841042) (Pugh 1987). The phase difference is
 * wrapped into −90°..270°, so a small negative difference reads as springs slightly before syzygy
 * rather than as a lag of nearly a whole spring–neap cycle. 0 without M2 or S2.
 */
export function ageOfTideHours(constituents: Record<string, ConstituentConstant>): number {
  const m2 = constituents['M2'];
  const s2 = constituents['S2'];
  if (!m2 || !s2 || m2.amplitude <= 0 || s2.amplitude <= 0) return 0;
  let d = (((s2.phase - m2.phase) % 360) + 360) % 360;
  if (d >= 270) d -= 360;
  return d / (SPEED_S2 - SPEED_M2);
}

/** The 19-year span for LAT/HAT: 1 January of `datum_epoch` (00:00 UTC) for 19 whole years. */
export function datumEpoch(station: Station): { from: number; to: number; start: number; end: number } {
  const from = station.datum_epoch ?? DEFAULT_DATUM_EPOCH;
  const to = from + DATUM_EPOCH_YEARS - 1;
  return { from, to, start: Date.UTC(from, 0, 1), end: Date.UTC(to + 1, 0, 1) };
}

/** Lowest low water and highest high water among events. */
export function astronomicalExtremes(events: readonly TideEvent[]): { LAT: number; HAT: number } {
  let LAT = Infinity;
  let HAT = -Infinity;
  for (const e of events) {
    if (e.type === 'low' && e.height < LAT) LAT = e.height;
    if (e.type === 'high' && e.height > HAT) HAT = e.height;
  }
  return { LAT, HAT };
}

/**
 * Datums of any station. LAT/HAT: lowest and highest of all predicted high and low waters over the
 * epoch — the harmonic extrema for a reference port, the secondary port's own derived events for a
 * secondary port. Tide type and age of the tide come from the harmonic (reference) constants.
 */
export function stationDatums(station: Station, set: StationLookup, ctx?: EngineContext): DatumSummary {
  const reference = harmonicStationOf(station, set);
  // Kept in the context per station object (and the reference object it was computed with).
  const hit = ctx?.datums.get(station);
  if (hit && hit.reference === reference) return hit.summary;
  const summary = computeDatums(station, reference, set, ctx);
  ctx?.datums.set(station, { reference, summary });
  return summary;
}

// The reference port's events over an epoch and a few days either side, kept in the context so
// that its secondary ports reuse them instead of predicting the same 19 years again.
const EPOCH_PAD = 3 * DAY;

function referenceEpochEvents(
  reference: ReferenceStation, set: StationLookup, from: number, ctx?: EngineContext,
): TideEvent[] {
  let byEpoch = ctx?.epochEvents.get(reference);
  if (!byEpoch) {
    byEpoch = new Map<number, TideEvent[]>();
    ctx?.epochEvents.set(reference, byEpoch);
  }
  let events = byEpoch.get(from);
  if (!events) {
    const start = Date.UTC(from, 0, 1);
    const end = Date.UTC(from + DATUM_EPOCH_YEARS, 0, 1);
    events = tideEvents(reference, set, start - EPOCH_PAD, end + EPOCH_PAD, ctx);
    byEpoch.set(from, events);
  }
  return events;
}

/** Every high and low water of a station over its datum epoch (secondary ports: their own events). */
export function epochTideEvents(station: Station, set: StationLookup, ctx?: EngineContext): TideEvent[] {
  const epoch = datumEpoch(station);
  const inEpoch = (e: TideEvent) => e.time >= epoch.start && e.time < epoch.end;
  if (station.kind === 'reference') return referenceEpochEvents(station, set, epoch.from, ctx).filter(inEpoch);
  if (secondaryPaddingMs(station) > EPOCH_PAD) return tideEvents(station, set, epoch.start, epoch.end, ctx);
  const reference = harmonicStationOf(station, set);
  return secondaryEventsFrom(referenceEpochEvents(reference, set, epoch.from, ctx), reference, station).filter(inEpoch);
}

function computeDatums(
  station: Station, reference: ReferenceStation, set: StationLookup, ctx?: EngineContext,
): DatumSummary {
  const epoch = datumEpoch(station);
  const { LAT, HAT } = astronomicalExtremes(epochTideEvents(station, set, ctx));
  const levels = station.kind === 'reference' ? harmonicLevels(station) : secondaryLevels(reference, station);
  const datums: Datums = {
    LAT: mm(LAT), HAT: mm(HAT),
    MHWS: mm(levels.MHWS), MHWN: mm(levels.MHWN), MLWN: mm(levels.MLWN), MLWS: mm(levels.MLWS),
    MSL: mm(levels.MSL),
    epoch: { from: epoch.from, to: epoch.to },
  };
  const warnings: ModelWarning[] = [];
  // predicted heights never fall to the datum: the datum label or the mean level is likely wrong
  if (datums.LAT > 0.1) warnings.push({ code: 'lat-above-datum', LAT: datums.LAT, epoch: { ...datums.epoch } });
  return {
    datums,
    tideType: tideTypeOf(formNumber(reference.constituents)),
    meanSpringRange: mm(levels.MHWS - levels.MLWS),
    meanNeapRange: mm(levels.MHWN - levels.MLWN),
    ageOfTideHours: Math.round(ageOfTideHours(reference.constituents) * 10) / 10,
    warnings,
  };
}

/** The lowest low water of `events` when it falls below LAT by more than rounding, else null. */
export function lowWaterBelowLat(events: readonly TideEvent[], LAT: number): TideEvent | null {
  let lowest: TideEvent | null = null;
  for (const e of events) if (e.type === 'low' && (!lowest || e.height < lowest.height)) lowest = e;
  return lowest && lowest.height < LAT - 0.001 ? lowest : null;
}
