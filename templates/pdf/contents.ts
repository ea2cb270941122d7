// The front of a combined book: its cover, and the contents listing every station with its page.
import type { Words } from '../locale/index.js';
import { printable } from './format.js';
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { MID, RULE } from './style.js';
import { group, linked, tag } from './tags.js';
import { put, putFitted, widthOf } from './text.js';

export interface ContentsEntry { view: StationView; page: number }

const ENTRY = 15; // design height of one contents line
const FIRST_TOP = 40;
const NEXT_TOP = 22;

function entriesPerPage(ctx: { height: number }, s: number, first: boolean): number {
  return Math.max(1, Math.floor((ctx.height - (first ? FIRST_TOP : NEXT_TOP) * s) / (ENTRY * s)));
}

/** How many contents pages the entries need (known before page numbers are assigned). */
export function contentsPageCount(count: number, boxHeight: number, s: number): number {
  const first = entriesPerPage({ height: boxHeight }, s, true);
  if (count <= first) return 1;
  return 1 + Math.ceil((count - first) / entriesPerPage({ height: boxHeight }, s, false));
}

function describe(view: StationView, underReference: boolean): string {
  const st = view.model.station;
  const w = view.words;
  if (st.kind === 'reference') return `${w.t('port.referenceLower')} \u00b7 ${w.tideType(view.model.tideType.kind).toLocaleLowerCase(w.tag)}`;
  return underReference ? w.t('port.secondaryLower')
    : `${w.t('port.secondaryOfLower')} ${printable(view.model.reference?.name ?? st.reference)}`;
}

/**
 * Book order: each reference port followed by its secondary ports (in the order given); secondary
 * ports whose reference is not in the book come last.
 */
export function bookOrder<T extends { station: { id: string; kind: string }; reference: { id: string } | null }>(models: T[]): T[] {
  const out: T[] = [];
  const placed = new Set<T>();
  for (const m of models) {
    if (m.station.kind !== 'reference') continue;
    out.push(m);
    placed.add(m);
    for (const s of models) {
      if (s.station.kind === 'secondary' && s.reference?.id === m.station.id && !placed.has(s)) { out.push(s); placed.add(s); }
    }
  }
  for (const m of models) if (!placed.has(m)) out.push(m);
  return out;
}

export function contentsPages(entries: ContentsEntry[], boxHeight: number, s: number, invented: boolean, words: Words): LogicalPage[] {
  const pages: LogicalPage[] = [];
  let i = 0;
  while (i < entries.length || pages.length === 0) {
    const first = pages.length === 0;
    const n = entriesPerPage({ height: boxHeight }, s, first);
    const start = i;
    const chunk = entries.slice(start, start + n);
    i += n;
    pages.push({
      kind: 'contents',
      footer: { invented },
      outline: first ? { title: words.t('book.contents'), level: 0 } : undefined,
      draw(ctx: PageContext) {
        const { doc, box } = ctx;
        let y = box.y + (first ? 14 : 0) * s;
        if (first) tag(doc, 'H1', {}, () => put(doc, words.t('book.contents'), box.x, y, { font: 'bold', size: 16 * s }));
        y = box.y + (first ? FIRST_TOP : NEXT_TOP) * s;
        group(doc, 'TOC', {}, () => chunk.forEach((e, k) => {
          const num = String(e.page);
          const numW = widthOf(doc, num, { font: 'bold', size: 9.5 * s });
          const st = e.view.model.station;
          const prev = entries[start + k - 1]?.view.model ?? null; // the entry above, on this page or the last
          const underReference = st.kind === 'secondary' && prev !== null
            && (prev.station.id === st.reference || prev.reference?.id === st.reference);
          const indent = underReference ? 12 * s : 0;
          const nameStyle = { font: underReference ? 'regular' as const : 'bold' as const, size: 9.5 * s };
          const nameMax = box.width * 0.55 - indent;
          const desc = describe(e.view, underReference);
          const target = `station-${e.view.model.station.id}`;
          // each entry a TOCI whose Link holds the entry's words and, as its OBJR, the link annotation
          group(doc, 'TOCI', {}, () => linked(doc, () => {
            // each piece ends in an unseen space, so that the entry reads as words, not one run
            const used = putFitted(doc, `${e.view.name} `, box.x + indent, y, nameStyle, nameMax, 6.5 * s);
            const nameW = Math.min(widthOf(doc, e.view.name, used), nameMax);
            const descX = box.x + indent + nameW + 6 * s;
            const descMax = box.x + box.width - numW - 14 * s - descX;
            const dw = Math.min(descMax, widthOf(doc, desc, { font: 'narrow', size: 7.5 * s }));
            putFitted(doc, `${desc} `, descX, y, { font: 'narrow', size: 7.5 * s, color: MID }, descMax, 5 * s);
            doc.save().lineWidth(0.6 * s).strokeColor(RULE).dash(0.6 * s, { space: 2.2 * s })
              .moveTo(descX + dw + 4 * s, y).lineTo(box.x + box.width - numW - 4 * s, y).stroke().undash().restore();
            put(doc, num, box.x + box.width, y, { font: 'bold', size: 9.5 * s }, 'right');
          }, (structParent) => {
            if (ctx.interactive) doc.goTo(box.x, y - 10 * s, box.width, ENTRY * s, target, structParent ? { structParent } : {});
          }));
          y += ENTRY * s;
        }));
      },
    });
  }
  return pages;
}

