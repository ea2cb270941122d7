// Saddle-stitch imposition: the order in which book pages go two-up onto sheets that are printed on
// both sides, stacked, folded once down the middle and stapled through the fold.

/** One side of a sheet: the page on the left half and the page on the right half (1-based page
 *  numbers; a number above the book's page count is a blank filler page). */
export interface SheetSide { left: number; right: number }
export interface ImposedSheet { front: SheetSide; back: SheetSide }

export interface SaddleStitchPlan {
  pageCount: number; // pages of the book as laid out
  paddedCount: number; // a multiple of four: each sheet carries four pages
  sheets: ImposedSheet[]; // outermost sheet first, in stacking order
}

/**
 * Sheet k (0-based, outermost first) of an n-page booklet carries pages n−2k and 2k+1 on its front
 * and 2k+2 and n−2k−1 on its back; printed double-sided flipping on the short edge, folded sheets
 * nested in order read 1, 2, …, n.
 */
export function saddleStitchOrder(pageCount: number): SaddleStitchPlan {
  if (!Number.isInteger(pageCount) || pageCount < 1) {
    throw new RangeError(`a booklet needs a whole number of pages ≥ 1, got ${pageCount}`);
  }
  const n = Math.ceil(pageCount / 4) * 4;
  const sheets: ImposedSheet[] = [];
  for (let k = 0; k < n / 4; k++) {
    sheets.push({
      front: { left: n - 2 * k, right: 2 * k + 1 },
      back: { left: 2 * k + 2, right: n - 2 * k - 1 },
    });
  }
  return { pageCount, paddedCount: n, sheets };
}
