// The cover of a combined book: title, edition year, how many stations, the caution.
import { accentBar, besideLogo, cautionFoot, coverHeading, coverImage, drawLogo, inventedBanner } from './cover-parts.js';
import type { Picture } from './picture.js';
import type { LogicalPage } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK } from './style.js';
import { put, putFitted } from './text.js';

export interface BookCoverText { title: string; publisher?: string; years: string; logo?: Picture; coverImage?: Picture; accent?: string; volume?: string }

export function bookCoverPage(views: StationView[], text: BookCoverText, caution: string, invented: boolean): LogicalPage {
  return {
    kind: 'cover',
    footer: { invented },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const w = ctx.settings.words;
      accentBar(ctx, text.accent);
      let y = coverHeading(ctx, { kicker: w.t('book.kicker'), kickerWidth: besideLogo(ctx, text.logo), year: text.years,
        ...(text.accent !== undefined && { yearColor: text.accent }), title: text.title, gap: 36,
        titleStyle: { size: 22, lines: 3, minSize: 11, leading: 1.18 } });
      drawLogo(ctx, text.logo, text.publisher);
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
      const foot = cautionFoot(ctx, caution, text.publisher);
      if (text.coverImage) coverImage(ctx, text.coverImage, y - 6 * s, foot.top - 4 * s, text.publisher);
      foot.draw();
    },
  };
}
