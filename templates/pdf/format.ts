// Text safety for the book: every number, date and unit goes through templates/locale (the one formatter).

/** Removes control characters so a station file cannot inject line breaks or invisible codes. */
export function printable(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, ' ');
}
