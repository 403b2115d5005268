/**
 * Test helpers: parse an SVG (or XHTML fragment) with fast-xml-parser — which
 * fails on anything that is not well-formed XML — and find elements by
 * name and attribute; turn a drawn path back into data through the
 * panel's recorded mapping.
 */
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { parsePolylinePath } from '../../../src/render/svg/path-data.js';

export interface XmlNode {
  name: string;
  attrs: Record<string, string>;
  children: XmlNode[];
  text: string;
}

export function parseXml(xml: string): XmlNode {
  const valid = XMLValidator.validate(xml);
  if (valid !== true) throw new Error(`not well-formed XML: ${JSON.stringify(valid.err)}`);
  const parser = new XMLParser({ preserveOrder: true, ignoreAttributes: false, attributeNamePrefix: '', trimValues: false });
  const tree = parser.parse(xml) as unknown[];
  const roots = tree.map(toNode).filter((n): n is XmlNode => n !== null);
  return { name: '#document', attrs: {}, children: roots, text: '' };
}

function toNode(raw: unknown): XmlNode | null {
  const o = raw as Record<string, unknown>;
  const name = Object.keys(o).find((k) => k !== ':@');
  if (!name || name === '?xml') return null;
  if (name === '#text') return { name, attrs: {}, children: [], text: String(o[name]) };
  const attrs = (o[':@'] ?? {}) as Record<string, string>;
  const children = ((o[name] as unknown[]) ?? []).map(toNode).filter((n): n is XmlNode => n !== null);
  return { name, attrs, children, text: '' };
}

export function findAll(node: XmlNode, test: (n: XmlNode) => boolean, out: XmlNode[] = []): XmlNode[] {
  if (test(node)) out.push(node);
  for (const c of node.children) findAll(c, test, out);
  return out;
}

export const byAttr = (name: string, value: string) => (n: XmlNode) => n.attrs[name] === value;

export function textOf(node: XmlNode): string {
  return node.name === '#text' ? node.text : node.children.map(textOf).join('');
}

export function allText(node: XmlNode): string[] {
  return findAll(node, (n) => n.name === 'text').map(textOf);
}

/** The drawn points of a curve mapped back to data through its panel's data-x/data-y/data-rect attributes. */
export function curveData(panel: XmlNode, curve: XmlNode): { x: number; y: number }[] {
  const [left, top, width, height] = panel.attrs['data-rect'].split(' ').map(Number);
  const [xKind, x0, x1] = panel.attrs['data-x'].split(' ');
  const [yKind, y0, y1] = panel.attrs['data-y'].split(' ');
  const inv = (kind: string, d0: number, d1: number, r0: number, r1: number, s: number) => {
    if (kind === 'log') return Math.pow(10, Math.log10(d0) + ((s - r0) / (r1 - r0)) * (Math.log10(d1) - Math.log10(d0)));
    return d0 + ((s - r0) / (r1 - r0)) * (d1 - d0);
  };
  return parsePolylinePath(curve.attrs.d)
    .flat()
    .map((p) => ({
      x: inv(xKind, Number(x0), Number(x1), left, left + width, p.x),
      y: inv(yKind, Number(y0), Number(y1), top + height, top, p.y),
    }));
}
