// One BuildPlan from the command line, the project file and the defaults (in that order of precedence).
import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { firstOf, UsageError } from '../../engine/index.js';
import type { BuildArgs } from './args.js';
import type { BuildPlan } from './options.js';
import { loadProjectFile } from './project.js';
import { outputStamp } from './stamp.js';
import { DEFAULT_VOLUME_PAGES } from './volume-options.js';

export const DEFAULT_STATIONS_DIR = 'stations-demo';
export const DEFAULT_OUT_DIR = 'out';

/** Next calendar year by the real clock: an almanac is built the autumn before the year it covers. */
export function defaultYear(now: Date = new Date()): number {
  return now.getFullYear() + 1;
}

export function makePlan(
  args: BuildArgs, cwd: string = process.cwd(), now: Date = new Date(), env: NodeJS.ProcessEnv = process.env,
): BuildPlan {
  const stationsDir = resolve(cwd, args.stations ?? DEFAULT_STATIONS_DIR);
  if (!existsSync(stationsDir)) {
    throw new UsageError('--stations', `folder ${stationsDir} does not exist`, 'give the folder holding the station .yaml files');
  }
  if (!statSync(stationsDir).isDirectory()) {
    throw new UsageError('--stations', `${stationsDir} is a file, not a folder`, 'give the folder holding the station .yaml files');
  }
  const project = loadProjectFile(stationsDir);
  const s = project.settings;
  const years = args.years ?? s.year ?? [defaultYear(now)];
  const year = firstOf(years, 'years of the build');
  return {
    stationsDir,
    outDir: resolve(cwd, args.out ?? DEFAULT_OUT_DIR),
    year,
    years,
    render: {
      units: args.units ?? s.units ?? 'm',
      page: args.page ?? s.page ?? 'a5',
      imposition: args.imposition ?? s.imposition ?? 'none',
      pocket: s.pocket ?? true,
      ...((args.press || s.press) && { press: true }),
      ...(s.title !== undefined && { title: s.title }),
      ...(s.publisher !== undefined && { publisher: s.publisher }),
      ...((args.locale ?? s.locale) !== undefined && { locale: args.locale ?? s.locale }),
      ...(s.caution !== undefined && { caution: s.caution }),
      ...(s.hourly !== undefined && { hourly: s.hourly }),
      ...(s.edition !== undefined && { edition: s.edition }),
      ...(s.contact !== undefined && { contact: s.contact }),
      ...(s.accent !== undefined && { accent: s.accent.toLowerCase() }),
      ...(s.logo !== undefined && { logo: s.logo }),
      ...(s.cover_image !== undefined && { coverImage: s.cover_image }),
      ...(project.pages.length > 0 && { pages: project.pages }),
      stamp: outputStamp(year, s.edition, env.SOURCE_DATE_EPOCH),
    },
    quiet: args.quiet,
    workers: args.workers ?? null,
    projectFile: project.file,
    volumes: { ...(s.combined !== undefined && { mode: s.combined }), pages: s.volume_pages ?? DEFAULT_VOLUME_PAGES },
  };
}
