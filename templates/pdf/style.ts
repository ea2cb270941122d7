// The book's greys and line weights: everything reads in black-and-white print; no meaning rests on colour.
export const INK = '#000000';
export const DARK = '#333333';
export const MID = '#666666';
export const RULE = '#999999';
export const LIGHT = '#c8c8c8';
export const NIGHT = '#dcdcdc';
export const FAINT = '#efefef';
export const WHITE = '#ffffff';

export const HAIRLINE = 0.3;

// Legible minimums in points, whatever the format's scale: times and heights on month pages, and
// any other text a reader needs (labels, the pocket table's smallest type).
export const READING_MIN = 7.5;
export const LABEL_MIN = 6;
