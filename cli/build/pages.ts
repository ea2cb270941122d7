// The publisher's own pages: every .md file in the folder `pages:` names (relative to tidewright.yaml),
// read and checked before anything is written. Front matter (YAML between two --- lines) says where a
// page goes; paths in it and in the Markdown are relative to the page's own file.
import { readdirSync, statSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import { isMap, parseDocument } from 'yaml';
import { StationFileError, nearestName, readTextFile } from '../../engine/index.js';
import { markdownReader } from '../../templates/pages/markdown.js';
import {
  GRID_SIZES, PAGE_PLACES, PAGE_TARGETS, gridCells, type GridSize, type PageImage, type PublisherPage,
} from '../../templates/pages/types.js';
import { checkPicture } from './logo.js';

export const MAX_PAGES = 100;
export const MAX_PAGE_BYTES = 256 * 1024;

const FIX: Record<string, string> = {
  title: 'write the page\'s title as text, e.g. title: Welcome to the harbour',
  order: 'write a whole number; pages of one place run from the lowest, e.g. order: 1',
  place: `write place: front (before the tide tables) or place: back (after them)`,
  in: `write in: both, in: site (the website only) or in: book (the printed books only)`,
  image: 'write the path of an SVG, PNG or JPEG file relative to this page, e.g. image: ads/sponsor.png',
  alt: 'write what the picture shows as text, e.g. alt: Advertisement of the Quay Chandlery',
  images: 'write a list of pictures, e.g. images: [{ file: ads/a.png, size: half, alt: … }, { file: ads/b.png, size: quarter, alt: … }]',
};
const KEYS = Object.keys(FIX);
const PICTURE_FIX = 'write the path of an SVG, PNG or JPEG file relative to this page, e.g. images/quay.png';

function pageError(file: string, field: string, problem: string, fix = FIX[field] ?? `the settings of a page are ${KEYS.join(', ')}`): StationFileError {
  return new StationFileError(file, field, problem, fix);
}

function frontMatter(file: string, text: string): { data: Record<string, unknown>; body: string } {
  const match = /^\uFEFF?---[ \t]*\r?\n([\s\S]*?)\r?\n---[ \t]*(?:\r?\n|$)/.exec(text);
  if (!match) {
    throw pageError(file, '(front matter)', 'does not start with front matter',
      'start the file with a --- line, then title: … (and place:, order:, in: as needed), then another --- line');
  }
  const doc = parseDocument(match[1] ?? '', { uniqueKeys: true });
  const [error] = doc.errors;
  if (error) {
    const what = (error.message.split('\n')[0] ?? '').replace(/ at line \d+, column \d+:?$/, '');
    throw pageError(file, '(front matter)', `YAML syntax error: ${what}`, 'write one setting per line as key: value, e.g. title: Welcome');
  }
  if (!isMap(doc.contents)) throw pageError(file, '(front matter)', 'is not a list of key: value settings', 'write at least title: … between the --- lines');
  return { data: doc.toJS({ maxAliasCount: 10 }) as Record<string, unknown>, body: text.slice(match[0].length) };
}

function text(file: string, field: string, value: unknown, max = 200): string {
  if (typeof value !== 'string' || value.trim() === '') throw pageError(file, field, value === undefined ? 'is missing' : 'is not text');
  if (value.length > max) throw pageError(file, field, `is longer than ${max} characters`);
  return value.trim();
}

function oneOf<T extends string>(file: string, field: string, value: unknown, allowed: readonly T[], fallback: T): T {
  if (value === undefined) return fallback;
  if (typeof value === 'string' && (allowed as readonly string[]).includes(value)) return value as T;
  throw pageError(file, field, `"${String(value)}" is not one of ${allowed.join(', ')}`);
}

function picture(file: string, field: string, written: unknown, alt: unknown): PageImage {
  const path = checkPicture(file, field, text(file, field, written, 400), PICTURE_FIX).path;
  return { path, alt: alt === undefined ? '' : text(file, `${field} alt`, alt, 400) };
}

/** Every image the Markdown shows, checked: src as written → absolute path. */
function markdownImages(file: string, body: string, linesBefore: number): Record<string, string> {
  const images: Record<string, string> = {};
  for (const token of markdownReader().parse(body, {})) {
    for (const child of token.children ?? []) {
      if (child.type !== 'image') continue;
      const src = child.attrGet('src') ?? '';
      const field = `line ${linesBefore + (token.map?.[0] ?? 0) + 1} image`;
      if (/^[a-z][a-z0-9+.-]*:/i.test(src) || src.startsWith('//')) {
        throw pageError(file, field, `${src} is not a file beside the page`, 'books print without a network: put the picture in the pages folder and write its path, e.g. ![Quay](images/quay.png)');
      }
      images[src] = checkPicture(file, field, decodeURI(src), PICTURE_FIX).path;
    }
  }
  return images;
}

function grid(file: string, value: unknown): (PageImage & { size: GridSize })[] {
  if (!Array.isArray(value) || value.length === 0) throw pageError(file, 'images', 'is not a list of pictures');
  const list = value.map((item, i) => {
    const field = `images ${i + 1}`;
    if (item === null || typeof item !== 'object' || Array.isArray(item)) throw pageError(file, field, 'is not a picture (file:, size:, alt:)', FIX.images);
    const entry = item as Record<string, unknown>;
    const unknown = Object.keys(entry).find((k) => !['file', 'size', 'alt'].includes(k));
    if (unknown !== undefined) throw pageError(file, `${field} ${unknown}`, 'is not a setting of a picture', 'a picture has file:, size: (half or quarter) and alt:');
    return { ...picture(file, `${field} file`, entry.file, entry.alt), size: oneOf(file, `${field} size`, entry.size, GRID_SIZES, 'quarter') };
  });
  const cells = gridCells(list);
  if (cells > 4) {
    throw pageError(file, 'images', `fill ${cells} quarters of a page, more than the 4 one page holds (a half takes two)`,
      'move some pictures to another page file');
  }
  return list;
}

function slugOf(file: string): string {
  return basename(file, '.md').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'page';
}

/** One page file, checked. */
export function readPage(file: string): PublisherPage {
  const read = readTextFile(file, MAX_PAGE_BYTES, 'a Markdown page');
  if (!('text' in read)) throw pageError(file, '(file)', read.problem, read.fix);
  const { data, body } = frontMatter(file, read.text);
  for (const key of Object.keys(data)) {
    if (!KEYS.includes(key)) {
      const near = nearestName(key, KEYS);
      throw pageError(file, key, 'is not a setting of a page', `${near ? `did you mean ${near}? ` : ''}the settings of a page are ${KEYS.join(', ')}`);
    }
  }
  const linesBefore = read.text.slice(0, read.text.length - body.length).split('\n').length - 1;
  const script = /<\s*script\b/i.exec(body);
  if (script) {
    const line = linesBefore + body.slice(0, script.index).split('\n').length;
    throw pageError(file, `line ${line}`, 'holds a <script> element, and pages never run code',
      'remove it; write the text itself in Markdown (in the site, anything written as HTML shows as plain text)');
  }
  const order = data.order ?? 0;
  if (typeof order !== 'number' || !Number.isInteger(order) || Math.abs(order) > 1e6) throw pageError(file, 'order', `${String(order)} is not a whole number`);
  if (data.image !== undefined && data.images !== undefined) {
    throw pageError(file, 'images', 'is given beside image:', 'a page is either one whole-page picture (image:) or a grid of pictures (images:); keep one');
  }
  if (data.alt !== undefined && data.image === undefined) throw pageError(file, 'alt', 'belongs to a whole-page picture, and image: is missing', 'write image: beside it, or remove alt:');
  const page: PublisherPage = {
    file,
    slug: slugOf(file),
    title: text(file, 'title', data.title),
    order,
    place: oneOf(file, 'place', data.place, PAGE_PLACES, 'back'),
    in: oneOf(file, 'in', data.in, PAGE_TARGETS, 'both'),
    markdown: body,
    images: markdownImages(file, body, linesBefore),
    ...(data.image !== undefined && { image: picture(file, 'image', data.image, data.alt) }),
    ...(data.images !== undefined && { grid: grid(file, data.images) }),
  };
  if ((page.image || page.grid) && body.trim() !== '' && page.in !== 'site') {
    throw pageError(file, '(text)', 'follows a page of pictures, which has no room for text in the books',
      'move the text to a page file of its own, or write in: site');
  }
  return page;
}

/** Every page in the folder `written` (relative to tidewright.yaml), in file-name order. */
export function readPages(projectFile: string, written: string): PublisherPage[] {
  const dir = resolve(projectFile, '..', written);
  const fix = 'write the folder of your Markdown pages, relative to tidewright.yaml, e.g. pages: pages/';
  let names: string[];
  try {
    if (!statSync(dir).isDirectory()) throw new StationFileError(projectFile, 'pages', `${written} is a file, not a folder`, fix);
    names = readdirSync(dir).filter((n) => n.toLowerCase().endsWith('.md')).sort();
  } catch (error) {
    if (error instanceof StationFileError) throw error;
    throw new StationFileError(projectFile, 'pages', `${written} does not exist (looked for ${dir})`, fix);
  }
  if (names.length > MAX_PAGES) throw new StationFileError(projectFile, 'pages', `${written} holds ${names.length} pages, more than ${MAX_PAGES}`, 'keep the pages the almanac needs in it');
  const pages = names.map((name) => readPage(resolve(dir, name)));
  const seen = new Map<string, string>();
  for (const page of pages) {
    const other = seen.get(page.slug);
    if (other !== undefined) throw pageError(page.file, '(file name)', `makes the same web address /pages/${page.slug}/ as ${other}`, 'rename one of the two files');
    seen.set(page.slug, page.file);
  }
  return pages;
}
