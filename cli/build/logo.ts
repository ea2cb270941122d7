// Pictures a publisher names (logo:, cover_image: in tidewright.yaml, images on their own pages): an SVG,
// PNG or JPEG file (path relative to the file that names it), checked here so a build never starts with
// a picture it cannot use. The books and the site show all three kinds.

import { readFileSync, statSync } from 'node:fs';
import { extname, resolve } from 'node:path';
import { StationFileError } from '../../engine/index.js';

export const MAX_LOGO_BYTES = 2 * 1024 * 1024;
/** A cover photo or a full-page sponsor's image may be larger than a logo. */
export const MAX_PICTURE_BYTES = 16 * 1024 * 1024;
const FIX = 'write the path of an SVG, PNG or JPEG file, relative to tidewright.yaml, e.g. logo: brand/logo.svg';

export type LogoKind = 'svg' | 'png' | 'jpeg';

/** The absolute path and kind of a usable logo; a StationFileError naming tidewright.yaml otherwise. */
export function checkLogo(projectFile: string, written: string): { path: string; kind: LogoKind } {
  return checkPicture(projectFile, 'logo', written, FIX, MAX_LOGO_BYTES, 'a logo prints a few centimetres wide');
}

/** The absolute path and kind of a usable picture named in `file` under `field`; a StationFileError otherwise. */
export function checkPicture(projectFile: string, field: string, written: string, fix: string, maxBytes = MAX_PICTURE_BYTES,
  why = 'a full page prints at most about 3,500 pixels wide at 300 dpi'): { path: string; kind: LogoKind } {
  const path = resolve(projectFile, '..', written);
  let size: number;
  try {
    const stat = statSync(path);
    if (!stat.isFile()) throw new StationFileError(projectFile, field, `${written} is a folder, not a file`, fix);
    size = stat.size;
  } catch (error) {
    if (error instanceof StationFileError) throw error;
    throw new StationFileError(projectFile, field, `${written} does not exist (looked for ${path})`, fix);
  }
  if (size > maxBytes) {
    throw new StationFileError(projectFile, field, `${written} is ${(size / 1048576).toFixed(1)} MB, over ${maxBytes / 1048576} MB`, `use a smaller file; ${why}`);
  }
  const bytes = readFileSync(path);
  const ext = extname(path).toLowerCase();
  const isPng = bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  const isJpeg = bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff;
  if (ext === '.png' && isPng) return { path, kind: 'png' };
  if ((ext === '.jpg' || ext === '.jpeg') && isJpeg) return { path, kind: 'jpeg' };
  if (ext === '.svg') {
    const text = bytes.toString('utf8');
    if (!/<svg[\s>]/i.test(text)) throw new StationFileError(projectFile, field, `${written} holds no <svg> element`, fix);
    if (/<script|\son[a-z]+\s*=|javascript:|<foreignObject/i.test(text)) {
      throw new StationFileError(projectFile, field, `${written} contains a script, an event handler or foreign content`,
        `save the ${field === 'logo' ? 'logo' : 'picture'} as a plain drawing (no scripts), or as PNG`);
    }
    return { path, kind: 'svg' };
  }
  const problem = ['.png', '.jpg', '.jpeg'].includes(ext)
    ? `${written} is not a ${ext === '.png' ? 'PNG' : 'JPEG'} file inside, despite its name`
    : `${written} is not an SVG, PNG or JPEG file`;
  throw new StationFileError(projectFile, field, problem, fix);
}
