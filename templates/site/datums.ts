// The station's datums as a ladder: highest first, with the y of each level on a small vertical
// scale and label positions pushed apart where levels lie close (LAT and MLWS often do).
import { firstOf, lastOf, type Datums } from '../../engine/index.js';
import { datumsInHeightOrder } from '../datum-order.js';

export const LADDER_HEIGHT = 210;
const TOP = 10;
const BOTTOM = 200;
const LABEL_GAP = 14; // smallest distance between two label baselines

export interface DatumRow {
  key: string;
  name: string;
  value: number; // metres above chart datum
  y: number; // level on the diagram
  labelY: number; // where its label sits (may differ from y when crowded)
}

// The levels and chart datum; their names come from the catalogue (the site's filter adds them).

export function datumLadder(datums: Datums): DatumRow[] {
  // highest first; chart datum lands where it belongs (the book's facts page uses the same order)
  const rows = datumsInHeightOrder(datums).map(({ key, value }) => ({ key, name: key as string, value }));
  const hi = firstOf(rows, 'datum levels').value; // never empty: chart datum is always a row
  const lo = lastOf(rows, 'datum levels').value;
  const span = hi - lo || 1;
  const placed: DatumRow[] = rows.map((r) => {
    const y = Math.round((TOP + ((hi - r.value) / span) * (BOTTOM - TOP)) * 10) / 10;
    return { ...r, y, labelY: y };
  });
  // Push labels down where they crowd, then back up from the bottom edge if they ran past it.
  let above = -Infinity;
  for (const row of placed) above = row.labelY = Math.max(row.labelY, above + LABEL_GAP);
  let below = BOTTOM + 4 + LABEL_GAP;
  for (const row of [...placed].reverse()) below = row.labelY = Math.min(row.labelY, below - LABEL_GAP);
  return placed;
}

/** Height on the diagram from the top level to the bottom one (the band drawn behind the lines). */
export function ladderSpan(rows: DatumRow[]): number {
  const [top, bottom] = [rows.at(0), rows.at(-1)];
  return top === undefined || bottom === undefined ? 0 : Math.round((bottom.y - top.y) * 10) / 10;
}
