/**
 * The plots' own look: white paper, a thin dark frame with outward ticks,
 * faint dotted guides only at major ticks, text in the reader's sans-serif,
 * and curves distinguished by colour (Okabe–Ito) and by dash pattern, so a
 * figure survives grey-scale printing. Selectors are scoped to
 * `.loopgate-plot` so several inline figures can share one HTML page.
 * (No '<' or '&' here: this text goes into an SVG <style> element verbatim.)
 */
import { OKABE_ITO, SERIES_STYLE } from './palette.js';

const series = Object.entries(SERIES_STYLE)
  .map(([name, s]) => `.loopgate-plot .series-${name}{stroke:${s.colour};${s.dash ? `stroke-dasharray:${s.dash};` : ''}}`)
  .join('');

export const PLOT_STYLESHEET =
  '.loopgate-plot{font-family:system-ui,"Segoe UI",Helvetica,Arial,sans-serif;font-size:12px;}' +
  '.loopgate-plot .background{fill:#ffffff;}' +
  '.loopgate-plot .frame{fill:none;stroke:#222222;stroke-width:1;}' +
  '.loopgate-plot .tick{stroke:#222222;stroke-width:1;}' +
  '.loopgate-plot .tick.minor{stroke-width:0.6;}' +
  '.loopgate-plot .guide{fill:none;stroke:#9a9a9a;stroke-width:0.5;stroke-dasharray:1 3;}' +
  '.loopgate-plot .reference{stroke:#555555;stroke-width:0.8;stroke-dasharray:6 3;fill:none;}' +
  '.loopgate-plot .tick-label{fill:#222222;font-size:11px;}' +
  '.loopgate-plot .axis-title{fill:#111111;font-size:12px;}' +
  '.loopgate-plot .plot-title{fill:#111111;font-size:14px;font-weight:600;}' +
  '.loopgate-plot .note{fill:#444444;font-size:11px;font-style:italic;}' +
  '.loopgate-plot .curve{fill:none;stroke-width:1.8;stroke-linejoin:round;stroke-linecap:round;}' +
  '.loopgate-plot .curve.mirror{stroke-width:0.9;opacity:0.55;}' +
  `.loopgate-plot .mark{stroke:${OKABE_ITO.reddishPurple};stroke-width:1.2;fill:none;}` +
  `.loopgate-plot .mark-dot{fill:${OKABE_ITO.reddishPurple};stroke:#ffffff;stroke-width:0.8;}` +
  '.loopgate-plot .mark-label{fill:#1a1a1a;font-size:11px;font-weight:600;paint-order:stroke;stroke:#ffffff;stroke-width:3px;}' +
  `.loopgate-plot .critical{stroke:${OKABE_ITO.black};stroke-width:1.6;}` +
  `.loopgate-plot .arrow{stroke:none;}` +
  '.loopgate-plot .band{fill:#e8e8e8;stroke:none;}' +
  '.loopgate-plot .legend-label{fill:#222222;font-size:11px;}' +
  '.loopgate-plot .inset-frame{fill:#ffffff;stroke:#222222;stroke-width:0.8;}' +
  series;
