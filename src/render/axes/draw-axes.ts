/**
 * Frame, outward ticks, tick labels, faint guides at major ticks and axis
 * titles for one panel. Ticks point outward so they never cover a curve.
 */
import { element, textElement } from '../svg/element.js';
import type { Panel } from './panel.js';
import { panelBottom, panelRight } from './panel.js';
import type { Scale } from './scale.js';

export interface AxisSpec {
  scale: Scale;
  major: readonly number[];
  minor?: readonly number[];
  /** Label for a major tick value; omit labels by returning ''. */
  label: (value: number) => string;
  title?: string;
  /** Draw dotted guides across the panel at major ticks (default true). */
  guides?: boolean;
}

const TICK = 5;
const MINOR_TICK = 3;

export function drawAxes(panel: Panel, x: AxisSpec, y: AxisSpec, role: string): string {
  const out: string[] = [];
  const bottom = panelBottom(panel);
  const right = panelRight(panel);
  const inside = (v: number, a: number, b: number) => v >= Math.min(a, b) - 0.5 && v <= Math.max(a, b) + 0.5;
  for (const v of x.major) {
    const sx = x.scale(v);
    if (!inside(sx, panel.left, right)) continue;
    if (x.guides !== false) out.push(element('line', { class: 'guide', x1: sx, y1: panel.top, x2: sx, y2: bottom }));
    out.push(element('line', { class: 'tick', x1: sx, y1: bottom, x2: sx, y2: bottom + TICK }));
    const text = x.label(v);
    if (text) out.push(textElement(text, { class: 'tick-label', x: sx, y: bottom + TICK + 12, 'text-anchor': 'middle' }));
  }
  for (const v of x.minor ?? []) {
    const sx = x.scale(v);
    if (inside(sx, panel.left, right)) out.push(element('line', { class: 'tick minor', x1: sx, y1: bottom, x2: sx, y2: bottom + MINOR_TICK }));
  }
  for (const v of y.major) {
    const sy = y.scale(v);
    if (!inside(sy, panel.top, bottom)) continue;
    if (y.guides !== false) out.push(element('line', { class: 'guide', x1: panel.left, y1: sy, x2: right, y2: sy }));
    out.push(element('line', { class: 'tick', x1: panel.left - TICK, y1: sy, x2: panel.left, y2: sy }));
    const text = y.label(v);
    if (text) out.push(textElement(text, { class: 'tick-label', x: panel.left - TICK - 3, y: sy + 4, 'text-anchor': 'end' }));
  }
  for (const v of y.minor ?? []) {
    const sy = y.scale(v);
    if (inside(sy, panel.top, bottom)) out.push(element('line', { class: 'tick minor', x1: panel.left - MINOR_TICK, y1: sy, x2: panel.left, y2: sy }));
  }
  out.push(element('rect', { class: 'frame', x: panel.left, y: panel.top, width: panel.width, height: panel.height }));
  if (x.title) {
    out.push(textElement(x.title, { class: 'axis-title', x: panel.left + panel.width / 2, y: bottom + TICK + 30, 'text-anchor': 'middle' }));
  }
  if (y.title) {
    const cx = panel.left - 48;
    const cy = panel.top + panel.height / 2;
    out.push(textElement(y.title, { class: 'axis-title', x: cx, y: cy, 'text-anchor': 'middle', transform: `rotate(-90 ${cx} ${cy})` }));
  }
  return element('g', { class: 'axes', 'data-axes': role }, out);
}
