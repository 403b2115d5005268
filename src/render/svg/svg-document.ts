/**
 * The outer <svg> of every plot: size, accessible title and description,
 * the shared stylesheet, and a white background so the figure prints and
 * pastes the same on any page.
 */
import { element } from './element.js';
import { escapeXml } from './escape-xml.js';
import { PLOT_STYLESHEET } from '../style/plot-stylesheet.js';

export interface SvgDocumentOptions {
  width: number;
  height: number;
  /** Prefix for ids inside this figure, so several figures can share one HTML page. */
  idPrefix: string;
  title: string;
  description: string;
  /** A class on the root naming the kind of plot (bode, nyquist, step). */
  kind: string;
}

export function svgDocument(o: SvgDocumentOptions, body: string[]): string {
  return element(
    'svg',
    {
      xmlns: 'http://www.w3.org/2000/svg',
      width: o.width,
      height: o.height,
      viewBox: `0 0 ${o.width} ${o.height}`,
      role: 'img',
      'aria-labelledby': `${o.idPrefix}title ${o.idPrefix}desc`,
      class: `loopgate-plot loopgate-${o.kind}`,
      'data-plot': o.kind,
    },
    [
      element('title', { id: `${o.idPrefix}title` }, escapeXml(o.title)),
      element('desc', { id: `${o.idPrefix}desc` }, escapeXml(o.description)),
      element('style', {}, PLOT_STYLESHEET),
      element('rect', { class: 'background', x: 0, y: 0, width: o.width, height: o.height }),
      ...body,
    ],
  );
}

