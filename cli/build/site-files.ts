// The publisher's own files for the website (e.g. CNAME for hosting, a robots.txt, a logo), kept in a
// folder beside the station files and copied into out/site/ on every build, since a build replaces
// out/ whole. They are checked before anything is written: plain files and folders only, and none may
// take the place of something the build writes itself.
import { lstatSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { StationFileError } from '../../engine/index.js';

export const SITE_FILES_DIR = 'site-files';

/** Top-level names the website uses whatever the stations are (each station also has its id). */
const SITE_NAMES = ['index.html', 'assets', 'data', 'datums', 'imprint', 'pages'];

/** At most this many files, so a folder linked by mistake to something huge cannot swamp the site. */
export const MAX_SITE_FILES = 1000;

/** A publisher's folder `name` in `stationsDir`, or null if there is none; anything else by that name is refused. */
export function optionalFolder(stationsDir: string, name: string, holds: string): string | null {
  const dir = join(stationsDir, name);
  let stat;
  try {
    stat = lstatSync(dir);
  } catch {
    return null;
  }
  if (!stat.isDirectory()) {
    throw new StationFileError(dir, '(folder)', 'is not a folder', `make ${name} a folder of ${holds}, or remove it`);
  }
  return dir;
}

/** The folder of publisher files in `stationsDir`, or null if there is none; a bad entry is a StationFileError. */
export function siteFilesFolder(stationsDir: string, stationIds: readonly string[]): string | null {
  const dir = optionalFolder(stationsDir, SITE_FILES_DIR, 'the files to copy into the website');
  if (dir === null) return null;
  const taken = new Set([...SITE_NAMES, ...stationIds]);
  let count = 0;
  const walk = (folder: string, top: boolean): void => {
    let names: string[];
    try {
      names = readdirSync(folder).sort();
    } catch (error) {
      throw new StationFileError(folder, '(folder)', `cannot be read (${(error as { code?: string }).code ?? 'error'})`, 'make it readable, or remove it');
    }
    for (const name of names) {
      const path = join(folder, name);
      if (top && taken.has(name)) {
        throw new StationFileError(path, '(file)', `the website has its own ${name}${SITE_NAMES.includes(name) ? '' : ' (a station\'s pages)'}`,
          `rename or remove it: files in ${SITE_FILES_DIR} are added to the site, never put in place of its pages`);
      }
      const entry = lstatSync(path);
      if (entry.isDirectory()) walk(path, false);
      else if (!entry.isFile()) {
        throw new StationFileError(path, '(file)', 'is not a plain file (a link or a device)', `put a copy of the file itself in ${SITE_FILES_DIR}`);
      } else if (++count > MAX_SITE_FILES) {
        throw new StationFileError(dir, '(folder)', `holds more than ${MAX_SITE_FILES} files`, 'keep only the files the site needs in it');
      }
    }
  };
  walk(dir, true);
  return dir;
}
