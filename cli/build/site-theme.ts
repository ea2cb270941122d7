// The publisher's `site/` folder beside the stations: files that take the place of tidewright's own site
// templates and stylesheet by the same path (site/_includes/layouts/base.njk, site/assets/site.css…) or
// add new ones (a partial, a picture). Layered over the built-in templates for each build (Eleventy's
// input is the merged folder). Checked before anything is written: templates, CSS and pictures only,
// never code (no _data/ files, no JavaScript), plain files, at most MAX_THEME_FILES.
import { optionalFolder } from './site-files.js';
import { lstatSync, readdirSync } from 'node:fs';
import { extname, join, relative, sep } from 'node:path';
import { StationFileError } from '../../engine/index.js';

export const SITE_THEME_DIR = 'site';
export const MAX_THEME_FILES = 200;
const KINDS = ['.njk', '.css', '.svg', '.png', '.jpg', '.jpeg', '.webp', '.ico', '.woff', '.woff2'];

/** The `site/` folder in `stationsDir`, or null if there is none; a bad entry is a StationFileError. */
export function siteThemeFolder(stationsDir: string): string | null {
  const dir = optionalFolder(stationsDir, SITE_THEME_DIR, 'site templates and CSS that replace the built-in ones');
  if (dir === null) return null;
  let count = 0;
  const walk = (folder: string): void => {
    for (const name of readdirSync(folder).sort()) {
      const path = join(folder, name);
      const rel = relative(dir, path).split(sep).join('/');
      const entry = lstatSync(path);
      if (rel === '_data') {
        throw new StationFileError(path, '(folder)', 'would give the site code to run', `remove it: ${SITE_THEME_DIR}/ holds templates (.njk), CSS and pictures; the site's data come from the build`);
      }
      if (entry.isDirectory()) { walk(path); continue; }
      if (!entry.isFile()) throw new StationFileError(path, '(file)', 'is not a plain file (a link or a device)', `put a copy of the file itself in ${SITE_THEME_DIR}/`);
      if (!KINDS.includes(extname(name).toLowerCase())) {
        throw new StationFileError(path, '(file)', `is not a kind of file ${SITE_THEME_DIR}/ takes`,
          `keep only templates and styles (${KINDS.join(', ')}) in it; files to publish as they are go in site-files/`);
      }
      if (++count > MAX_THEME_FILES) throw new StationFileError(dir, '(folder)', `holds more than ${MAX_THEME_FILES} files`, 'keep only the files you change in it');
    }
  };
  walk(dir);
  return dir;
}
