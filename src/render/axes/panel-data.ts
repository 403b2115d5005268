/**
 * Data attributes that record how a panel maps data to the screen, so a
 * test or the page can turn a drawn curve back into numbers and compare them
 * with the API's (the figure is checked against the data, not against itself).
 */
import type { Panel } from './panel.js';
import type { Scale } from './scale.js';

export function panelDataAttributes(role: string, panel: Panel, x: Scale, y: Scale): Record<string, string> {
  return {
    'data-panel': role,
    'data-rect': `${panel.left} ${panel.top} ${panel.width} ${panel.height}`,
    'data-x': `${x.kind} ${x.domain[0]} ${x.domain[1]}`,
    'data-y': `${y.kind} ${y.domain[0]} ${y.domain[1]}`,
  };
}
