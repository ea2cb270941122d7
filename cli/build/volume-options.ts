// How the combined output is bound: one book while the set fits in one volume, else volumes of at most
// `volume_pages` pages, grouped by region (else by reference port), with an index volume.

export const COMBINED_MODES = ['full', 'compact', 'none'] as const;
export type CombinedMode = (typeof COMBINED_MODES)[number];

export const DEFAULT_VOLUME_PAGES = 600;
export const MIN_VOLUME_PAGES = 50; // a reference port's year with its front matter fits
export const MAX_VOLUME_PAGES = 5000;

/** The choices of tidewright.yaml for the combined output; `mode` undefined: full while it fits one volume, else compact. */
export interface VolumeChoices {
  mode?: CombinedMode;
  pages: number;
}
