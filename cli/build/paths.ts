// File names made from station ids. The loader already allows only [a-z0-9-]+; this is asserted
// again here, right before any path is joined, so no name can leave the output folder.
import { isAbsolute, join, relative, sep } from 'node:path';

const SAFE_NAME = /^[a-z0-9-]+$/;

export function assertSafeId(id: string): string {
  if (typeof id !== 'string' || !SAFE_NAME.test(id) || id.length > 64) {
    throw new Error(`refusing to write a file for station id ${JSON.stringify(id)}: ids may hold only a-z, 0-9 and "-"`);
  }
  return id;
}

/** `<dir>/<id>-<year>.<ext>`, with the id checked and the result proved to stay inside `dir`. */
export function stationYearFile(dir: string, id: string, year: number, ext: string): string {
  if (!Number.isInteger(year) || !/^[a-z]+$/.test(ext)) throw new Error(`bad file name parts: ${year}, ${ext}`);
  const path = join(dir, `${assertSafeId(id)}-${year}.${ext}`);
  const rel = relative(dir, path);
  if (rel === '' || rel.startsWith(`..${sep}`) || rel === '..' || isAbsolute(rel) || rel.includes(sep)) {
    throw new Error(`refusing to write ${path}: outside ${dir}`);
  }
  return path;
}

/** A name for the combined book from the project title: "Brinewold Bay Almanac" → "brinewold-bay-almanac". */
export function slugOf(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 48)
    .replace(/-+$/, '');
}

/** The combined book's base name: the title's slug or "almanac", never the same as a station's book. */
export function combinedBookName(title: string | undefined, stationIds: readonly string[]): string {
  let name = (title && slugOf(title)) || 'almanac';
  const taken = new Set(stationIds);
  while (taken.has(name)) name = `${name}-all`;
  return assertSafeId(name);
}
