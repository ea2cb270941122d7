// The station-year pages (the year page, its month pages and their hours pages) drawn with Nunjucks
// directly, every template compiled once for the whole build. Through Eleventy 3 each paginated page
// compiled its template anew, and each run its layouts and partials (a third of the website's time).
// A page template is read as Eleventy reads it: its front matter's `pagination.alias` names the page's
// own data and its `permalink` the file written; the page sees `site`, `page.url` and that alias.
// The templates keep their front matter, so Eleventy on its own (npx @11ty/eleventy) still draws them.
import { readFileSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { dirname, join, resolve, sep } from 'node:path';
import nunjucks from 'nunjucks';
import { parse } from 'yaml';
import type { Words } from '../locale/index.js';
import { siteFilters } from './filters.js';
import type { MonthPage, SiteData, StationYearPage } from './views.js';

/** The Nunjucks settings of every site template, in Eleventy (.eleventy.js) and here. */
export const NUNJUCKS_OPTIONS = { autoescape: true, trimBlocks: true, lstripBlocks: true } as const;

interface PageTemplate {
  path: string;
  body: nunjucks.Template;
  permalink: nunjucks.Template;
  alias: string;
}

/** A page template: its front matter (as Eleventy's reader splits it off) and its body, compiled. */
function pageTemplate(env: nunjucks.Environment, input: string, name: string): PageTemplate {
  const path = join(input, name);
  const text = readFileSync(path, 'utf8');
  const head = /^---\r?\n([\s\S]*?)\r?\n---[^\S\r\n]*(?:\r?\n|$)/.exec(text);
  const front = (head ? parse(head[1] ?? '') : null) as { pagination?: { alias?: unknown }; permalink?: unknown } | null;
  const alias = front?.pagination?.alias;
  const permalink = front?.permalink;
  if (typeof alias !== 'string' || typeof permalink !== 'string') {
    throw new Error(`${path}: a station page template needs front matter with pagination.alias and permalink (as the built-in ${name} has)`);
  }
  return {
    path,
    body: new nunjucks.Template(text.slice(head?.[0].length ?? 0), env, path, true),
    permalink: new nunjucks.Template(permalink, env, `${path} (permalink)`, true),
    alias,
  };
}

/** A page's URL from its permalink, as Eleventy gives it: a folder's index.html is the folder. */
function urlOf(permalink: string): string {
  const url = permalink.startsWith('/') ? permalink : `/${permalink}`;
  return url.endsWith('/index.html') ? url.slice(0, -'index.html'.length) : url;
}

export interface StationPageRenderer {
  /** Writes one station-year's pages into `outDir`. */
  write(page: StationYearPage, months: readonly MonthPage[], outDir: string): Promise<void>;
}

/** The renderer of every station-year's pages from the templates in `input`, for one site. */
export function stationPageRenderer(input: string, site: SiteData, words: Words): StationPageRenderer {
  const env = new nunjucks.Environment(new nunjucks.FileSystemLoader(join(input, '_includes')), NUNJUCKS_OPTIONS);
  for (const [name, fn] of Object.entries(siteFilters(words))) env.addFilter(name, fn as (...args: unknown[]) => unknown);
  const yearPage = pageTemplate(env, input, 'station-year.njk');
  const monthPage = pageTemplate(env, input, 'month.njk');
  const hoursPage = pageTemplate(env, input, 'hours.njk');
  const draw = async (template: PageTemplate, data: unknown, outDir: string): Promise<void> => {
    const context: Record<string, unknown> = { site, [template.alias]: data };
    const permalink = template.permalink.render(context);
    const file = resolve(outDir, permalink.replace(/^\/+/, ''));
    if (!file.startsWith(resolve(outDir) + sep)) throw new Error(`${template.path}: its permalink "${permalink}" leads out of the site`);
    const html = template.body.render({ ...context, page: { url: urlOf(permalink) } });
    await mkdir(dirname(file), { recursive: true });
    await writeFile(file, html);
  };
  return {
    async write(page, months, outDir) {
      await draw(yearPage, page, outDir);
      for (const month of months) {
        await draw(monthPage, month, outDir);
        await draw(hoursPage, month, outDir);
      }
    },
  };
}
