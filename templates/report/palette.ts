// The report's colours come from the site's own stylesheet: the custom properties of the first :root
// block of templates/assets/site.css, copied into the report's <style> as they are, so there is one
// palette to change. The report's own rules (report.css) name colours only through var(--…).

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from '../site/paths.js';

export const SITE_CSS = join('templates', 'assets', 'site.css');

/** `--name: value` pairs of the first :root { … } block of a stylesheet, in order. */
export function rootCustomProperties(css: string): [string, string][] {
  const block = /:root\s*\{(?<body>[^}]*)\}/.exec(css.replace(/\/\*[\s\S]*?\*\//g, ''))?.groups?.body;
  if (block === undefined) return [];
  return [...block.matchAll(/(?<name>--[\w-]+)\s*:\s*(?<value>[^;]+);/g)].flatMap(({ groups }) => (groups?.name && groups.value ? [[groups.name, groups.value.trim()]] : []));
}

/** The site's custom properties as one :root rule for the report. */
export function sitePaletteCss(root = projectRoot()): string {
  const properties = rootCustomProperties(readFileSync(join(root, SITE_CSS), 'utf8'));
  if (properties.length === 0) throw new Error(`tidewright: ${SITE_CSS} has no :root custom properties for the report`);
  return `:root { ${properties.map(([name, value]) => `${name}: ${value};`).join(' ')} }`;
}
