/**
 * Value labels beside marks, placed so that they neither overlap one another
 * nor leave their panel: each label tries a few positions around its point
 * (right above, right below, left above, left below, then further out) and
 * takes the first free one. The text carries a white halo (CSS paint-order)
 * so it stays legible over guides and curves.
 */
import { textElement } from './svg/element.js';

/** Average advance of an 11 px sans-serif character, for a width estimate. */
const CHAR_WIDTH = 6.6;
const LINE_HEIGHT = 13;

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface Bounds {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

const CANDIDATES: readonly [number, number, 'start' | 'end'][] = [
  [8, -8, 'start'],
  [8, 16, 'start'],
  [-8, -8, 'end'],
  [-8, 16, 'end'],
  [8, -24, 'start'],
  [8, 32, 'start'],
  [-8, -24, 'end'],
  [-8, 32, 'end'],
  [8, -40, 'start'],
  [-8, 48, 'end'],
];

export class LabelPlacer {
  private readonly boxes: Box[] = [];

  /** Reserves an area (a legend, a note) that labels must avoid. */
  reserve(box: Box): void {
    this.boxes.push(box);
  }

  /**
   * The label as an SVG text element at the first free position around
   * (x, y); when none is free, `required` labels take the first position
   * inside the bounds anyway and optional ones are dropped ('' returned).
   */
  place(text: string, x: number, y: number, bounds: Bounds, mark: string, required = true): string {
    const width = text.length * CHAR_WIDTH;
    let fallback: { tx: number; ty: number; anchor: 'start' | 'end'; box: Box } | null = null;
    for (const [dx, dy, anchor] of CANDIDATES) {
      const tx = x + dx;
      const ty = y + dy;
      const box: Box = anchor === 'start' ? { x0: tx, y0: ty - LINE_HEIGHT + 3, x1: tx + width, y1: ty + 3 } : { x0: tx - width, y0: ty - LINE_HEIGHT + 3, x1: tx, y1: ty + 3 };
      const inside = box.x0 >= bounds.left + 2 && box.x1 <= bounds.right - 2 && box.y0 >= bounds.top + 2 && box.y1 <= bounds.bottom - 2;
      if (!inside) continue;
      fallback ??= { tx, ty, anchor, box };
      if (this.boxes.every((b) => !overlaps(b, box))) {
        this.boxes.push(box);
        return textElement(text, { class: 'mark-label', 'data-mark': mark, x: tx, y: ty, 'text-anchor': anchor });
      }
    }
    if (!required) return '';
    const f = fallback ?? { tx: Math.max(bounds.left + 2, Math.min(x + 8, bounds.right - width - 2)), ty: y - 14, anchor: 'start' as const, box: { x0: 0, y0: 0, x1: 0, y1: 0 } };
    this.boxes.push(f.box);
    return textElement(text, { class: 'mark-label', 'data-mark': mark, x: f.tx, y: f.ty, 'text-anchor': f.anchor });
  }
}

function overlaps(a: Box, b: Box): boolean {
  return a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
}
