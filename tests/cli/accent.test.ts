// accent: in tidewright.yaml: a #rrggbb colour, refused when white text on it (or it on the white page)
// falls below 4.5:1, the WCAG 2.1 AA ratio for body text.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { contrastRatio } from '../../cli/build/accent.js';
import { loadProjectFile } from '../../cli/build/project.js';
import { buildSiteData } from '../../templates/site/views.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-accent-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const project = (text: string) => {
  writeFileSync(join(dir, 'tidewright.yaml'), text);
  return () => loadProjectFile(dir);
};

describe('accent colour', () => {
  it('measures contrast as WCAG 2.1 does', () => {
    // WCAG 2.1: black on white is 21:1; #767676 is the lightest grey reaching 4.5:1 on white (4.54:1),
    // #777777 falls just short (4.48:1) (common practice, from the WCAG contrast technique G18's examples)
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 5);
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#ffffff')).toBeCloseTo(4.48, 2);
    expect(contrastRatio('#ffffff', '#767676')).toBe(contrastRatio('#767676', '#ffffff'));
  });

  it('is accepted when it reaches 4.5:1 against white', () => {
    expect(project('accent: "#0b5d7a"\n')().settings.accent).toBe('#0b5d7a');
    expect(project('accent: "#767676"\n')().settings.accent).toBe('#767676');
  });

  it.each([
    ['accent: "#777777"\n', /^.*tidewright\.yaml: accent: "#777777" against white \(white text on it, and it as text on the page\) has a contrast of 4\.48:1, below 4\.5:1; write a darker colour as "#rrggbb" in quotes, e\.g\. accent: "#0b5d7a"$/],
    ['accent: "#ffcc00"\n', /accent: "#ffcc00" against white .* has a contrast of 1\.\d\d:1, below 4\.5:1/],
    ['accent: teal\n', /accent: "teal" is not a colour written #rrggbb; write a darker colour/],
    ['accent: "#0b5d7"\n', /accent: "#0b5d7" is not a colour written #rrggbb/],
  ])('refuses %j in one line', (text, message) => {
    expect(project(text)).toThrow(message);
  });

  it('reaches the site as its accent, and only as a checked colour', () => {
    expect(buildSiteData([], { units: 'm', accent: '#0b5d7a' }).accent).toBe('#0b5d7a');
    expect(buildSiteData([], { units: 'm', accent: 'red;}body{display:none' }).accent).toBeNull();
  });
});
