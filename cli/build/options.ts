// The choices a build can be given (command line, project file, defaults) and their allowed values.
import type { VolumeChoices } from './volume-options.js';
import type { PublisherPage } from '../../templates/pages/types.js';

export const UNITS = ['m', 'ft'] as const;
export const PAGE_SIZES = ['a5', 'a6', 'a4', 'letter', 'half-letter'] as const;
export const IMPOSITIONS = ['none', 'saddle-stitch'] as const;

export type Units = (typeof UNITS)[number];
export type PageSize = (typeof PAGE_SIZES)[number];
export type Imposition = (typeof IMPOSITIONS)[number];

export { FIRST_YEAR, LAST_YEAR } from '../years.js';
export const MAX_WORKERS = 64;

/** What the renderers are told: the same for the site, the books and the exports. */
export interface RenderChoices {
  units: Units;
  page: PageSize;
  imposition: Imposition;
  pocket?: boolean; // the pocket table beside each book (default on)
  press?: boolean; // books with bleed, crop marks and page boxes for a print shop
  title?: string;
  publisher?: string;
  locale?: string; // BCP 47 tag of a language with a catalogue (templates/locale)
  caution?: string; // the publisher's own caution, replacing the catalogue's
  hourly?: boolean; // books print a page of hourly heights after each month
  stamp?: number; // UTC ms every output carries as its date (cli/build/stamp.ts)
  edition?: string; // YYYY-MM-DD, the edition printed
  contact?: string; // who to call: the imprint page and the site
  accent?: string; // #rrggbb, contrast-checked: the site's accent colour
  logo?: string; // absolute path of a checked SVG, PNG or JPEG file
  coverImage?: string; // absolute path of a checked picture: the book covers and the site's front page
  pages?: PublisherPage[]; // the publisher's own pages, checked (cli/build/pages.ts)
  siteTheme?: string; // the publisher's site/ folder (cli/build/site-theme.ts), laid over the site's templates
}

/** Everything one build needs to know, after the command line, the project file and the defaults. */
export interface BuildPlan {
  stationsDir: string; // absolute
  outDir: string; // absolute, as given (resolved against the working folder)
  year: number; // the first year (the outputs' default stamp)
  years?: number[]; // every year built, in order (--year 2027-2029); absent: [year]
  render: RenderChoices;
  quiet: boolean;
  workers: number | null; // null: one per core, capped by the work there is
  projectFile: string | null; // the tidewright.yaml that was read, if any
  volumes?: VolumeChoices; // how the combined output is bound (default: cli/build/volume-options.ts)
}

export function isOneOf<T extends string>(values: readonly T[], value: string): value is T {
  return (values as readonly string[]).includes(value);
}
