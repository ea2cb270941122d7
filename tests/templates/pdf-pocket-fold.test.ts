// The pocket table's panel order, checked by folding a simulated sheet: each panel is a piece of paper
// with a face on each side; folds reflect pieces across the fold line, flip them over and restack them.
// What the reader meets must read cover, January, February, key (the card's back), then March to June
// when the strip is turned over, then July to December and the reference panels inside.
import { describe, expect, it } from 'vitest';
import { itemAt } from '../../engine/index.js';
import type { PanelContent } from '../../templates/pdf/pocket/fold.js';
import { POCKET_COLUMNS, POCKET_ROWS, pocketPlan } from '../../templates/pdf/pocket/fold.js';

interface Piece {
  front: string; // face printed on the outside (PDF page 1)
  back: string; // face printed on the inside (PDF page 2)
  x: number; // column position, 0 = left as seen from the front
  y: number; // row position, 0 = top
  z: number; // depth, larger is nearer the viewer in front
  flipped: boolean; // the back face is the one facing the viewer
  mirrorX: boolean; // turned about a vertical axis an odd number of times
  mirrorY: boolean; // turned about a horizontal axis an odd number of times
}

const label = (p: PanelContent) => (p.kind === 'month' ? `month-${p.month}` : p.kind);

/** The flat sheet: the inside is printed flipped on the short edge, so PDF column c lies behind column 3 − c. */
function sheet(): Piece[] {
  const plan = pocketPlan();
  const pieces: Piece[] = [];
  for (const [r, outsideRow] of plan.outside.entries()) {
    const insideRow = itemAt(plan.inside, r, 'inside rows');
    for (const [c, front] of outsideRow.entries()) {
      pieces.push({ front: label(front), back: label(itemAt(insideRow, POCKET_COLUMNS - 1 - c, 'inside panels')),
        x: c, y: r, z: 0, flipped: false, mirrorX: false, mirrorY: false });
    }
  }
  return pieces;
}

/** Folds the pieces beyond a line (after `at` along the axis) behind (mountain) or in front (valley). */
function fold(pieces: Piece[], axis: 'x' | 'y', at: number, how: 'mountain' | 'valley'): void {
  const moving = pieces.filter((p) => p[axis] > at);
  const still = pieces.filter((p) => p[axis] <= at);
  const zs = still.map((p) => p.z);
  const mz = moving.map((p) => p.z);
  const [minMoving, maxMoving] = [Math.min(...mz), Math.max(...mz)];
  for (const p of moving) {
    p[axis] = 2 * at + 1 - p[axis];
    // turning over about the line reverses the moving layers' order
    p.z = how === 'mountain' ? Math.min(...zs) - 1 - (p.z - minMoving) : Math.max(...zs) + 1 + (maxMoving - p.z);
    p.flipped = !p.flipped;
    if (axis === 'x') p.mirrorX = !p.mirrorX; else p.mirrorY = !p.mirrorY;
  }
}

/** The face seen from the front on top of a stack, and whether it reads upright. */
function topFace(stack: Piece[]): { face: string; upright: boolean } {
  const p = stack.reduce((a, b) => (b.z > a.z ? b : a));
  // a back face was printed mirrored left-right relative to the front, which one more turn undoes
  return { face: p.flipped ? p.back : p.front, upright: p.mirrorY === false && p.mirrorX === p.flipped };
}

/** Turned over like a book page (about a vertical axis): the bottom face comes up, mirrored left-right. */
function turnOverLikePage(pieces: Piece[]): void {
  const maxX = Math.max(...pieces.map((p) => p.x));
  for (const p of pieces) { p.x = maxX - p.x; p.z = -p.z; p.flipped = !p.flipped; p.mirrorX = !p.mirrorX; }
}

/** Turned over top to bottom (about a horizontal axis). */
function turnOverTopToBottom(pieces: Piece[]): void {
  const maxY = Math.max(...pieces.map((p) => p.y));
  for (const p of pieces) { p.y = maxY - p.y; p.z = -p.z; p.flipped = !p.flipped; p.mirrorY = !p.mirrorY; }
}

/** The faces seen from the front, left to right then top to bottom, of a sheet or strip lying flat. */
function facesInView(pieces: Piece[]): { face: string; upright: boolean }[] {
  const cells = new Map<string, Piece[]>();
  for (const p of pieces) cells.set(`${p.y},${p.x}`, [...(cells.get(`${p.y},${p.x}`) ?? []), p]);
  return [...cells.entries()].sort(([a], [b]) => {
    const [ay = 0, ax = 0] = a.split(',').map(Number);
    const [by = 0, bx = 0] = b.split(',').map(Number);
    return ay - by || ax - bx;
  }).map(([, stack]) => topFace(stack));
}

const folded = () => {
  const pieces = sheet();
  fold(pieces, 'y', 0, 'mountain'); // the lower row goes behind
  const strip = pieces.map((p) => ({ ...p }));
  // then zig-zag from the right end: column 3 behind 2, that pair in front of 1, all of it behind 0
  fold(pieces, 'x', 2, 'mountain');
  fold(pieces, 'x', 1, 'valley');
  fold(pieces, 'x', 0, 'mountain');
  return { pieces, strip };
};

describe('pocket table fold', () => {
  it('folds to one panel-sized stack with every panel in it once', () => {
    const { pieces } = folded();
    expect(new Set(pieces.map((p) => `${p.x},${p.y}`))).toEqual(new Set(['0,0']));
    expect(new Set(pieces.map((p) => p.z)).size).toBe(POCKET_ROWS * POCKET_COLUMNS);
    const faces = pieces.flatMap((p) => [p.front, p.back]).sort();
    expect(faces).toEqual([...new Set(faces)]);
    expect(faces.filter((f) => f.startsWith('month-')).length).toBe(12);
  });

  it('shows the cover on top and the key on the back, both upright', () => {
    const { pieces } = folded();
    expect(topFace(pieces)).toEqual({ face: 'cover', upright: true });
    turnOverLikePage(pieces);
    expect(topFace(pieces)).toEqual({ face: 'key', upright: true });
  });

  it('reads on in order as the strip is pulled open, turned over and opened out', () => {
    const { strip } = folded();
    const seen = facesInView(strip);
    turnOverTopToBottom(strip);
    seen.push(...facesInView(strip));
    const sheetOpen = sheet();
    turnOverLikePage(sheetOpen);
    seen.push(...facesInView(sheetOpen));
    expect(seen.every((s) => s.upright)).toBe(true);
    expect(seen.map((s) => s.face)).toEqual([
      'cover', 'month-1', 'month-2', 'key',
      'month-3', 'month-4', 'month-5', 'month-6',
      'month-7', 'month-8', 'month-9', 'month-10', 'month-11', 'month-12', 'levels', 'caution',
    ]);
  });
});
