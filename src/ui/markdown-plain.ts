/**
 * Plain text from text whose user-given parts were escaped for Markdown by the core's escapeMarkdown
 * (a backslash before \ ` * _ { } [ ] ( ) ! ~ | #, and the entities &amp; &lt; &gt; &quot; &#39;), so that a
 * sentence written for the Markdown report reads as given on the page (lit renders text, never markup).
 * One pass, so an id that itself contains "&amp;" comes back unchanged.
 */
export function plainFromMarkdown(s: string): string {
  const ent: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" };
  return s.replace(/\\([\\`*_{}[\]()!~|#])|&(amp|lt|gt|quot|#39);/g, (_, c: string | undefined, e: string | undefined) => c ?? ent[e!]);
}
