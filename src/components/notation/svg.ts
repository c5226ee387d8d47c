const SVG_NS = 'http://www.w3.org/2000/svg';

/** Adds an SVG element with the attributes given (numbers rounded to a tenth of a pixel). */
export function svgEl<K extends keyof SVGElementTagNameMap>(
  parent: Element,
  tag: K,
  attrs: Record<string, string | number>,
  text?: string,
): SVGElementTagNameMap[K] {
  const el = document.createElementNS(SVG_NS, tag);
  for (const [k, v] of Object.entries(attrs))
    el.setAttribute(k, typeof v === 'number' ? String(Math.round(v * 10) / 10) : v);
  if (text !== undefined) el.textContent = text;
  parent.appendChild(el);
  return el;
}
