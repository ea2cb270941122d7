// The index volume of a set bound in several volumes: a cover, then every station A to Z with its
// region, its volume and the page its section starts on.
import { wordsFor, type Words } from '../locale/index.js';
import { accentBar, besideLogo, cautionFoot, coverHeading, drawLogo, inventedBanner } from './cover-parts.js';
import { editionDate } from './document.js';
import { printable } from './format.js';
import { contentBox, pageGeometry } from './geometry.js';
import { notesPage } from './notes.js';
import { checkBookOptions, type BookOptions } from './options.js';
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import type { Picture } from './picture.js';
import { publisherAccent, publisherLogo } from './publisher.js';
import { renderBook } from './render.js';
import { DARK, HAIRLINE, MID, RULE } from './style.js';
import { artifact, group, tag } from './tags.js';
import { paragraph, put, putFitted, widthOf } from './text.js';

export interface IndexEntry {
  name: string;
  kind: 'reference' | 'secondary';
  region?: string;
  volume: number;
  page: number;
}

export interface IndexText { years: string; volumes: number; invented: boolean }

const LINE = 12.5; // design height of one index line
const TOP = 26;

function linesPerPage(g: ReturnType<typeof pageGeometry>): number {
  return Math.max(1, Math.floor((contentBox(g, 1).height - TOP * g.scale) / (LINE * g.scale)));
}

interface IndexCover { title: string; publisher?: string; logo?: Picture; accent?: string }

function coverPage(cover: IndexCover, text: IndexText, w: Words, count: number): LogicalPage {
  return {
    kind: 'cover',
    footer: { invented: text.invented },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      accentBar(ctx, cover.accent);
      let y = coverHeading(ctx, { kicker: w.t('book.kicker'), kickerWidth: besideLogo(ctx, cover.logo), year: text.years,
        ...(cover.accent !== undefined && { yearColor: cover.accent }), title: cover.title, gap: 36,
        titleStyle: { size: 22, lines: 3, minSize: 11, leading: 1.18 } });
      drawLogo(ctx, cover.logo, cover.publisher);
      // what this volume is: the index of the set, a subtitle under the set's title
      putFitted(doc, w.t('index.title'), box.x, y + 4 * s, { font: 'bold', size: 14 * s, color: DARK }, box.width, 8 * s);
      y = paragraph(doc, w.t('index.intro', { count: text.volumes }), box.x, y + 22 * s, box.width,
        { font: 'regular', size: 9.5 * s, color: DARK }, 12 * s) + 4 * s;
      put(doc, w.t('book.subjectCombined', { count }), box.x, y + 4 * s, { font: 'narrow', size: 8.5 * s, color: MID });
      if (text.invented) inventedBanner(ctx, y + 24 * s);
      cautionFoot(ctx, w.caution, cover.publisher).draw();
    },
  };
}

function listPage(chunk: IndexEntry[], first: boolean, w: Words, invented: boolean): LogicalPage {
  return {
    kind: 'contents',
    footer: { invented, label: w.t('index.title') },
    ...(first && { outline: { title: w.t('index.title'), level: 0 as const } }),
    draw(ctx: PageContext) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const head = { font: 'narrow-bold' as const, size: 7.2 * s, color: MID };
      const pageX = box.x + box.width;
      const volX = pageX - 34 * s;
      let y = box.y + 10 * s;
      // read as a table: station (with its region), volume, page; the A–Z letters are decoration
      group(doc, 'Table', { title: w.t('index.title') }, () => {
        group(doc, 'TR', {}, () => {
          tag(doc, 'TH', { scope: 'Column', actual: w.t('stream.station') }, () => undefined);
          tag(doc, 'TH', { scope: 'Column' }, () => put(doc, w.t('index.volume'), volX, y, head, 'right'));
          tag(doc, 'TH', { scope: 'Column' }, () => put(doc, w.t('index.page'), pageX, y, head, 'right'));
        });
        doc.save().lineWidth(HAIRLINE).strokeColor(RULE).moveTo(box.x, y + 4 * s).lineTo(pageX, y + 4 * s).stroke().restore();
        y = box.y + TOP * s;
        let letter = '';
        for (const e of chunk) {
          const initial = e.name.slice(0, 1).toLocaleUpperCase(w.tag);
          const style = { font: e.kind === 'reference' ? 'bold' as const : 'regular' as const, size: 8.6 * s };
          if (initial !== letter) {
            artifact(doc, () => put(doc, initial, box.x, y, { font: 'bold', size: 8.6 * s, color: MID }));
            letter = initial;
          }
          group(doc, 'TR', {}, () => {
            tag(doc, 'TH', { scope: 'Row' }, () => {
              const nameX = box.x + 14 * s;
              const nameMax = (volX - 30 * s - nameX) * (e.region ? 0.62 : 1);
              const used = putFitted(doc, `${e.name} `, nameX, y, style, nameMax, 6 * s);
              if (e.region) {
                const regionX = nameX + Math.min(widthOf(doc, e.name, used), nameMax) + 6 * s;
                putFitted(doc, e.region, regionX, y, { font: 'narrow', size: 7.4 * s, color: MID }, volX - 30 * s - regionX, 5 * s);
              }
            });
            tag(doc, 'TD', {}, () => put(doc, String(e.volume), volX, y, { font: 'regular', size: 8.6 * s }, 'right'));
            tag(doc, 'TD', {}, () => put(doc, String(e.page), pageX, y, { font: 'bold', size: 8.6 * s }, 'right'));
          });
          y += LINE * s;
        }
      });
    },
  };
}

/** Entries sorted A to Z by name in the book's language, then by volume and page. */
export function indexOrder(entries: readonly IndexEntry[], tag: string): IndexEntry[] {
  const collator = new Intl.Collator(tag, { sensitivity: 'base', numeric: true });
  return [...entries].sort((a, b) => collator.compare(a.name, b.name) || a.volume - b.volume || a.page - b.page);
}

export async function renderIndexVolume(entries: readonly IndexEntry[], options: BookOptions, text: IndexText): Promise<Buffer> {
  checkBookOptions(options);
  const g = pageGeometry(options.page);
  const w = wordsFor({ locale: options.locale, units: options.units, caution: options.caution });
  const title = printable(options.title ?? w.t('book.defaultTitle'));
  const sorted = indexOrder(entries, w.tag).map((e) => ({ ...e, name: printable(e.name), ...(e.region !== undefined && { region: printable(e.region) }) }));
  const per = linesPerPage(g);
  const logo = publisherLogo(options, g);
  const accent = publisherAccent(options);
  const cover = { title, ...(options.publisher !== undefined && { publisher: options.publisher }), ...(logo && { logo }), ...(accent !== undefined && { accent }) };
  const pages: LogicalPage[] = [coverPage(cover, text, w, entries.length)];
  for (let i = 0; i < sorted.length; i += per) pages.push(listPage(sorted.slice(i, i + per), i === 0, w, text.invented));
  return renderBook(pages, { units: options.units, geometry: g, title, publisher: options.publisher, words: w, press: options.press, warn: options.warn }, {
    title: `${title}: ${w.t('index.title')}`,
    author: options.publisher,
    subject: w.t('book.subjectCombined', { count: entries.length }) + `${text.invented ? ` (${w.t('book.inventedSubject')})` : ''}`,
    keywords: w.t('book.keywords'),
    date: options.stamp !== undefined ? new Date(options.stamp) : editionDate(Number(text.years.slice(0, 4))),
    lang: w.tag,
    tagged: options.tagged,
  }, options.imposition ?? 'none', () => notesPage({ invented: text.invented }));
}
