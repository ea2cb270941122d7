// The 300 dpi check for every PNG or JPEG a publisher supplies, at the size the books print it: the
// logo in its box on the covers, the cover picture across the type area, a picture in a page's text
// (its size at 96 pixels to the inch, never wider than the type area), a whole-page picture and the
// halves and quarters of a grid. An SVG is drawn at 600 dpi of its printed size, so it never warns.
import { readFileSync } from 'node:fs';
import { LOGO_BOX } from '../../templates/pdf/cover.js';
import { contentBox, pageGeometry } from '../../templates/pdf/geometry.js';
import { resolutionWarning } from '../../templates/pdf/image-resolution.js';
import { fitted, rasterPixels } from '../../templates/pdf/picture.js';
import type { RenderChoices } from './options.js';

/** One line per supplied raster picture that would print below 300 dpi in the books. */
export function pictureWarnings(render: RenderChoices): string[] {
  const g = pageGeometry(render.page);
  const box = contentBox(g, 1);
  const gap = 8 * g.scale;
  const warnings: string[] = [];
  const seen = new Set<string>();
  const check = (path: string, size: (pixels: { width: number; height: number }) => { width: number; height: number }): void => {
    if (/\.svg$/i.test(path)) return;
    const pixels = rasterPixels(readFileSync(path));
    if (pixels === null) return;
    const printed = size(pixels);
    const warning = resolutionWarning(path, pixels, printed.width, printed.height);
    if (warning !== null && !seen.has(warning)) { seen.add(warning); warnings.push(warning); }
  };
  if (render.logo !== undefined) check(render.logo, (p) => fitted(p, LOGO_BOX.width * g.scale, LOGO_BOX.height * g.scale));
  if (render.coverImage !== undefined) check(render.coverImage, (p) => fitted(p, box.width, box.width * (p.height / p.width)));
  for (const page of render.pages ?? []) {
    if (page.in === 'site') continue;
    for (const path of Object.values(page.images)) {
      check(path, (p) => fitted(p, Math.min(box.width, p.width * 0.75), box.height * 0.7));
    }
    if (page.image) check(page.image.path, (p) => fitted(p, box.width, box.height));
    for (const cell of page.grid ?? []) {
      const w = cell.size === 'half' ? box.width : (box.width - gap) / 2;
      check(cell.path, (p) => fitted(p, w, (box.height - gap) / 2));
    }
  }
  return warnings;
}
