/**
 * The design-review report as one self-contained HTML page: inline CSS and
 * inline SVG, no scripts, fonts or images from elsewhere, so it can be
 * archived with a review record and opened anywhere. Every figure cell
 * carries the API's number in `data-value`, so a reader (or a test) can
 * check the page against POST /v1/analyses.
 */
import type { FigureRow, Mark, ReportModel } from '../../contract/report-model.js';
import { renderBodePlot } from '../bode-figure.js';
import { formatNumber } from '../format-number.js';
import { escapeXml } from '../svg/escape-xml.js';
import { renderNyquistPlot } from '../nyquist-figure.js';
import { renderStepPlot } from '../step-plot.js';
import { describeController, describePlant } from './describe-loop.js';
import { REPORT_STYLESHEET } from './report-styles.js';

const MARK_TEXT: Record<Mark, string> = { pass: '✓ pass', warn: '! warn', fail: '✗ fail', none: '—' };

const esc = escapeXml;

function markCell(mark: Mark): string {
  return `<span class="mark mark-${mark}" data-mark="${mark}">${MARK_TEXT[mark]}</span>`;
}

function figureRow(r: FigureRow, withCriteria: boolean): string {
  const value = r.value === null ? '' : String(r.value);
  const cells = [
    `<th scope="row">${esc(r.name)}</th>`,
    `<td class="value" data-figure="${esc(r.key)}" data-value="${esc(value)}">${esc(r.text)}</td>`,
  ];
  if (withCriteria) cells.push(`<td class="limit">${esc(r.limit)}</td>`, `<td>${markCell(r.mark)}</td>`, `<td class="source">${esc(r.source)}</td>`);
  return `<tr data-row="${esc(r.key)}">${cells.join('')}</tr>`;
}

function table(rows: readonly FigureRow[], withCriteria: boolean, id: string): string {
  const head = withCriteria
    ? '<tr><th scope="col">Figure</th><th scope="col">Value</th><th scope="col">Criterion</th><th scope="col">Mark</th><th scope="col">Source of the limit</th></tr>'
    : '<tr><th scope="col">Figure</th><th scope="col">Value</th></tr>';
  return `<table id="${id}"><thead>${head}</thead><tbody>${rows.map((r) => figureRow(r, withCriteria)).join('')}</tbody></table>`;
}

function figure(id: string, svg: string, caption: string): string {
  return `<figure id="${id}">${svg}<figcaption>${esc(caption)}</figcaption></figure>`;
}

export function renderReportPage(model: ReportModel, options: { version: string; caution: string }): string {
  const a = model.analysis;
  const plots: string[] = [
    figure('figure-bode', renderBodePlot(a, { idPrefix: 'bode-' }), 'Bode diagram of L with |S| and |T|: crossovers, margins and peaks marked with their values.'),
    figure('figure-nyquist', renderNyquistPlot(a, { idPrefix: 'nyquist-' }), 'Nyquist diagram near −1 with the unit circle and the circle of radius 1/Ms; overview of the whole curve beside it.'),
  ];
  if (a.timeResponse) {
    plots.push(figure('figure-step', renderStepPlot(a.timeResponse, { idPrefix: 'step-' }), `Closed-loop responses to unit steps. Method: ${a.timeResponse.method}.`));
  } else {
    plots.push(`<p class="unavailable" id="figure-step-unavailable">Time responses: ${esc(model.timeResponseUnavailable ?? 'not computed for this loop.')}</p>`);
  }
  const warnings = a.warnings.length
    ? `<ul class="warnings">${a.warnings
        .map((w) => `<li data-warning="${esc(w.code)}"><code>${esc(w.code)}</code>: ${esc(w.message)}${w.value !== null ? ` (value ${esc(String(w.value))}${w.limit !== null ? `, limit ${esc(String(w.limit))}` : ''})` : ''} <span class="source">Source: ${esc(w.source)}.</span></li>`)
        .join('')}</ul>`
    : '<p>The analysis raised no warnings.</p>';
  const verdictText = { pass: 'passes', warn: 'passes with warnings', fail: 'fails' }[model.verdict];
  const body = `
<main class="loopgate-report" data-verdict="${model.verdict}" data-request-hash="${esc(a.requestHash)}">
<header>
<h1>${esc(model.title)}</h1>
<p class="meta">loopgate ${esc(options.version)} · request hash <code data-field="requestHash">${esc(a.requestHash)}</code></p>
<p class="verdict">${markCell(model.verdict)} The loop ${verdictText} the <strong>${esc(model.profile)}</strong> criteria profile.</p>
</header>
<section id="loop"><h2>The loop</h2>
<table><tbody>
<tr><th scope="row">Plant</th><td data-field="plant">${esc(describePlant(model.request.plant))}</td></tr>
<tr><th scope="row">Controller</th><td data-field="controller">${esc(describeController(model.request.controller))}</td></tr>
<tr><th scope="row">Analysis grid</th><td>${a.grid.points} points from ${esc(formatNumber(a.grid.min))} to ${esc(formatNumber(a.grid.max))} rad/s; Nyquist sweep to ${esc(formatNumber(a.stability.nyquist.sweepTo))} rad/s</td></tr>
</tbody></table>
<details><summary>The request as analysed (JSON)</summary><pre>${esc(JSON.stringify(model.request, null, 2))}</pre></details>
</section>
<section id="figures"><h2>Figures against the criteria</h2>
${table(model.criteriaRows, true, 'criteria-table')}
<h3>Other figures</h3>
${table(model.otherRows, false, 'other-table')}
${model.timeRows.length ? `<h3>Time responses</h3>${table(model.timeRows, false, 'time-table')}` : ''}
</section>
<section id="plots"><h2>Plots</h2>
${plots.join('\n')}
</section>
<section id="warnings"><h2>Warnings</h2>
${warnings}
</section>
<section id="safety"><h2>Safety caution</h2>
<p class="caution" data-field="caution">${esc(options.caution)}</p>
</section>
<footer><p class="meta">Generated by loopgate ${esc(options.version)} from the request with hash ${esc(a.requestHash)}. Figures are those of POST /v1/analyses for the same request.</p></footer>
</main>`;
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8"/>
<meta name="viewport" content="width=device-width, initial-scale=1"/>
<title>${esc(model.title)} — loopgate report</title>
<style>${REPORT_STYLESHEET}</style>
</head>
<body>${body}
</body>
</html>
`;
}
