// The one Markdown reader of the publisher's pages: markdown-it (the library Eleventy itself uses), with
// raw HTML off, so anything written as HTML in a page (a <script> too) is shown as text and never runs.
import MarkdownIt from 'markdown-it';

let reader: MarkdownIt | null = null;

export function markdownReader(): MarkdownIt {
  if (reader === null) reader = new MarkdownIt('default', { html: false, linkify: false, typographer: false });
  return reader;
}
