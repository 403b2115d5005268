/**
 * The report's stylesheet: a single readable column, print-friendly (no
 * backgrounds needed to read it, page breaks kept out of figures), and
 * marks that differ in shape and word as well as colour (✓ pass, ! warn,
 * ✗ fail), so they survive grey-scale print and colour-vision deficiency.
 */
import { OKABE_ITO } from '../style/palette.js';

export const REPORT_STYLESHEET = `
:root{color-scheme:light;}
body{margin:0;background:#ffffff;color:#1a1a1a;font:15px/1.5 system-ui,"Segoe UI",Helvetica,Arial,sans-serif;}
.loopgate-report{max-width:860px;margin:0 auto;padding:24px 20px 48px;}
.loopgate-report h1{font-size:26px;margin:0 0 4px;}
.loopgate-report h2{font-size:19px;margin:32px 0 8px;padding-bottom:4px;border-bottom:2px solid #1a1a1a;}
.loopgate-report .meta{color:#444;font-size:13px;margin:0;}
.loopgate-report code,.loopgate-report pre{font-family:ui-monospace,"SFMono-Regular",Menlo,Consolas,monospace;font-size:13px;}
.loopgate-report pre{white-space:pre-wrap;word-break:break-word;border:1px solid #bbb;padding:8px;max-height:24em;overflow:auto;}
.loopgate-report table{border-collapse:collapse;width:100%;font-size:14px;}
.loopgate-report th,.loopgate-report td{text-align:left;vertical-align:top;padding:6px 8px;border-bottom:1px solid #cfcfcf;}
.loopgate-report th{font-weight:600;}
.loopgate-report thead th{border-bottom:1.5px solid #1a1a1a;}
.loopgate-report td.source{font-size:12px;color:#444;}
.loopgate-report .mark{display:inline-block;min-width:4.2em;font-weight:700;border:1.5px solid currentColor;border-radius:3px;padding:0 5px;text-align:center;}
.loopgate-report .mark-pass{color:${OKABE_ITO.bluishGreen};}
.loopgate-report .mark-warn{color:#8a5a00;}
.loopgate-report .mark-fail{color:${OKABE_ITO.vermillion};}
.loopgate-report .mark-none{color:#666;border-style:dotted;}
.loopgate-report .verdict{font-size:18px;margin:12px 0;}
.loopgate-report figure{margin:16px 0;break-inside:avoid;page-break-inside:avoid;}
.loopgate-report figure svg{max-width:100%;height:auto;}
.loopgate-report figcaption{font-size:13px;color:#333;}
.loopgate-report .caution{border-left:4px solid #1a1a1a;padding:8px 12px;}
.loopgate-report ul.warnings li{margin-bottom:8px;}
.loopgate-report .unavailable{font-style:italic;color:#444;}
@media print{.loopgate-report{max-width:none;padding:0;}.loopgate-report h2{break-after:avoid;}}
`;
