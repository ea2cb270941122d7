// Every text that reaches the report (file names, station names, numbers) goes through here.

const ENTITIES: ReadonlyMap<string, string> = new Map([['&', '&amp;'], ['<', '&lt;'], ['>', '&gt;'], ['"', '&quot;'], ["'", '&#39;']]);

/** Text safe inside HTML elements and double- or single-quoted attributes. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES.get(c) ?? c);
}
