/** A rectangular plotting area in screen units, and the clip path that keeps curves inside it. */
import { element } from '../svg/element.js';

export interface Panel {
  left: number;
  top: number;
  width: number;
  height: number;
}

export const panelRight = (p: Panel) => p.left + p.width;
export const panelBottom = (p: Panel) => p.top + p.height;

export function clipPathFor(id: string, p: Panel): string {
  return element('clipPath', { id }, element('rect', { x: p.left, y: p.top, width: p.width, height: p.height }));
}
