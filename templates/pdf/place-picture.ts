// Every placement of a publisher's picture (logo, cover picture, pictures on their own pages) goes
// through `placePicture`: it reports a picture that would print below 300 dpi at the size it is placed
// (image-resolution.ts), and in press output, which prints in black ink only (press.ts), it places the
// picture in greys: each pixel the grey of its luma, Y′ = 0.2126 R′ + 0.7152 G′ + 0.0722 B′ on the
// sRGB values (ITU-R BT.709-6, item 3.2), written as a DeviceGray image, which a print shop's
// separation sends to the black plate alone, as it does the book's own greys. Transparency is kept.
import { Resvg } from '@resvg/resvg-js';
import { itemAt } from '../../engine/index.js';
import { checkImageResolution, type ImageWarningSink } from './image-resolution.js';
import type { Picture } from './picture.js';

export interface PictureSettings { press?: boolean; warn?: ImageWarningSink }

interface GreyPixels { width: number; height: number; grey: Uint8Array; alpha: Uint8Array | null; coloured: boolean }

/** An image object as pdfkit's `image()` accepts it in place of file bytes (it embeds it on first use). */
interface PlaceableImage { width: number; height: number; label: string; obj: unknown; embed(doc: PDFKit.PDFDocument): void }

const greys = new WeakMap<Picture, GreyPixels>();
const placed = new WeakMap<PDFKit.PDFDocument, Map<Picture, PlaceableImage>>();

/** The picture's pixels as RGBA, straight (not premultiplied): resvg reads PNG and JPEG inside an SVG. */
function decodedPixels(picture: Picture): { rgba: Uint8Array; width: number; height: number } {
  const { width, height } = picture.pixels;
  const mime = picture.data[0] === 0xff ? 'image/jpeg' : 'image/png';
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="${width}" height="${height}">`
    + `<image width="${width}" height="${height}" preserveAspectRatio="none" xlink:href="data:${mime};base64,${picture.data.toString('base64')}"/></svg>`;
  const rendered = new Resvg(svg, { fitTo: { mode: 'original' } }).render();
  const rgba = rendered.pixels;
  // resvg leaves an image it cannot decode (a CMYK JPEG…) out: the page comes back empty
  if (rendered.width !== width || rendered.height !== height || !rgba.some((v, i) => i % 4 === 3 && v !== 0)) {
    throw new Error(`${picture.file}: press output prints pictures in greys, and this picture could not be read for it; `
      + 'save it as an RGB or greyscale PNG or JPEG');
  }
  return { rgba, width, height };
}

/** The grey of each pixel (BT.709 luma) and its coverage; `coloured` if any pixel is not a grey already. */
export function greyPixels(picture: Picture): GreyPixels {
  const known = greys.get(picture);
  if (known) return known;
  const { rgba, width, height } = decodedPixels(picture);
  const n = width * height;
  const grey = new Uint8Array(n);
  const alpha = new Uint8Array(n);
  let opaque = true;
  let coloured = false;
  for (let i = 0; i < n; i++) {
    const a = itemAt(rgba, 4 * i + 3, 'pixel bytes');
    alpha[i] = a;
    if (a === 0) { grey[i] = 255; opaque = false; continue; }
    if (a < 255) opaque = false;
    // resvg hands out premultiplied pixels: divide the coverage back out
    const k = 255 / a;
    const r = itemAt(rgba, 4 * i, 'pixel bytes') * k;
    const g = itemAt(rgba, 4 * i + 1, 'pixel bytes') * k;
    const b = itemAt(rgba, 4 * i + 2, 'pixel bytes') * k;
    if (Math.abs(r - g) > 1.5 || Math.abs(g - b) > 1.5) coloured = true;
    grey[i] = Math.min(255, Math.round(0.2126 * r + 0.7152 * g + 0.0722 * b));
  }
  const result = { width, height, grey, alpha: opaque ? null : alpha, coloured };
  greys.set(picture, result);
  return result;
}

/** The picture as a DeviceGray image object of this document (made once per document). */
function greyImage(doc: PDFKit.PDFDocument, picture: Picture): PlaceableImage {
  let images = placed.get(doc);
  if (!images) { images = new Map(); placed.set(doc, images); }
  const known = images.get(picture);
  if (known) return known;
  const pixels = greyPixels(picture);
  const image: PlaceableImage = {
    width: pixels.width,
    height: pixels.height,
    label: `Grey${images.size + 1}`,
    obj: null,
    embed(target) {
      // without a Filter of their own, pdfkit deflates the streams of a compressed document
      const obj = target.ref({ Type: 'XObject', Subtype: 'Image', Width: pixels.width, Height: pixels.height, BitsPerComponent: 8, ColorSpace: 'DeviceGray' });
      if (pixels.alpha) {
        const mask = target.ref({ Type: 'XObject', Subtype: 'Image', Width: pixels.width, Height: pixels.height, BitsPerComponent: 8, ColorSpace: 'DeviceGray' });
        mask.end(Buffer.from(pixels.alpha));
        (obj.data as Record<string, unknown>).SMask = mask;
      }
      obj.end(Buffer.from(pixels.grey));
      this.obj = obj;
    },
  };
  images.set(picture, image);
  return image;
}

/**
 * Draws a publisher's picture at (x, y), `width` × `height` points. Press output places it in greys and
 * says once (through `warn`) that a coloured picture prints in greys, so that nothing comes back from the
 * print shop looking other than the proof.
 */
export function placePicture(doc: PDFKit.PDFDocument, settings: PictureSettings, picture: Picture,
  x: number, y: number, width: number, height: number): void {
  checkImageResolution(settings.warn, picture, width, height);
  if (settings.press !== true) {
    doc.image(picture.data, x, y, { width, height });
    return;
  }
  const image = greyImage(doc, picture);
  if (greyPixels(picture).coloured) {
    settings.warn?.({ file: picture.file, kind: 'colour',
      text: `${picture.file}: in colour, and press output prints in black ink only, so it prints in greys; check the proof, or supply a greyscale picture to choose its greys yourself` });
  }
  // pdfkit takes an image object (anything with a width and height) in place of file bytes
  doc.image(image as unknown as Buffer, x, y, { width, height });
}
