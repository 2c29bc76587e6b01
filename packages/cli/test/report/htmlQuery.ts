// Minimal queries over the report's own markup (no DOM library in the workspace): the renderer
// writes every element on one tag with double-quoted attributes, which these rely on.

/** The text of the `<svg data-plot="kind">…</svg>` elements, in document order. */
export function plots(html: string, kind: string): string[] {
  const out: string[] = [];
  const re = new RegExp(`<svg [^>]*data-plot="${kind}"[^>]*>[\\s\\S]*?</svg>`, 'g');
  for (const m of html.matchAll(re)) out.push(m[0]);
  return out;
}

/** The attributes of every `<tag …>` whose class list holds `className`. */
export function elements(html: string, tag: string, className: string): Array<Record<string, string>> {
  const out: Array<Record<string, string>> = [];
  for (const m of html.matchAll(new RegExp(`<${tag}\\s([^>]*)>`, 'g'))) {
    const attributes: Record<string, string> = {};
    for (const a of m[1].matchAll(/([\w:-]+)="([^"]*)"/g)) attributes[a[1]] = a[2];
    if ((attributes.class ?? '').split(/\s+/).includes(className)) out.push(attributes);
  }
  return out;
}

/** The sections of the report's channels, in order. */
export function channelSections(html: string): string[] {
  return [...html.matchAll(/<section class="channel"[\s\S]*?<\/section>/g)].map((m) => m[0]);
}
