// A publisher's picture (logo, cover photo, an image on one of their pages) made ready for pdfkit:
// PNG and JPEG as they are; SVG drawn to a PNG by resvg (the Rust SVG renderer, through @resvg/resvg-js)
// at 600 pixels per inch of the largest size it may print at, so it stays sharp. resvg runs no
// scripts and fetches nothing; text in an SVG is set in the book's own DejaVu faces.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { Resvg } from '@resvg/resvg-js';
import type { PixelSize } from './image-resolution.js';

/** Pixels per inch an SVG is drawn at: twice the 300 a print shop asks of a photo. */
const SVG_DPI = 600;
/** No SVG is drawn wider than this, whatever its box (an A4 page at 600 dpi is about 4,900). */
const MAX_SVG_PIXELS = 5000;

export interface Picture {
  file: string; // where it came from, for messages
  data: Buffer; // PNG or JPEG bytes pdfkit can place
  pixels: PixelSize;
  vector: boolean; // drawn from an SVG: sharp at any size it was drawn for
}

function fontFiles(): string[] {
  const dir = join(dirname(createRequire(import.meta.url).resolve('dejavu-fonts-ttf/package.json')), 'ttf');
  return ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf', 'DejaVuSans-Oblique.ttf'].map((name) => join(dir, name));
}

/** The size a PNG (IHDR) or JPEG (first SOF marker) says it has; null if neither can be read. */
export function rasterPixels(bytes: Uint8Array): PixelSize | null {
  const view = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (view.length >= 24 && view.readUInt32BE(0) === 0x89504e47) return { width: view.readUInt32BE(16), height: view.readUInt32BE(20) };
  if (view[0] !== 0xff || view[1] !== 0xd8) return null;
  let at = 2;
  while (at + 9 < view.length) {
    if (view.readUInt8(at) !== 0xff) return null;
    const marker = view.readUInt8(at + 1);
    const length = view.readUInt16BE(at + 2);
    // SOF0…SOF15 except DHT (C4), JPG (C8) and DAC (CC)
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      return { width: view.readUInt16BE(at + 7), height: view.readUInt16BE(at + 5) };
    }
    at += 2 + length;
  }
  return null;
}

/** An SVG drawn to a PNG `widthPt` points wide at 600 dpi. */
export function drawSvg(svg: Uint8Array | string, widthPt: number, file = 'SVG'): Picture {
  const width = Math.min(MAX_SVG_PIXELS, Math.max(16, Math.ceil((widthPt / 72) * SVG_DPI)));
  const rendered = new Resvg(typeof svg === 'string' ? svg : Buffer.from(svg), {
    fitTo: { mode: 'width', value: width },
    font: { loadSystemFonts: false, fontFiles: fontFiles(), defaultFontFamily: 'DejaVu Sans' },
  }).render();
  return { file, data: Buffer.from(rendered.asPng()), pixels: { width: rendered.width, height: rendered.height }, vector: true };
}

/** A picture file ready to place, an SVG drawn for at most `widthPt` points of width. */
export function loadPicture(path: string, widthPt: number): Picture {
  const bytes = readFileSync(path);
  if (/\.svg$/i.test(path)) return drawSvg(bytes, widthPt, path);
  const pixels = rasterPixels(bytes);
  if (pixels === null) throw new Error(`${path} is neither a PNG nor a JPEG file`);
  return { file: path, data: bytes, pixels, vector: false };
}

/** Width × height of a picture fitted inside `w` × `h` points, keeping its proportions. */
export function fitted(pixels: PixelSize, w: number, h: number): { width: number; height: number } {
  const k = Math.min(w / pixels.width, h / pixels.height);
  return { width: pixels.width * k, height: pixels.height * k };
}
