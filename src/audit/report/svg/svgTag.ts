import { escapeHtml } from '../escapeHtml.js';

/** Attribute values for {@link svgTag}; `undefined` leaves the attribute out. */
export type SvgAttributes = Record<string, string | number | undefined>;

/** A coordinate rounded to two decimals, without trailing zeros, for compact SVG. */
export function px(value: number): string {
  return String(Math.round(value * 100) / 100);
}

/**
 * One SVG (or HTML) element; attribute values are escaped, numbers rounded, `content` is inserted as is.
 * @example svgTag('rect', { x: 1, width: 2.345 }) // '<rect x="1" width="2.35"/>'
 */
export function svgTag(name: string, attributes: SvgAttributes, content?: string): string {
  let attrs = '';
  for (const [key, value] of Object.entries(attributes)) {
    if (value === undefined) continue;
    attrs += ` ${key}="${typeof value === 'number' ? px(value) : escapeHtml(value)}"`;
  }
  return content === undefined ? `<${name}${attrs}/>` : `<${name}${attrs}>${content}</${name}>`;
}

/** A `<text>` element whose text is escaped. */
export function svgText(attributes: SvgAttributes, text: string): string {
  return svgTag('text', attributes, escapeHtml(text));
}
