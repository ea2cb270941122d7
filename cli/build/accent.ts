// A publisher's accent colour: a #rrggbb value, accepted only if white text on it, and it as text on
// the white page, both reach 4.5:1 (WCAG 2.1 contrast ratio, level AA for body text).

/** Relative luminance of an sRGB colour (WCAG 2.1, definition of relative luminance). */
export function relativeLuminance(hex: string): number {
  const channel = (i: number): number => {
    const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * channel(0) + 0.7152 * channel(1) + 0.0722 * channel(2);
}

/** (L1 + 0.05) / (L2 + 0.05), the lighter over the darker (WCAG 2.1). */
export function contrastRatio(a: string, b: string): number {
  const [x, y] = [relativeLuminance(a), relativeLuminance(b)].sort((p, q) => q - p) as [number, number];
  return (x + 0.05) / (y + 0.05);
}

export const MIN_CONTRAST = 4.5;
export const ACCENT_PATTERN = /^#[0-9a-fA-F]{6}$/;
