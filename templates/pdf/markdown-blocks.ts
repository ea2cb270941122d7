// A publisher's Markdown as blocks the book can set: markdown-it's tokens (templates/pages/markdown.ts)
// read into headings, paragraphs, list items, simple tables, pictures and rules. Inline text keeps its
// emphasis and links as pieces; raw HTML never reaches here (the reader has it off: it arrives as text).
import type Token from 'markdown-it/lib/token.mjs';
import { markdownReader } from '../pages/markdown.js';
import type { FontName } from './fonts.js';

export interface Piece {
  text: string;
  font: FontName;
  link?: string; // web, mail or telephone address the words lead to
  br?: true; // a hard line break before this piece
}

export type Align = 'left' | 'right' | 'center';

export type Block =
  | { kind: 'heading'; level: 1 | 2 | 3; pieces: Piece[] }
  | { kind: 'paragraph'; pieces: Piece[]; indent: number }
  | { kind: 'item'; marker: string; pieces: Piece[]; depth: number; first: boolean } // first: opens a list
  | { kind: 'table'; head: Piece[][]; rows: Piece[][][]; align: Align[] }
  | { kind: 'image'; src: string; alt: string; caption: string }
  | { kind: 'rule' };

/** Links a printed page may carry: the web, mail and telephone. */
const LINKABLE = /^(https?:|mailto:|tel:)/i;

function fontOf(strong: number, em: number, code: boolean): FontName {
  if (code) return 'narrow';
  if (strong > 0) return 'bold';
  return em > 0 ? 'oblique' : 'regular';
}

/** Inline tokens as pieces; pictures inside the text come out separately, in order. */
function inline(token: Token | undefined): { pieces: Piece[]; images: Block[] } {
  const pieces: Piece[] = [];
  const images: Block[] = [];
  let strong = 0;
  let em = 0;
  let link: string | undefined;
  let br = false;
  const add = (text: string, code = false): void => {
    if (text === '' && !br) return;
    pieces.push({ text, font: fontOf(strong, em, code), ...(link !== undefined && { link }), ...(br && { br: true as const }) });
    br = false;
  };
  for (const child of token?.children ?? []) {
    switch (child.type) {
      case 'text': add(child.content); break;
      case 'code_inline': add(child.content, true); break;
      case 'softbreak': add(' '); break;
      case 'hardbreak': br = true; break;
      case 'strong_open': strong++; break;
      case 'strong_close': strong--; break;
      case 'em_open': em++; break;
      case 'em_close': em--; break;
      case 's_open': case 's_close': break;
      case 'link_open': {
        const href = child.attrGet('href') ?? '';
        link = LINKABLE.test(href) ? href : undefined;
        break;
      }
      case 'link_close': link = undefined; break;
      case 'image':
        images.push({ kind: 'image', src: child.attrGet('src') ?? '', alt: child.content, caption: child.attrGet('title') ?? '' });
        break;
      default: if (child.content) add(child.content);
    }
  }
  return { pieces, images };
}

function alignOf(token: Token): Align {
  const style = token.attrGet('style') ?? '';
  return style.includes('right') ? 'right' : style.includes('center') ? 'center' : 'left';
}

/** The blocks of a page's Markdown, in reading order. */
export function markdownBlocks(markdown: string): Block[] {
  const tokens = markdownReader().parse(markdown, {});
  const blocks: Block[] = [];
  const lists: { ordered: boolean; next: number; opened: boolean }[] = [];
  let quote = 0;
  let itemOpen = false;
  const text = (pieces: Piece[], images: Block[]): void => {
    const list = lists[lists.length - 1];
    if (pieces.some((p) => p.text.trim() !== '')) {
      if (list && itemOpen) {
        const marker = list.ordered ? `${list.next}.` : lists.length % 2 === 1 ? '\u2022' : '\u2013';
        blocks.push({ kind: 'item', marker, pieces, depth: lists.length - 1, first: !list.opened });
        list.opened = true;
        itemOpen = false;
      } else {
        blocks.push({ kind: 'paragraph', pieces, indent: lists.length + quote });
      }
    }
    blocks.push(...images);
  };
  // One cursor through the tokens: a heading or a table takes the tokens it holds from it, and the
  // outer loop goes on after them (an array iterator has no return(), so leaving an inner loop keeps it open).
  const cursor = tokens.values();
  for (const t of cursor) {
    switch (t.type) {
      case 'heading_open': {
        const level = Math.min(3, Number(t.tag.slice(1))) as 1 | 2 | 3;
        const { pieces, images } = inline(cursor.next().value);
        cursor.next(); // heading_close
        blocks.push({ kind: 'heading', level, pieces }, ...images);
        break;
      }
      case 'inline': { const { pieces, images } = inline(t); text(pieces, images); break; }
      case 'bullet_list_open': lists.push({ ordered: false, next: 1, opened: false }); break;
      case 'ordered_list_open': lists.push({ ordered: true, next: Number(t.attrGet('start') ?? 1), opened: false }); break;
      case 'bullet_list_close': case 'ordered_list_close': lists.pop(); break;
      case 'list_item_open': itemOpen = true; break;
      case 'list_item_close': { const list = lists[lists.length - 1]; if (list) list.next++; itemOpen = false; break; }
      case 'blockquote_open': quote++; break;
      case 'blockquote_close': quote--; break;
      case 'hr': blocks.push({ kind: 'rule' }); break;
      case 'code_block': case 'fence':
        blocks.push({ kind: 'paragraph', pieces: t.content.replace(/\n$/, '').split('\n').map((line, n) => ({ text: line, font: 'narrow' as const, ...(n > 0 && { br: true as const }) })), indent: lists.length + quote + 1 });
        break;
      case 'table_open': {
        const head: Piece[][] = [];
        const rows: Piece[][][] = [];
        const align: Align[] = [];
        let row: Piece[][] | null = null;
        let inHead = false;
        for (const c of cursor) {
          if (c.type === 'table_close') break;
          if (c.type === 'thead_open') inHead = true;
          else if (c.type === 'thead_close') inHead = false;
          else if (c.type === 'tr_open') row = [];
          else if (c.type === 'tr_close' && row) { if (inHead) head.push(...row); else rows.push(row); row = null; }
          else if (c.type === 'th_open' || c.type === 'td_open') { if (inHead) align.push(alignOf(c)); }
          else if (c.type === 'inline' && row) row.push(inline(c).pieces);
        }
        blocks.push({ kind: 'table', head, rows, align });
        break;
      }
      default: break;
    }
  }
  return blocks;
}
