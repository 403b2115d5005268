/**
 * A tiny SVG/XML string builder: `element('line', {x1: 0, ...})`. Attribute
 * values are escaped; children are already-built strings. Numbers are
 * written with at most 2 decimals (a hundredth of a pixel is plenty) so the
 * documents stay small.
 */
import { escapeXml } from './escape-xml.js';

export type AttributeValue = string | number | boolean | null | undefined;
export type Attributes = Record<string, AttributeValue>;

/** A coordinate or length in user units, rounded to 0.01. */
export function px(value: number): string {
  const r = Math.round(value * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
}

function attributeText(attrs: Attributes): string {
  let out = '';
  for (const [name, value] of Object.entries(attrs)) {
    if (value === null || value === undefined || value === false) continue;
    const text = value === true ? name : typeof value === 'number' ? px(value) : value;
    out += ` ${name}="${escapeXml(text)}"`;
  }
  return out;
}

export function element(name: string, attrs: Attributes = {}, children: string | string[] = []): string {
  const inner = Array.isArray(children) ? children.join('') : children;
  return inner === '' ? `<${name}${attributeText(attrs)}/>` : `<${name}${attributeText(attrs)}>${inner}</${name}>`;
}

/** A text element whose content is escaped. */
export function textElement(content: string, attrs: Attributes = {}): string {
  return element('text', attrs, escapeXml(content));
}
