const ENTITIES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Escapes text for HTML and inline SVG, in element content and in quoted attribute values alike.
 * @example escapeHtml('<b class="x">&</b>') // '&lt;b class=&quot;x&quot;&gt;&amp;&lt;/b&gt;'
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c] ?? c);
}
