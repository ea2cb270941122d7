// What the pages of one station need beyond the model itself, worked out once per book (layout
// choices only: scales and page splits, never tide arithmetic).
import type { StationYear } from '../../engine/index.js';
import type { Words } from '../locale/index.js';
import type { PageGeometry } from './geometry.js';
import type { CurveScale } from './day-curve.js';
import type { MonthPart } from './month-layout.js';
import { monthParts } from './month-layout.js';
import { printable } from './format.js';
import { windowLookup, type WindowLookup } from './window-bars.js';

export interface StationView {
  model: StationYear;
  name: string; // printable station name
  southern: boolean; // the moon's lit side is drawn as seen from the southern hemisphere
  curve: CurveScale; // one vertical scale for every day curve of the station, so days compare
  parts: MonthPart[];
  words: Words;
  windows: WindowLookup; // access windows drawn on the month pages (none when the station has none)
}

export function stationView(model: StationYear, g: PageGeometry, words: Words): StationView {
  let low = Math.min(0, model.datums.LAT);
  let high = model.datums.HAT;
  for (const d of model.days) {
    for (const h of d.curve) { if (h < low) low = h; if (h > high) high = h; }
  }
  const pad = Math.max(high - low, 0.1) * 0.06; // a flat year still gets a scale
  return {
    model,
    name: printable(model.station.name),
    southern: model.station.position.latitude < 0,
    curve: { low: low - pad, high: high + pad },
    windows: windowLookup(model.windows),
    parts: monthParts(model, g),
    words,
  };
}
