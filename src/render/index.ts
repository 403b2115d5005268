/** Pure figure and page renderers: data in, SVG or HTML text out. */
export { renderBodePlot, type BodeInput, type BodeOptions } from './bode-plot.js';
export { renderNyquistPlot, type NyquistInput, type NyquistOptions } from './nyquist-plot.js';
export { renderStepPlot, type StepPlotOptions } from './step-plot.js';
export { renderReportPage } from './report/report-page.js';
export { OKABE_ITO, SERIES_STYLE } from './style/palette.js';
