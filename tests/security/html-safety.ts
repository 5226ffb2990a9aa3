/**
 * What "no script, no remote content" means for an HTML string we produce. The SVG namespace
 * attribute is an identifier that nothing fetches, so it is the one http URL allowed.
 */
const SVG_NAMESPACE = /xmlns="http:\/\/www\.w3\.org\/2000\/svg"/g;

/** Problems found in `html`: script elements, event handlers, javascript: URLs, attributes or CSS that load a URL. */
export function unsafeHtmlParts(html: string): string[] {
  const text = html.replace(SVG_NAMESPACE, '');
  const problems: string[] = [];
  if (/<script\b/i.test(text)) problems.push('a <script> element');
  if (/<[^>]+\son[a-z]+\s*=/i.test(text)) problems.push('an event-handler attribute');
  if (/javascript:/i.test(text)) problems.push('a javascript: URL');
  // A URL in text content (e.g. the netlist quoted in a report) is inert; in an attribute or CSS it loads.
  for (const m of text.matchAll(/\b(?:src|href|action|srcset|poster|data|xlink:href)\s*=\s*["']?\s*(?:[a-z][a-z0-9+.-]*:|\/\/)[^"'\s>]*/gi)) {
    if (!/^[^=]+=\s*["']?\s*data:/i.test(m[0])) problems.push(`a loading attribute ${m[0]}`);
  }
  if (/url\(\s*["']?\s*(?!data:)[a-z][a-z0-9+.-]*:|url\(\s*["']?\s*\/\/|@import/i.test(text)) problems.push('a CSS reference to another resource');
  if (/<(?:iframe|object|embed|link|base)\b/i.test(text)) problems.push('an embedding or linking element');
  return problems;
}
