// Eleventy wiring only: where templates, layouts and data live, the CSS. renderSite
// (templates/site/render.ts) registers the filters and Nunjucks' settings and hands over the models;
// started on its own (npx @11ty/eleventy) it takes the compiled filters and settings from dist/ (npm ci
// builds them), templates/_data asks the engine for the demo, and the site goes to out/site.
import { dirname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = dirname(fileURLToPath(import.meta.url));

export default async function (eleventyConfig) {
  const standalone = !eleventyConfig.getFilter('tideCurve');
  if (standalone) {
    const { registerSiteFilters } = await import('./dist/templates/site/filters.js');
    const { wordsFor } = await import('./dist/templates/locale/index.js');
    const { NUNJUCKS_OPTIONS } = await import('./dist/templates/site/station-render.js');
    registerSiteFilters(eleventyConfig, wordsFor());
    eleventyConfig.setNunjucksEnvironmentOptions(NUNJUCKS_OPTIONS);
  }
  eleventyConfig.setUseGitIgnore(false);
  // Eleventy matches ignore globs against paths relative to the working folder, not absolute ones.
  for (const folder of ['pdf', 'site', 'exports', 'report']) {
    eleventyConfig.ignores.add(`./${relative(process.cwd(), join(root, 'templates', folder)).split(sep).join('/')}/**`);
  }
  // renderSite chooses the input (the built-in templates, or those with a publisher's site/ laid over
  // them), copies that input's assets and chooses the output; on its own, Eleventy takes tidewright's.
  if (standalone) eleventyConfig.addPassthroughCopy({ [join(root, 'templates', 'assets')]: 'assets' });
  return {
    // Absolute, so a build started from any folder finds the templates.
    dir: { includes: '_includes', data: '_data', ...(standalone ? { input: join(root, 'templates'), output: 'out/site' } : {}) },
    templateFormats: ['njk'],
    htmlTemplateEngine: 'njk',
  };
}
