// Our moon-quarter glyph: a dark disc with the lit part drawn over it, seen as from the station's own
// hemisphere (south of the equator the first quarter is lit on the left). Drawn in a 20 × 20 box
// centred on 0,0; the template adds the ring and the words.
import type { MoonPhaseName } from '../../engine/index.js';

export const MOON_RADIUS = 8;

/** SVG path data of the lit part of the disc; empty for a new moon. */
export function moonLitPath(phase: MoonPhaseName, southern: boolean): string {
  const r = MOON_RADIUS;
  switch (phase) {
    case 'new':
      return '';
    case 'full':
      return `M${-r} 0A${r} ${r} 0 1 1 ${r} 0A${r} ${r} 0 1 1 ${-r} 0Z`;
    case 'first-quarter':
    case 'last-quarter': {
      // Northern observers see the waxing (first-quarter) moon lit on the right.
      const litRight = (phase === 'first-quarter') !== southern;
      return `M0 ${-r}A${r} ${r} 0 0 ${litRight ? 1 : 0} 0 ${r}Z`;
    }
  }
}
