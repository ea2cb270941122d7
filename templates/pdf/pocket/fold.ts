// How the pocket table's sheet is folded, and which panel goes where. The sheet is landscape, printed
// on both sides (turned over like a book page: the second side is flipped on the short edge), with
// 2 rows × 4 columns of panels a side. Folding: first in half along the long middle, the lower row going
// behind; then the two-layer strip zig-zag into four, the left column on top. Closed, the card shows the
// cover in front and the key on its back; pulled open as a strip it reads cover, January, February, key;
// turned over top to bottom, March to June; opened out fully, the other side holds July to December and
// two panels of reference.

export const POCKET_ROWS = 2;
export const POCKET_COLUMNS = 4;

/** What a panel shows, in reading order. */
export type PanelContent =
  | { kind: 'cover' }
  | { kind: 'key' }
  | { kind: 'month'; month: number } // 1…12
  | { kind: 'levels' } // datums and tide type
  | { kind: 'caution' }; // the caution in full, provenance, publisher

/** The panels of a side as printed (PDF page coordinates), rows top to bottom, columns left to right. */
export type SideGrid = PanelContent[][];

export interface PocketPlan { outside: SideGrid; inside: SideGrid }

const month = (m: number): PanelContent => ({ kind: 'month', month: m });

/**
 * The outside carries the cover (top left, on top when folded), January and February beside it and the
 * key at the right end (the card's back when folded); its lower row, seen when the folded strip is
 * turned over, March to June. The inside carries July to December and the two reference panels.
 */
export function pocketPlan(): PocketPlan {
  return {
    outside: [
      [{ kind: 'cover' }, month(1), month(2), { kind: 'key' }],
      [month(3), month(4), month(5), month(6)],
    ],
    inside: [
      [month(7), month(8), month(9), month(10)],
      [month(11), month(12), { kind: 'levels' }, { kind: 'caution' }],
    ],
  };
}
