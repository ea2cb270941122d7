// The cover of a combined book: title, edition year, how many stations, the caution.
import { cautionBlock, coverImage, inventedBanner } from './cover-parts.js';
import { accentBar, drawLogo } from './cover.js';
import type { Picture } from './picture.js';
import type { LogicalPage } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK, INK, MID } from './style.js';
import { tag } from './tags.js';
import { fitLines, put, putFitted } from './text.js';

export interface BookCoverText { title: string; publisher?: string; years: string; logo?: Picture; coverImage?: Picture; accent?: string; volume?: string }

export function bookCoverPage(views: StationView[], text: BookCoverText, caution: string, invented: boolean): LogicalPage {
  return {
    kind: 'cover',
    footer: { invented },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      let y = box.y + 12 * s;
      drawLogo(ctx, text.logo, text.publisher);
      accentBar(ctx, text.accent);
      const w = ctx.settings.words;
      put(doc, w.t('book.kicker').toLocaleUpperCase(w.tag), box.x, y, { font: 'bold', size: 9 * s, color: MID });
      y += 62 * s;
      put(doc, text.years, box.x - 3 * s, y, { font: 'bold', size: 70 * s, color: text.accent ?? INK });
      y += 36 * s;
      const title = fitLines(doc, text.title, { font: 'bold', size: 22 * s }, box.width, 3, 11 * s);
      tag(doc, 'H1', {}, () => {
        for (const line of title.lines) {
          put(doc, line, box.x, y, title.style);
          y += title.style.size * 1.18;
        }
      });
      if (text.volume !== undefined) {
        putFitted(doc, text.volume, box.x, y + 2 * s, { font: 'bold', size: 12 * s, color: DARK }, box.width, 7 * s);
        y += 18 * s;
      }
      const refs = views.filter((v) => v.model.station.kind === 'reference').length;
      put(doc, w.t('book.stationCount', { count: views.length, references: w.t('book.referenceCount', { count: refs }),
        secondaries: w.t('book.secondaryCount', { count: views.length - refs }) }), box.x, y + 2 * s,
      { font: 'regular', size: 10 * s, color: DARK });
      y += 40 * s;
      if (invented) y = inventedBanner(ctx, y) + 20 * s;
      const cautionTop = cautionBlock(ctx, caution, text.publisher);
      if (text.coverImage) coverImage(ctx, text.coverImage, y - 6 * s, cautionTop - 4 * s);
    },
  };
}
