// Which characters of a station's text the book's typeface cannot draw (they print as U+FFFD, see
// script.ts), so check and build can say so once per field instead of a book showing a mark unexplained.
import { fontFaces } from './fonts.js';
import { missingCharacters } from './script.js';

/** The characters of `text` the book's regular face lacks, each once. */
export function missingInBook(text: string): string[] {
  return missingCharacters(text, fontFaces().regular);
}

/** "🌊 (U+1F30A)". */
export function describeCharacter(c: string): string {
  return `${c} (U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')})`;
}

// Fields that name the station or say what it is measured against: printed, never looked up.
const NOT_PRINTED = new Set(['id', 'kind', 'timezone', 'reference', 'sourceFile']);

/** One note per text field of the station holding characters the book cannot draw. */
export function coverageNotes(station: object, file: string): string[] {
  const notes: string[] = [];
  const walk = (value: unknown, path: string[]): void => {
    if (typeof value === 'string') {
      if (path.length === 1 && NOT_PRINTED.has(path.join('.'))) return;
      const missing = missingInBook(value);
      if (missing.length === 0) return;
      const shown = missing.slice(0, 3).map(describeCharacter).join(', ') + (missing.length > 3 ? ', …' : '');
      notes.push(`${file}: ${path.join('.')}: note: ${shown} ${missing.length === 1 ? 'is' : 'are'} not in the book's typeface; the PDF prints \uFFFD in ${missing.length === 1 ? 'its place' : 'their places'}`);
    } else if (value && typeof value === 'object') {
      for (const [key, inner] of Object.entries(value)) walk(inner, [...path, key]);
    }
  };
  walk(station, []);
  return notes;
}
