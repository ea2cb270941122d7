// The imprint, last page of every book and a page of the site: publisher, edition, contact, the
// tidewright version, the datum epoch, the sources of the constants and the caution.
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear } from '../../engine/index.js';
import { loadStationSet } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';
import { STARTER_FILES } from '../../cli/init-files.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { wordsFor } from '../../templates/locale/index.js';
import { captured } from '../fixtures/lists.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-imprint-'));
for (const [name, text] of Object.entries(STARTER_FILES)) {
  mkdirSync(dirname(join(dir, name)), { recursive: true });
  writeFileSync(join(dir, name), text);
}
const set = loadStationSet(dir);
const models: StationYear[] = set.stations.map((s) => buildStationYear(s, set, 2027));
const options = {
  units: 'm' as const, page: 'a5' as const, publisher: 'Storm Petrel Bank Harbour Office (invented)',
  contact: 'Harbour Office <b>Quay</b> Road\n+00 0000 0000', stamp: Date.UTC(2026, 10, 15),
};
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function lastPageText(pdf: Buffer, name: string): string | null {
  const file = join(dir, name);
  writeFileSync(file, pdf);
  try {
    const pages = captured(/Pages:\s+(\d+)/, execFileSync('pdfinfo', [file], { encoding: 'utf8' }), 'pdfinfo pages');
    return execFileSync('pdftotext', ['-f', pages, '-l', pages, file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  } catch {
    console.warn('poppler-utils (pdfinfo, pdftotext) not installed: imprint text check skipped');
    return null;
  }
}

describe('imprint page of the books', () => {
  it('ends each station\'s book', async () => {
    const model = models.find((m) => m.station.kind === 'reference')!;
    const text = lastPageText(await renderStationBook(model, options), 'station.pdf');
    if (text === null) return;
    expect(text).toContain('Imprint');
    expect(text).toContain('Published by Storm Petrel Bank Harbour Office (invented)');
    expect(text).toContain('Edition 15 November 2026');
    expect(text).toContain('Contact Harbour Office <b>Quay</b> Road +00 0000 0000');
    expect(text).toContain(`tidewright ${model.generator.version}`);
    expect(text).toContain(`LAT and HAT are the lowest and highest levels predicted over ${model.datums.epoch.from}\u2013${model.datums.epoch.to}`);
    expect(text).toContain(`Source of the constants ${model.station.provenance}`);
    expect(text).toContain(wordsFor().caution.slice(0, 60));
  }, 30_000);

  it('ends the combined book, with every station\'s source', async () => {
    const text = lastPageText(await renderCombinedBook(models, options), 'combined.pdf');
    if (text === null) return;
    expect(text).toContain('Sources of the constants');
    for (const m of models) expect(text).toContain(`${m.station.name}: ${m.station.provenance.slice(0, 40)}`);
  }, 30_000);
});

describe('imprint page of the site', () => {
  let site: string;
  beforeAll(async () => {
    site = join(dir, 'site');
    await renderSite(models, site, { ...options, quiet: true, title: 'Storm Petrel Bank Tide Tables', accent: '#6b2c5f' });
  }, 60_000);

  it('is linked from every page\'s footer and says the same, escaped', () => {
    const page = readFileSync(join(site, 'imprint', 'index.html'), 'utf8');
    expect(page).toContain('<div><dt>Published by</dt><dd>Storm Petrel Bank Harbour Office (invented)</dd></div>');
    expect(page).toContain('<time datetime="2026-11-15">15 November 2026</time>');
    expect(page).toContain('<dd class="imprint-lines">Harbour Office &lt;b&gt;Quay&lt;/b&gt; Road\n+00 0000 0000</dd>');
    expect(page).toContain('LAT and HAT are the lowest and highest levels predicted over 2020\u20132038');
    for (const m of models) expect(page).toContain(`<li><strong>${m.station.name}</strong>: ${m.station.provenance}</li>`);
    expect(page).toContain(wordsFor().caution.slice(0, 40));
    const index = readFileSync(join(site, 'index.html'), 'utf8');
    expect(index).toContain('<a href="imprint/index.html">Imprint</a>');
    expect(index).toContain('Contact: Harbour Office &lt;b&gt;Quay&lt;/b&gt; Road');
    expect(index).not.toContain('<b>Quay</b>');
    // the publisher's accent colour (contrast-checked by the build) over the site's own
    expect(index).toContain('<style>:root { --sea: #6b2c5f; --sea-deep: #6b2c5f; }</style>');
  });
});
