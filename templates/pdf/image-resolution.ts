// Images a publisher supplies (a logo, a sponsor's page) must print sharp: 300 pixels per inch or more
// at the size they are printed. This says, in one line naming the file, when one would print blurry.
const PRINT_DPI = 300;

export interface PixelSize { width: number; height: number }

/** Pixels per inch of an image of `pixels` printed at `widthPt` × `heightPt` points. */
export function printedDpi(pixels: PixelSize, widthPt: number, heightPt: number): number {
  return Math.min(pixels.width / (widthPt / 72), pixels.height / (heightPt / 72));
}

/** A warning if the image would print below 300 dpi at that size, else null. */
export function resolutionWarning(file: string, pixels: PixelSize, widthPt: number, heightPt: number): string | null {
  const dpi = printedDpi(pixels, widthPt, heightPt);
  if (dpi >= PRINT_DPI) return null;
  const mm = (pt: number) => Math.round((pt / 72) * 25.4);
  const need = { w: Math.ceil((widthPt / 72) * PRINT_DPI), h: Math.ceil((heightPt / 72) * PRINT_DPI) };
  return `${file}: ${Math.floor(dpi)} dpi at its printed size of ${mm(widthPt)} \u00d7 ${mm(heightPt)} mm would print blurry; `
    + `supply it at ${need.w} \u00d7 ${need.h} pixels or more (300 dpi)`;
}

/**
 * A note about a publisher's picture, one line to print: it would print below 300 dpi where it is placed
 * (`dpi` there), or, in press output, it is in colour and prints in greys (place-picture.ts).
 */
export interface ImageWarning { file: string; kind?: 'resolution' | 'colour'; dpi?: number; text: string }

/** Where a book's image warnings go (BookSettings.warn); the build prints one line per file. */
export type ImageWarningSink = (warning: ImageWarning) => void;

/**
 * The one check every placement of a publisher's picture calls, with the size it is printed at: a
 * raster image below 300 dpi there is reported to `warn`. Pictures drawn from SVG are sharp at any
 * size they were drawn for, so they never warn.
 */
export function checkImageResolution(warn: ImageWarningSink | undefined,
  picture: { file: string; pixels: PixelSize; vector: boolean }, widthPt: number, heightPt: number): void {
  if (warn === undefined || picture.vector) return;
  const text = resolutionWarning(picture.file, picture.pixels, widthPt, heightPt);
  if (text !== null) warn({ file: picture.file, kind: 'resolution', dpi: Math.floor(printedDpi(picture.pixels, widthPt, heightPt)), text });
}

/**
 * Of several warnings, one of each kind per file (of the resolution ones, where it prints least sharp),
 * each file's lines together, files in the order first heard of.
 */
export function worstPerFile(warnings: Iterable<ImageWarning>): ImageWarning[] {
  const byFile = new Map<string, Map<string, ImageWarning>>();
  for (const w of warnings) {
    const kinds = byFile.get(w.file) ?? new Map<string, ImageWarning>();
    byFile.set(w.file, kinds);
    const kind = w.kind ?? 'resolution';
    const seen = kinds.get(kind);
    if (seen === undefined || (w.dpi ?? Infinity) < (seen.dpi ?? Infinity)) kinds.set(kind, w);
  }
  return [...byFile.values()].flatMap((kinds) => ['resolution', 'colour'].flatMap((k) => kinds.get(k) ?? []));
}

/** The pixel size of a JPEG or PNG as pdfkit reads it. */
export function imagePixels(doc: PDFKit.PDFDocument, bytes: Uint8Array): PixelSize {
  const image = (doc as unknown as { openImage(src: Uint8Array): PixelSize }).openImage(bytes);
  return { width: image.width, height: image.height };
}
