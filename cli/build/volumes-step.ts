// The combined-output step of a build: plan the volumes from what the station jobs reported, and
// draw them (cli/build/volumes.ts) when the set takes more than one, or is bound compact.
import { join } from 'node:path';
import type { Station } from '../../engine/index.js';
import type { ImageWarningSink } from '../../templates/pdf/image-resolution.js';
import { compiledWorkerUrl } from './compute.js';
import type { BuildPlan } from './options.js';
import { combinedBookName } from './paths.js';
import type { StationCache, StationOutcome } from './station-job.js';
import { DEFAULT_VOLUME_PAGES } from './volume-options.js';
import type { PlanStation, VolumePlan } from './volume-plan.js';
import { bindVolumes, planCombined } from './volumes.js';

export interface CombinedPlan {
  plan: VolumePlan;
  volumes: boolean; // drawn as volumes by bindVolumes (else the one combined book as before)
  draw(warn?: ImageWarningSink): Promise<number>; // the pages drawn; `warn` hears of blurry (or, for the press, coloured) pictures
}

export async function combinedStations(stations: readonly Station[], outcomes: ReadonlyMap<string, StationOutcome>, build: BuildPlan,
  cache: StationCache, tempDir: string, workers: number, signal?: AbortSignal): Promise<CombinedPlan> {
  const choices = build.volumes ?? { pages: DEFAULT_VOLUME_PAGES };
  const planStations: PlanStation[] = [];
  for (const s of stations) {
    const outcome = outcomes.get(s.id);
    // Station jobs that report no section lengths (a test's own): the one combined book.
    if (!outcome?.sections) return { plan: { mode: choices.mode === 'none' ? 'none' : 'full', volumes: [] }, volumes: false, draw: async () => 0 };
    planStations.push({
      id: s.id, name: outcome.summary.station.name, kind: s.kind, ...(s.kind === 'secondary' && { reference: s.reference }),
      ...(s.region !== undefined && { region: s.region }), invented: outcome.summary.invented, sections: outcome.sections,
    });
  }
  const plan = await planCombined(planStations, choices, build.render);
  const volumes = plan.volumes.length > 1 || (plan.mode === 'compact' && plan.volumes.length === 1);
  const name = combinedBookName(build.render.title, stations.map((s) => s.id));
  return {
    plan, volumes,
    draw: async (warn) => (await bindVolumes(plan, {
      stations: planStations, choices, render: build.render, year: build.year, name, pdfDir: join(tempDir, 'pdf'),
      cache, workers, workerUrl: compiledWorkerUrl(), ...(signal && { signal }), ...(warn && { warn }),
    })).pages,
  };
}
