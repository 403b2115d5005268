/** Pure figure and page renderers: data in, SVG or HTML text out. */
export { renderBodePlot, type BodeInput, type BodeFigureOptions } from './bode-figure.js';
export { renderNyquistPlot, type NyquistInput, type NyquistFigureOptions } from './nyquist-figure.js';
export { renderStepPlot, type StepPlotOptions } from './step-plot.js';
export { renderReportPage } from './report/report-page.js';
export { OKABE_ITO, SERIES_STYLE } from './style/palette.js';
