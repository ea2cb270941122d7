// The part of fontkit (pdfkit's font reader) this project calls directly: a font's character map.
declare module 'fontkit' {
  export interface Font {
    hasGlyphForCodePoint(codePoint: number): boolean;
  }
  export function create(buffer: Buffer | Uint8Array): Font;
}
