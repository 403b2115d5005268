import { describe, expect, it } from 'vitest';
import { LabelPlacer } from '../../src/render/marks.js';
import { parseXml } from './support/svg-tree.js';

const bounds = { left: 0, right: 400, top: 0, bottom: 200 };
const boxOf = (xml: string) => {
  const t = parseXml(xml).children[0];
  const x = Number(t.attrs.x);
  const y = Number(t.attrs.y);
  const w = t.children[0].text.length * 6.6;
  return t.attrs['text-anchor'] === 'end' ? { x0: x - w, x1: x, y0: y - 10, y1: y + 3 } : { x0: x, x1: x + w, y0: y - 10, y1: y + 3 };
};

describe('LabelPlacer', () => {
  it('places labels at the same point without overlap and inside the bounds', () => {
    const placer = new LabelPlacer();
    const boxes = ['first label', 'second label', 'third label'].map((t) => boxOf(placer.place(t, 200, 100, bounds, 'm')));
    for (const b of boxes) {
      expect(b.x0).toBeGreaterThanOrEqual(0);
      expect(b.x1).toBeLessThanOrEqual(400);
    }
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const [a, b] = [boxes[i], boxes[j]];
        expect(a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1).toBe(false);
      }
    }
  });

  it('turns a label left at the right edge', () => {
    const t = parseXml(new LabelPlacer().place('near the edge', 390, 100, bounds, 'm')).children[0];
    expect(t.attrs['text-anchor']).toBe('end');
  });

  it('drops an optional label with no free place, keeps a required one', () => {
    const placer = new LabelPlacer();
    placer.reserve({ x0: 0, y0: 0, x1: 400, y1: 200 });
    expect(placer.place('optional', 200, 100, bounds, 'm', false)).toBe('');
    expect(placer.place('required', 200, 100, bounds, 'm', true)).toContain('required');
  });
});
