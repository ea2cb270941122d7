// Text of any script on the page: lines holding right-to-left words (Hebrew, Arabic…) are put in visual
// order by the Unicode bidirectional algorithm (UAX #9, through bidi-js), and a character the book's
// typeface lacks is drawn as U+FFFD, a visible replacement, instead of an empty box or nothing.
// The shaper inside pdfkit (fontkit) lays a piece of right-to-left script out right to left itself;
// so each piece is handed over in the order the shaper expects, and the pieces are placed by us.
import bidiModule, { type Bidi } from 'bidi-js';
import { itemAt } from '../../engine/index.js';

// The package's main export is its factory (CommonJS); its type file calls the same thing `default`.
const bidi: Bidi = (bidiModule as unknown as () => Bidi)();

/** The replacement drawn for a character the typeface lacks. */
export const REPLACEMENT = '\uFFFD';

// Scripts the shaper lays out right to left by itself.
const SHAPER_RTL = /[\p{Script=Hebrew}\p{Script=Arabic}\p{Script=Syriac}\p{Script=Thaana}\p{Script=Nko}\p{Script=Samaritan}\p{Script=Mandaic}\p{Script=Adlam}]/u;
// Any character that may be drawn right to left (strong right-to-left letters and marks).
const MAYBE_RTL = /[\u0590-\u08ff\ufb1d-\ufdff\ufe70-\ufeff\u{10800}-\u{10fff}\u{1e800}-\u{1efff}\u200f\u202b\u202e\u2067]/u;

export interface Piece {
  text: string; // in the order to hand to the shaper
  space: boolean; // white space: only its width counts
}

/** True when the line needs the bidirectional algorithm (most lines do not, and skip it). */
export function needsBidi(text: string): boolean {
  return MAYBE_RTL.test(text);
}

/**
 * The line as pieces from left to right. Each piece is one direction and holds no white space; a
 * right-to-left piece the shaper will reverse is handed over in logical order, any other in visual order.
 */
export function visualPieces(text: string): Piece[] {
  if (!needsBidi(text)) return splitSpaces(text);
  const levels = bidi.getEmbeddingLevels(text);
  const mirrored = bidi.getMirroredCharactersMap(text, levels.levels);
  const units = [...text].map((c, i, all) => ({ c, at: all.slice(0, i).join('').length }));
  const chars = units.map(({ c, at }) => ({ c: mirrored.get(at) ?? c, level: levels.levels[at] ?? 0 })); // bidi-js gives a level per code unit
  // Visual order: reverse the runs bidi-js names, over code points (a surrogate pair stays whole).
  const indexOfUnit = new Map(units.map((u, i) => [u.at, i]));
  const order = chars.map((_, i) => i);
  for (const [start = 0, end = -1] of bidi.getReorderSegments(text, levels)) {
    const from = indexOfUnit.get(start) ?? 0;
    let to = from;
    while ((units[to + 1]?.at ?? Infinity) <= end) to++;
    order.splice(from, to - from + 1, ...order.slice(from, to + 1).reverse());
  }
  const pieces: Piece[] = [];
  let run: { chars: string[]; rtl: boolean; space: boolean } | null = null;
  const flush = (): void => {
    if (!run) return;
    const visual = run.chars.join('');
    // The shaper reverses a right-to-left piece of its scripts: hand that one over in logical order.
    const text = run.rtl && SHAPER_RTL.test(visual) ? [...visual].reverse().join('') : visual;
    pieces.push({ text, space: run.space });
    run = null;
  };
  for (const i of order) {
    const { c, level } = itemAt(chars, i, 'characters in visual order');
    const space = /\s/u.test(c);
    const rtl = level % 2 === 1;
    if (!run || run.space !== space || run.rtl !== rtl) {
      flush();
      run = { chars: [], rtl, space };
    }
    run.chars.push(c);
  }
  flush();
  return pieces;
}

function splitSpaces(text: string): Piece[] {
  return text.split(/(\s+)/u).filter((t) => t !== '').map((t) => ({ text: t, space: /^\s/u.test(t) }));
}

/** Interface to the typeface's character map, as far as this module needs it. */
export interface GlyphCoverage {
  hasGlyphForCodePoint(codePoint: number): boolean;
}

/** The text with every character the typeface lacks replaced by U+FFFD; white space and controls kept. */
export function withReplacements(text: string, font: GlyphCoverage | null): string {
  if (!font) return text;
  let out = '';
  for (const c of text) {
    const cp = c.codePointAt(0)!;
    const invisible = /[\s\p{Cf}\p{Mn}\p{Me}]/u.test(c); // spaces, joiners and combining marks never get a box
    out += invisible || font.hasGlyphForCodePoint(cp) ? c : REPLACEMENT;
  }
  return out;
}

/** The characters of `text` the typeface lacks, each once, in order of appearance. */
export function missingCharacters(text: string, font: GlyphCoverage): string[] {
  const seen = new Set<string>();
  for (const c of text) {
    if (/[\s\p{Cf}\p{Mn}\p{Me}\p{Cc}]/u.test(c) || font.hasGlyphForCodePoint(c.codePointAt(0)!)) continue;
    seen.add(c);
  }
  return [...seen];
}
