// The structure of a tagged PDF, for screen readers and reflow: one small helper the layouts call.
// A page's drawing runs inside an artifact (decoration: rules, shading, marks) until a layout says what
// a piece is: `tag` for a leaf with content (heading, paragraph, cell, figure with alternative text),
// `group` for a container (table, row, section). Untagged documents pass straight through, so the
// layouts read the same either way. Structure follows the order of the calls; sections can be made
// ahead (`sections`) so that pages drawn out of order (imposed sheets) still read in book order.

export type TagType = 'Document' | 'Sect' | 'Part' | 'Div' | 'H1' | 'H2' | 'H3' | 'P' | 'Span' | 'Figure' | 'Table' | 'TR' | 'TH' | 'TD'
  | 'L' | 'LI' | 'Lbl' | 'LBody' | 'Caption' | 'TOC' | 'TOCI' | 'Link';

export interface TagOptions {
  alt?: string; // a figure's alternative text
  title?: string;
  lang?: string;
  actual?: string; // text that replaces the drawn content when read
  scope?: 'Row' | 'Column' | 'Both'; // for header cells
}

interface TagState {
  root: PDFKit.PDFStructureElement; // the Document element
  parents: PDFKit.PDFStructureElement[]; // open containers below the root, innermost last
  leaf: boolean; // inside a leaf's content: nested tags only draw
  artifact: boolean; // an artifact is open on the page
  decor: number; // inside `artifact`: tags only draw
}

const states = new WeakMap<PDFKit.PDFDocument, TagState>();

/** Starts the structure tree of a document created with `tagged: true`: a Document element at its root. */
export function startTagging(doc: PDFKit.PDFDocument): void {
  const root = doc.struct('Document');
  doc.addStructure(root);
  states.set(doc, { root, parents: [], leaf: false, artifact: false, decor: 0 });
}

/** The container that new elements join: the innermost open one, else the document. */
function innermost(state: TagState): PDFKit.PDFStructureElement {
  return state.parents.at(-1) ?? state.root;
}

export function isTagged(doc: PDFKit.PDFDocument): boolean {
  return states.has(doc);
}

function openArtifact(doc: PDFKit.PDFDocument, state: TagState): void {
  if (state.artifact || state.leaf) return;
  doc.markContent('Artifact', { type: 'Layout' });
  state.artifact = true;
}

/** At the start of drawing on a page: everything not tagged from here on is decoration. */
export function beginTaggedPage(doc: PDFKit.PDFDocument): void {
  const state = states.get(doc);
  if (state) { state.artifact = false; openArtifact(doc, state); }
}

function element(doc: PDFKit.PDFDocument, type: TagType, options: TagOptions): PDFKit.PDFStructureElement {
  return doc.struct(type, options as PDFKit.Mixins.StructureElementOptions);
}

/** A leaf: the content drawn by `draw` is this element's. Inside another leaf it only draws. */
export function tag<T>(doc: PDFKit.PDFDocument, type: TagType, options: TagOptions, draw: () => T): T {
  const state = states.get(doc);
  if (!state || state.leaf || state.decor > 0) return draw();
  let result: T | undefined;
  const el = element(doc, type, options);
  innermost(state).add(el);
  state.leaf = true;
  state.artifact = false; // pdfkit closes the open artifact when marked content with an id begins
  try {
    el.add(() => { result = draw(); });
  } finally {
    state.leaf = false;
  }
  el.end();
  openArtifact(doc, state);
  return result as T;
}

/**
 * A link: `draw` sets its visible text as a Link element's content, and `annotate` places the link
 * annotation, handed the element so that the annotation becomes its object reference (OBJR) child and
 * a screen reader announces the text as the link. Untagged, both simply run.
 */
export function linked<T>(doc: PDFKit.PDFDocument, draw: () => T,
  annotate: (structParent: PDFKit.PDFStructureElement | undefined) => void): T {
  const state = states.get(doc);
  if (!state || state.leaf || state.decor > 0) {
    const result = draw();
    annotate(undefined);
    return result;
  }
  let result: T | undefined;
  const el = element(doc, 'Link', {});
  innermost(state).add(el);
  state.leaf = true;
  state.artifact = false;
  try {
    el.add(() => { result = draw(); });
  } finally {
    state.leaf = false;
  }
  annotate(el);
  el.end();
  openArtifact(doc, state);
  return result as T;
}

/** A container: elements tagged inside `build` are its children. */
export function group<T>(doc: PDFKit.PDFDocument, type: TagType, options: TagOptions, build: () => T): T {
  const state = states.get(doc);
  if (!state || state.leaf || state.decor > 0) return build();
  const el = element(doc, type, options);
  innermost(state).add(el);
  return within(doc, el, build);
}

/** Runs `build` with `el` (made earlier, e.g. by `sections`) as the parent of what it tags. */
export function within<T>(doc: PDFKit.PDFDocument, el: PDFKit.PDFStructureElement | null, build: () => T): T {
  const state = states.get(doc);
  if (!state || !el) return build();
  state.parents.push(el);
  try {
    return build();
  } finally {
    state.parents.pop();
  }
}

/** Empty section elements in reading order, to be filled later in any order (null when untagged). */
export function sections(doc: PDFKit.PDFDocument, titles: (string | undefined)[]): (PDFKit.PDFStructureElement | null)[] {
  const state = states.get(doc);
  if (!state) return titles.map(() => null);
  return titles.map((title) => {
    const el = element(doc, 'Sect', title ? { title } : {});
    innermost(state).add(el);
    return el;
  });
}

/** Content that is decoration whatever surrounds it (a running foot, a key's sample mark). */
export function artifact<T>(doc: PDFKit.PDFDocument, draw: () => T): T {
  const state = states.get(doc);
  if (!state || state.leaf) return draw();
  openArtifact(doc, state);
  state.decor++;
  try {
    return draw();
  } finally {
    state.decor--;
  }
}
