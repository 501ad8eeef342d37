/**
 * Text made safe inside HTML elements and quoted attributes. Five characters are all our
 * templates need (they never write into scripts, styles or URLs), so no package is pulled in.
 * @param value - any text
 * @returns the text with & < > " ' replaced by character references
 */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
