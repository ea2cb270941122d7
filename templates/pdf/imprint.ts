// The imprint page, last in every book: who publishes it and how to reach them, the edition's date,
// the tidewright version, the datum epochs, where the constants of each station come from, and the
// caution in full.
import { firstOf, type StationYear, type StreamYear } from '../../engine/index.js';
import type { Words } from '../locale/index.js';
import { printable } from './format.js';
import type { LogicalPage } from './page.js';
import { unit } from './page.js';
import { INK, MID } from './style.js';
import { paragraph, put } from './text.js';

export interface ImprintText {
  publisher?: string | undefined;
  contact?: string | undefined;
  stamp?: number | undefined; // UTC ms of the edition
  accent?: string | undefined; // the publisher's colour, for the page's heading
}

export function imprintPage(models: readonly (StationYear | StreamYear)[], words: Words, text: ImprintText, label?: string): LogicalPage {
  const first = firstOf(models, 'models of the imprint');
  const invented = models.some((m) => m.invented);
  return {
    kind: 'imprint',
    footer: { invented, ...(label !== undefined && { label }) },
    outline: { title: words.t('site.imprint'), level: models.length > 1 ? 0 : 1 },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const width = box.width;
      const body = { font: 'regular', size: 8.4 * s } as const;
      let y = box.y + 14 * s;
      const w = words;
      put(doc, w.t('site.imprint'), box.x, y, { font: 'bold', size: 16 * s, color: text.accent ?? INK });
      y += 22 * s;
      const block = (label: string, value: string, maxLines = 12): void => {
        put(doc, label, box.x, y, { font: 'narrow-bold', size: 7.8 * s, color: MID });
        y += 10 * s;
        for (const line of value.split('\n').filter((l) => l.trim() !== '')) {
          y = paragraph(doc, printable(line), box.x, y, width, body, 10.6 * s, maxLines);
        }
        y += 5 * s;
      };
      const edition = new Date(text.stamp ?? Date.UTC(first.year, 0, 1)).toISOString().slice(0, 10);
      if (text.publisher !== undefined) block(w.t('imprint.publishedBy'), text.publisher);
      block(w.t('imprint.edition'), w.date(edition));
      if (text.contact !== undefined) block(w.t('imprint.contact'), text.contact, 4);
      block(w.t('imprint.madeWith'), w.t('imprint.method', { generator: `${first.generator.name} ${first.generator.version}` }));
      const epochs = [...new Set(models.flatMap((m) => (!('datums' in m) ? [] : [`${m.datums.epoch.from}\u2013${m.datums.epoch.to}`])))];
      if (epochs.length > 0) block(w.t('imprint.datumEpoch'), w.t('site.latHatOver', { epoch: epochs.join(', ') }));
      const sources = models.length === 1
        ? first.station.provenance
        : [...new Map(models.map((m) => [m.station.id, `${m.station.name}: ${m.station.provenance}`])).values()].join('\n');
      block(w.t(models.length === 1 ? 'imprint.source' : 'imprint.sources'), sources, 3);
      const streams = models.some((m) => !('datums' in m));
      block(w.t('imprint.caution'), streams ? `${w.caution} ${w.t('caution.streams')}` : w.caution, 10);
    },
  };
}
