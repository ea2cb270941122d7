// The saddle-stitch page order, checked by folding: nesting the folded sheets and reading them
// front to back must give pages 1…n exactly once each.
import { describe, expect, it } from 'vitest';
import { saddleStitchOrder } from '../../templates/pdf/imposition.js';

/** Reading order of a stack of sheets folded together: the outer sheet's halves wrap the inner ones. */
function readFolded(plan: ReturnType<typeof saddleStitchOrder>): number[] {
  const firstHalf: number[] = [];
  const secondHalf: number[] = [];
  for (const sheet of plan.sheets) {
    // opening the booklet: right half of the front, then left half of the back (the leaf turns) …
    firstHalf.push(sheet.front.right, sheet.back.left);
    // … and in the second half of the booklet the same sheet is met again, innermost first
    secondHalf.unshift(sheet.back.right, sheet.front.left);
  }
  return [...firstHalf, ...secondHalf];
}

describe('saddleStitchOrder', () => {
  it('puts the last and first page on the front of the outer sheet and the second and last-but-one on its back', () => {
    const plan = saddleStitchOrder(8);
    expect(plan.paddedCount).toBe(8);
    expect(plan.sheets).toEqual([
      { front: { left: 8, right: 1 }, back: { left: 2, right: 7 } },
      { front: { left: 6, right: 3 }, back: { left: 4, right: 5 } },
    ]);
  });

  it('reads 1…n once each when folded, for every page count from 1 to 64', () => {
    for (let n = 1; n <= 64; n++) {
      const plan = saddleStitchOrder(n);
      expect(plan.paddedCount % 4).toBe(0);
      expect(plan.paddedCount - n).toBeLessThan(4);
      expect(plan.sheets.length).toBe(plan.paddedCount / 4);
      expect(readFolded(plan)).toEqual(Array.from({ length: plan.paddedCount }, (_, i) => i + 1));
      // facing halves of a spread always add up to n+1 (a standard property of saddle stitching)
      for (const s of plan.sheets) {
        expect(s.front.left + s.front.right).toBe(plan.paddedCount + 1);
        expect(s.back.left + s.back.right).toBe(plan.paddedCount + 1);
      }
    }
  });

  it('pads with blank positions beyond the last page', () => {
    const plan = saddleStitchOrder(5);
    expect(plan.paddedCount).toBe(8);
    const blanks = plan.sheets.flatMap((s) => [s.front.left, s.front.right, s.back.left, s.back.right]).filter((p) => p > 5);
    expect(blanks.sort()).toEqual([6, 7, 8]);
  });

  it('refuses a page count that is not a positive whole number', () => {
    expect(() => saddleStitchOrder(0)).toThrow(RangeError);
    expect(() => saddleStitchOrder(2.5)).toThrow(RangeError);
  });
});
