/**
 * GET /: a small page where a person pastes or uploads an analysis request
 * (JSON) or picks a bottling-plant demo loop, and sees the review report.
 * It calls the same API as every other client (POST v1/reports).
 */
import type { DemoLoop } from '../../demo/bottling-plant.js';
import { escapeXml } from '../svg/escape-xml.js';
import { REVIEW_PAGE_SCRIPT } from './review-page-script.js';

const PAGE_STYLES = `
body{margin:0;background:#fff;color:#1a1a1a;font:15px/1.5 system-ui,"Segoe UI",Helvetica,Arial,sans-serif;}
.page{max-width:900px;margin:0 auto;padding:20px;}
h1{font-size:24px;margin:0 0 4px;}
label{font-weight:600;}
textarea{width:100%;box-sizing:border-box;min-height:16em;font:13px/1.4 ui-monospace,Menlo,Consolas,monospace;border:1px solid #888;padding:8px;}
.controls{display:flex;flex-wrap:wrap;gap:10px;align-items:center;margin:10px 0;}
button{font:inherit;padding:5px 14px;border:1.5px solid #1a1a1a;background:#fff;border-radius:3px;cursor:pointer;}
button.primary{background:#1a1a1a;color:#fff;}
#status{margin:8px 0;font-weight:600;}
#status[data-state=error]{color:#b34a00;}
#error{white-space:pre-wrap;border-left:4px solid #D55E00;padding:8px;}
iframe{width:100%;min-height:600px;border:1px solid #bbb;margin-top:12px;}
.hint{color:#444;font-size:13px;}
`;

/** JSON inside <script type="application/json">: '<' escaped so no '</script>' can close it early. */
const safeJson = (value: unknown) => JSON.stringify(value).replace(/</g, '\\u003c');

export function renderReviewPage(demos: readonly DemoLoop[], version: string): string {
  const options = demos.map((d) => `<option value="${escapeXml(d.id)}">${escapeXml(d.title)}</option>`).join('');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8"/>
<meta name="viewport" content="width=device-width, initial-scale=1"/>
<title>loopgate — loop review</title>
<style>${PAGE_STYLES}</style>
</head>
<body>
<div class="page">
<h1>loopgate loop review</h1>
<p class="hint">Paste or upload an analysis request (the JSON body of POST /v1/analyses), or start from a demo loop of the bottling plant, then make the report. loopgate ${escapeXml(version)}.</p>
<form id="review-form">
<div class="controls">
<label for="demo">Demo loop</label>
<select id="demo">${options}</select>
<button type="button" id="load-demo">Load demo</button>
<label for="file">or a file</label>
<input type="file" id="file" accept="application/json,.json"/>
</div>
<p class="hint" id="demo-description"></p>
<label for="request">Request (JSON)</label>
<textarea id="request" spellcheck="false" autocomplete="off"></textarea>
<div class="controls">
<button type="submit" class="primary" id="make-report">Make report</button>
<a id="download" download="loopgate-report.html" hidden>Download the report (HTML)</a>
</div>
</form>
<p id="status" role="status" data-state="idle"></p>
<pre id="error" role="alert" hidden></pre>
<iframe id="report" title="Review report" sandbox="allow-same-origin"></iframe>
</div>
<script type="application/json" id="demo-data">${safeJson(demos)}</script>
<script>${REVIEW_PAGE_SCRIPT}</script>
</body>
</html>
`;
}
