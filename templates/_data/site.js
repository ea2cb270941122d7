// What every template reads as `site`: the pages and models. renderSite hands them over through
// Eleventy's global data; run on its own, Eleventy asks the engine for next year's demo almanac.
export default async function (configData) {
  if (configData.tidewrightSite) return configData.tidewrightSite;
  const { standaloneSite } = await import('../../dist/templates/site/standalone.js');
  return standaloneSite();
}
