// The levels of a station's datums table in height order, chart datum (0) among them where it falls:
// the order of the site's table and ladder and of the book's facts page.
import type { Datums } from '../engine/index.js';

export type DatumKey = keyof Omit<Datums, 'epoch'> | 'CD';

/** Nominal order, highest first when the levels are ordinary; ties keep this order. */
const KEYS: DatumKey[] = ['HAT', 'MHWS', 'MHWN', 'MSL', 'MLWN', 'MLWS', 'LAT', 'CD'];

export function datumsInHeightOrder(datums: Datums): { key: DatumKey; value: number }[] {
  return KEYS.map((key) => ({ key, value: key === 'CD' ? 0 : datums[key] })).sort((a, b) => b.value - a.value);
}

/** How far LAT lies below chart datum, in metres; null when it does not. */
export function latBelowChartDatum(datums: Datums): number | null {
  return datums.LAT < 0 ? -datums.LAT : null;
}
